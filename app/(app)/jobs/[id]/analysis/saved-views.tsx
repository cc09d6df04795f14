import { Card } from "@/components/ui/card";
import type { listJobViews } from "@/db/queries/analysis-views";
import { phaseText } from "@/lib/domain/datasets";
import { formatDateTimeUtc } from "@/lib/format";
import { formatFactor } from "@/components/viewer/factor";
import { StoredViewImage, storedViewUrl } from "@/components/viewer/stored-view-image";
import { reportViewRefusal } from "@/lib/report/view-choice";
import { ReportViewToggle } from "./report-view-toggle";

type Views = Awaited<ReturnType<typeof listJobViews>>;

/**
 * The pictures of the 3D view saved for the report, newest first. The engineer ticks the ones the
 * report prints (views of the approved fit, at least 600 × 400 px); the ticked ones are marked.
 */
export function SavedViews({
  jobId,
  views,
  approvedAnalysisId,
  choices,
  mayChoose,
}: {
  jobId: string;
  views: Views;
  approvedAnalysisId: string | null;
  /** view id → ticked for the report (db/queries/report-views.reportViewChoices). */
  choices: Record<string, boolean>;
  mayChoose: boolean;
}) {
  const inReport = (v: Views[number]) =>
    choices[v.id] === true && reportViewRefusal(v, approvedAnalysisId) === null;
  return (
    <Card title="Saved views">
      {views.length === 0 ? (
        <p className="text-sm text-graphite-600">
          No view saved yet. An application engineer saves the 3D view as shown with &ldquo;Save view for the
          report&rdquo;, then ticks the views of the approved fit that the acceptance report prints.
        </p>
      ) : (
        <>
          <p className="mb-4 text-sm text-graphite-600">
            The report prints the views ticked &ldquo;In the report&rdquo;: views of the approved fit, at
            least 600 × 400 px. Saved views are kept as they were taken.
          </p>
          <ul className="grid gap-4 sm:grid-cols-2 xl:grid-cols-4" aria-label="Saved views">
            {views.map((v) => (
              <li
                key={v.id}
                className={`overflow-hidden rounded-card border ${inReport(v) ? "border-accent-500 ring-1 ring-accent-500" : "border-graphite-200"} bg-white`}
                data-view-id={v.id}
              >
                <a
                  href={storedViewUrl(v.id)}
                  target="_blank"
                  rel="noreferrer"
                  className="block bg-graphite-50"
                >
                  <StoredViewImage
                    viewId={v.id}
                    width={v.widthPx}
                    height={v.heightPx}
                    alt={`Saved 3D view, errors drawn ×${formatFactor(v.factor)}${v.caption ? `: ${v.caption}` : ""}`}
                    className="h-auto w-full"
                    loading="lazy"
                  />
                </a>
                <div className="space-y-1 p-3 text-sm">
                  {inReport(v) ? (
                    <p className="text-xs font-semibold text-accent-700">★ Used in the report</p>
                  ) : null}
                  {v.caption ? <p className="font-medium text-graphite-900">{v.caption}</p> : null}
                  <p className="text-graphite-700">
                    Errors ×<span className="num">{formatFactor(v.factor)}</span> · fit {phaseText(v.phase)}
                    {v.overlayAnalysisId ? " with the other fit overlaid" : ""}
                  </p>
                  <p className="text-xs text-graphite-600">
                    {v.createdByName ?? "Unknown"} ·{" "}
                    <span className="num">{formatDateTimeUtc(v.createdAt)}</span> ·{" "}
                    <span className="num">
                      {v.widthPx} × {v.heightPx}
                    </span>{" "}
                    px
                  </p>
                  {mayChoose ? (
                    <ReportViewToggle
                      jobId={jobId}
                      viewId={v.id}
                      included={choices[v.id] === true}
                      refusal={reportViewRefusal(v, approvedAnalysisId)}
                    />
                  ) : null}
                </div>
              </li>
            ))}
          </ul>
        </>
      )}
    </Card>
  );
}
