// Views for the report: only of the approved fit, at least 600 × 400 px (the report prints a
// figure up to 515 pt ≈ 7.2 in wide; 600 px over that is about 85 px per inch, the least that
// prints without visible blur — common practice for screen captures in print, not a standard).
import { describe, expect, it } from "vitest";
import { REPORT_VIEW_MIN_PX, reportViewRefusal } from "@/lib/report/view-choice";

const view = { analysisId: "a1", widthPx: 1200, heightPx: 800 };

describe("reportViewRefusal", () => {
  it("accepts a large enough view of the approved fit, the limit itself included", () => {
    expect(reportViewRefusal(view, "a1")).toBeNull();
    expect(reportViewRefusal({ ...view, ...{ widthPx: 600, heightPx: 400 } }, "a1")).toBeNull();
    expect(REPORT_VIEW_MIN_PX).toEqual({ width: 600, height: 400 });
  });
  it("refuses a view smaller than 600 × 400 px in either direction, naming its size", () => {
    expect(reportViewRefusal({ ...view, widthPx: 1, heightPx: 1 }, "a1")).toMatch(/1 × 1 px.*600 × 400/);
    expect(reportViewRefusal({ ...view, widthPx: 599 }, "a1")).toMatch(/599 × 800 px/);
    expect(reportViewRefusal({ ...view, heightPx: 399 }, "a1")).toMatch(/1200 × 399 px/);
  });
  it("refuses a view of another fit, and any view before a fit is approved", () => {
    expect(reportViewRefusal(view, "a2")).toMatch(/not the approved one/);
    expect(reportViewRefusal(view, null)).toMatch(/No fit is approved/);
  });
});
