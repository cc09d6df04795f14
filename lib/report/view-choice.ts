/**
 * Which saved 3D views may go into the report: only a view of the approved fit, and only one
 * large enough to read on paper (at least 600 × 400 px: the report prints it up to 515 pt wide,
 * about 7 in, so a smaller picture would be blown up into blur). Pure; used when the engineer
 * ticks a view and again when the report is built, so a view that stops qualifying (another fit
 * approved) drops out rather than printing a fit the report does not vouch for.
 */
export const REPORT_VIEW_MIN_PX = { width: 600, height: 400 } as const;

export function reportViewRefusal(
  view: { analysisId: string; widthPx: number; heightPx: number },
  approvedAnalysisId: string | null,
): string | null {
  if (!approvedAnalysisId)
    return "No fit is approved yet: views for the report are chosen from the approved fit.";
  if (view.analysisId !== approvedAnalysisId)
    return "This view shows a fit that is not the approved one; the report shows only views of the approved fit.";
  const { width, height } = REPORT_VIEW_MIN_PX;
  if (view.widthPx < width || view.heightPx < height)
    return `This view is ${view.widthPx} × ${view.heightPx} px; a view for the report needs at least ${width} × ${height} px. Save it again from a larger window.`;
  return null;
}
