import Link from "next/link";
import { DECISION_CLASS } from "@/components/report/report-parts";
import { RECORDED_DECISION_TEXT } from "@/lib/domain/decisions";
import { Card } from "@/components/ui/card";
import { Table } from "@/components/ui/table";
import { limitSourceWords } from "@/lib/fit-display";
import { endSentence, formatDateTimeUtc } from "@/lib/format";
import type { TcpCheckView, TcpLimits } from "@/lib/tcp-check-display";

/** The job's tool-centre-point checks after compensation: the latest judged in full, earlier ones listed. */
export function TcpCheckCard({
  jobId,
  tcp,
}: {
  jobId: string;
  tcp: {
    limits: TcpLimits;
    /** Where the procedure's limits come from; null when the job has no procedure. */
    source: { source: string | null; note: string | null } | null;
    checks: ReadonlyArray<{ datasetId: string; filename: string; uploadedAt: Date; view: TcpCheckView }>;
  };
}) {
  const [latest, ...earlier] = tcp.checks;
  return (
    <Card title="Tool-centre-point check after compensation">
      <div className="space-y-3 text-sm">
        <p className="text-graphite-700">
          {tcp.limits.required
            ? "The procedure asks for this check before the report is issued."
            : "The procedure does not ask for this check; a check uploaded is still reported."}{" "}
          Probe the reference sphere with the control&apos;s tool-centre-point function on, over the swing of
          both axes, and upload the file on the{" "}
          <Link className="underline" href={`/jobs/${jobId}/data`}>
            Data
          </Link>{" "}
          page as &ldquo;Tool-centre-point check&rdquo; (sphere-probe columns). Move the axes at reduced speed
          and keep clear of the head&apos;s swing.
        </p>
        {latest ? (
          <>
            <p>
              <span className="font-semibold">{latest.filename}</span>, {latest.view.poses} poses, uploaded{" "}
              {formatDateTimeUtc(latest.uploadedAt)}:{" "}
              <span className={`font-semibold ${DECISION_CLASS[latest.view.decision]}`} data-tcp-decision>
                {RECORDED_DECISION_TEXT[latest.view.decision]}
              </span>
            </p>
            <Table
              caption="Tool-centre-point check"
              empty="No figures."
              bare
              data={latest.view.rows}
              getRowId={(r) => r.quantity}
              columns={(column) => [
                column("Figure", (r) => r.quantity, { rowHeader: true }),
                column("Value", (r) => r.valueText, { numeric: true }),
                column("Limit", (r) => r.limitText, { numeric: true }),
                column("Result", (r) => (
                  <span className={DECISION_CLASS[r.decision]}>{RECORDED_DECISION_TEXT[r.decision]}</span>
                )),
              ]}
            />
            {tcp.limits.rangeLimitUm !== null || tcp.limits.deviationLimitUm !== null ? (
              <p className="text-graphite-700" data-tcp-limit-source>
                {endSentence(
                  `Limits from the procedure; source: ${
                    tcp.source?.source
                      ? limitSourceWords(tcp.source.source, tcp.source.note)
                      : "not recorded (the version was saved before sources were asked for)"
                  }`,
                )}
              </p>
            ) : null}
            {earlier.length ? (
              <p className="text-graphite-600">
                Earlier checks (the latest counts):{" "}
                {earlier.map((e) => `${e.filename} (${RECORDED_DECISION_TEXT[e.view.decision]})`).join(", ")}.
              </p>
            ) : null}
          </>
        ) : (
          <p className="text-graphite-600">No tool-centre-point check is stored on this job.</p>
        )}
      </div>
    </Card>
  );
}
