import { getComparison } from "@/db/queries/readings";
import { toCsv } from "@/lib/csv-export";
import { readRoute } from "@/lib/read-route";

/** The comparison as CSV for spreadsheets; every text cell is neutralised against formula injection. */
export const GET = readRoute("job", getComparison, (c) => {
  const csv = toCsv(
    [
      "step",
      "title",
      "quantity",
      "unit",
      "lower_limit",
      "upper_limit",
      "limit_source",
      "decision_rule",
      "pre",
      "pre_decision",
      "post",
      "post_decision",
      "change",
      "status",
    ],
    c.rows.map((r) => [
      r.position,
      r.title,
      r.quantity,
      r.unit,
      r.lowerLimit,
      r.upperLimit,
      r.limitSource,
      r.decisionRule,
      r.pre?.value,
      r.pre?.decision,
      r.post?.value,
      r.post?.decision,
      r.change,
      r.status,
    ]),
  );
  return new Response(csv, {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="${c.detail.job.reference}-comparison.csv"`,
    },
  });
});
