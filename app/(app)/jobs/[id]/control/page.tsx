import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ControlValuesForm } from "@/components/control/control-values-form";
import { ControlValuesLoopTable } from "@/components/control/control-values-table";
import { Card } from "@/components/ui/card";
import { SafetyNote } from "@/components/ui/safety-note";
import { getControlValues, jobTcpChecks } from "@/db/queries/control-values";
import { TcpCheckCard } from "@/components/control/tcp-check-card";
import { getJobDetail } from "@/db/queries/jobs";
import { requirePageUser } from "@/lib/auth/session";
import { CONTROL_CAUTION, fromControlCanonical, SIGN_CONVENTION } from "@/lib/control-values";
import { CONTROL_VALUE_DEFS, type ControlValueKey, type ControlValueSet } from "@/lib/domain/control-values";
import { pageUuid } from "@/lib/domain/uuid";
import { formatDateTimeUtc } from "@/lib/format";
import { controlValuesReadRefusal, controlValuesWriteRefusal } from "@/lib/policy/control-values";

export const metadata: Metadata = { title: "Control values" };
type Props = { params: Promise<{ id: string }> };

/** Values as the control shows them, at full precision, for a form's fields. */
function typed(values: ControlValueSet | undefined, system: "metric" | "inch") {
  const out: Partial<Record<ControlValueKey, string>> = {};
  for (const d of CONTROL_VALUE_DEFS) {
    const v = values?.[d.key];
    if (v !== undefined) out[d.key] = String(Number(fromControlCanonical(v, d.kind, system).toPrecision(12)));
  }
  return out;
}

export default async function ControlPage({ params }: Props) {
  const id = pageUuid((await params).id);
  const user = await requirePageUser(`/jobs/${id}/control`);
  const d = await getJobDetail(user, id);
  if (!d) notFound();
  const readRefusal = controlValuesReadRefusal(user);
  if (readRefusal)
    return (
      <Card title="Control values">
        <p className="text-sm text-graphite-700">{readRefusal}</p>
      </Card>
    );
  const [c, tcp] = await Promise.all([
    getControlValues(user, id).then((x) => x!),
    jobTcpChecks(id, d.job.templateId),
  ]);
  const { loop } = c;
  const system = loop.unitSystem;
  const subject = { status: d.job.status, hasApprovedFit: c.approved !== null };
  const foundRefusal = controlValuesWriteRefusal(user, { ...subject, stage: "as_found" });
  const leftRefusal = controlValuesWriteRefusal(user, { ...subject, stage: "as_left" });
  const hints = Object.fromEntries(
    loop.rows.filter((r) => r.toEnter !== null).map((r) => [r.key, `Value to enter: ${r.toEnterText}`]),
  );

  return (
    <div className="space-y-6">
      <Card title="Control values: as found, to enter, as left">
        <div className="space-y-4">
          <p className="text-sm text-graphite-700">
            {c.approved ? (
              <>
                Values to enter are computed from the head parameters approved{" "}
                {formatDateTimeUtc(c.approved.approvedAt)}
                {c.approved.approvedBy ? ` by ${c.approved.approvedBy}` : ""} (
                <Link className="underline" href={`/jobs/${id}/analysis`}>
                  Analysis
                </Link>
                ).
              </>
            ) : (
              <>
                No head parameters are approved yet: the values to enter appear once an application engineer
                approves a fit on the{" "}
                <Link className="underline" href={`/jobs/${id}/analysis`}>
                  Analysis
                </Link>{" "}
                page.
              </>
            )}{" "}
            Lengths are shown in the control&apos;s units
            {system === "inch" ? " (inch, with mm beside)" : " (mm)"}; angles in degrees with arc seconds
            beside.
          </p>
          {loop.flagged.length ? (
            <p
              role="alert"
              className="rounded-card border border-fail-600 bg-fail-50 p-3 text-sm text-fail-700"
            >
              {loop.flagged.length === 1
                ? "One value left in the control is not the value to enter."
                : `${loop.flagged.length} values left in the control are not the values to enter.`}{" "}
              Check the control, or explain the difference in the note before the report is issued.
            </p>
          ) : null}
          {c.asLeftStale ? (
            <p
              role="alert"
              className="rounded-card border border-fail-600 bg-fail-50 p-3 text-sm text-fail-700"
            >
              The as-left values were recorded against an earlier approval; record them again.
            </p>
          ) : null}
          <ControlValuesLoopTable rows={loop.rows} />
          <div className="grid gap-2 text-sm text-graphite-600 sm:grid-cols-2">
            <p>
              As found:{" "}
              {c.asFound
                ? `${formatDateTimeUtc(c.asFound.createdAt)}${c.asFound.recordedBy ? `, ${c.asFound.recordedBy}` : ""}${c.asFound.note ? ` — ${c.asFound.note}` : ""}`
                : "not recorded"}
            </p>
            <p>
              As left:{" "}
              {c.asLeft
                ? `${formatDateTimeUtc(c.asLeft.createdAt)}${c.asLeft.recordedBy ? `, ${c.asLeft.recordedBy}` : ""}${c.asLeft.note ? ` — ${c.asLeft.note}` : ""}`
                : "not recorded"}
            </p>
          </div>
          <div className="rounded-card border border-graphite-200 bg-graphite-50 p-4 text-sm text-graphite-800">
            <p className="font-semibold">Sign convention</p>
            <p>{SIGN_CONVENTION}</p>
          </div>
          <SafetyNote title="Entering values in the control">
            <p>{CONTROL_CAUTION}</p>
          </SafetyNote>
        </div>
      </Card>

      <TcpCheckCard jobId={id} tcp={tcp} />

      <section className="grid gap-6 xl:grid-cols-2">
        <Card title="Values as found">
          {foundRefusal ? (
            <p className="text-sm text-graphite-600">{foundRefusal}</p>
          ) : (
            <div className="space-y-3">
              <p className="text-sm text-graphite-700">
                Read these from the control before anything is changed. A new record replaces the shown one;
                earlier records stay in the job&apos;s activity.
              </p>
              <ControlValuesForm
                jobId={id}
                stage="as_found"
                unitSystem={system}
                lockUnits={false}
                defaults={typed(c.asFound?.values, system)}
                hints={{}}
              />
            </div>
          )}
        </Card>
        <Card title="Values as left">
          {leftRefusal ? (
            <p className="text-sm text-graphite-600">{leftRefusal}</p>
          ) : (
            <div className="space-y-3">
              <p className="text-sm text-graphite-700">
                Type what the control holds now, after entering the values, as read back from the control (not
                copied from this page). Differences from the values to enter are flagged.
              </p>
              <ControlValuesForm
                jobId={id}
                stage="as_left"
                unitSystem={system}
                lockUnits={c.asFound !== null}
                defaults={typed(c.asLeft?.values, system)}
                hints={hints}
              />
            </div>
          )}
        </Card>
      </section>
    </div>
  );
}
