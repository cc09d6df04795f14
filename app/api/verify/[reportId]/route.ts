import { verifyReport } from "@/db/queries/verification";
import { route } from "@/lib/http";

type Ctx = { params: Promise<{ reportId: string }> };

/** Public by design: anyone holding a report id may check it. Says nothing about unknown ids but that. */
export const GET = route<Ctx>(async (_req, ctx) => {
  const { reportId } = await ctx.params;
  const result = await verifyReport(reportId);
  return Response.json(result, { status: result.report ? 200 : 404 });
});
