import type { ReportData } from "@/lib/report/types";

const VERDICT_BORDER: Record<NonNullable<ReportData["conformity"]>["verdict"], string> = {
  conforms: "border-pass-600",
  conforms_with_deviations: "border-accent-500",
  does_not_conform: "border-fail-600",
  not_judged: "border-graphite-400",
};

/**
 * The statement of conformity (ISO/IEC 17025:2017 §7.8.6) as the report and the job's page show
 * it; `note` says which record it speaks for (an issued revision, or the record as it stands).
 */
export function ConformityStatement({
  conformity,
  note,
}: {
  conformity: NonNullable<ReportData["conformity"]>;
  note?: string;
}) {
  return (
    <section
      aria-label="Statement of conformity"
      data-verdict={conformity.verdict}
      className={`rounded-card border-2 ${VERDICT_BORDER[conformity.verdict]} bg-white p-3 text-sm`}
    >
      <p className="font-semibold">Statement of conformity</p>
      <p>{conformity.text}</p>
      {note ? <p className="mt-1 text-xs text-graphite-600">{note}</p> : null}
    </section>
  );
}
