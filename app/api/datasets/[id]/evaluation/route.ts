// A test-part dataset judged under the job's decision rule: JSON, or CSV with ?format=csv (cells
// neutralised against spreadsheet formula injection by lib/csv-export).
import { getTestPartEvaluation } from "@/db/queries/datasets";
import { toCsv } from "@/lib/csv-export";
import { AppError } from "@/lib/errors";
import { readRoute } from "@/lib/read-route";

export const runtime = "nodejs";
export const GET = readRoute("dataset", getTestPartEvaluation, ({ detail, evaluation }, { req }) => {
  if (!evaluation)
    throw new AppError(422, "not_test_part", "Only a test-part dataset has a feature evaluation.");
  if (new URL(req.url).searchParams.get("format") !== "csv") {
    return Response.json({ datasetId: detail.dataset.id, jobReference: detail.job.reference, ...evaluation });
  }
  const csv = toCsv(
    [
      "feature",
      "characteristic",
      "unit",
      "nominal",
      "measured",
      "deviation",
      "lower_limit",
      "upper_limit",
      "U_k2",
      "decision",
      "decision_rule",
      "source_row",
    ],
    evaluation.rows.map((r) => [
      r.feature,
      r.characteristic,
      r.unit,
      r.nominal,
      r.measured,
      r.deviation,
      r.lower_limit,
      r.upper_limit,
      r.U,
      r.decision,
      evaluation.rule,
      r.sourceRow,
    ]),
  );
  const name = `${detail.job.reference}-test-part-evaluation.csv`.replace(/[^A-Za-z0-9._-]/g, "_");
  return new Response(csv, {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="${name}"`,
      "X-Content-Type-Options": "nosniff",
    },
  });
});
