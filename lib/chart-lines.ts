/**
 * Straight lines in a chart's own coordinates. The chart layouts (lib/positioning-chart.ts,
 * lib/report/residuals-layout.ts) work them out once; the page spreads them onto an SVG `<line>` and
 * the PDF onto a @react-pdf `<Line>`, which take the same four attributes.
 */
export interface Segment {
  x1: number;
  x2: number;
  y1: number;
  y2: number;
}

/** A rectangle, ready to spread onto an SVG `<rect>` or a PDF `<Rect>`. */
export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** From x0 to x1 at height y. */
export function horizontal(x0: number, x1: number, y: number): Segment {
  return { x1: x0, x2: x1, y1: y, y2: y };
}

/** From y0 to y1 at x. */
export function vertical(x: number, y0: number, y1: number): Segment {
  return { x1: x, x2: x, y1: y0, y2: y1 };
}

/** The rectangle with corners (x0, y0) and (x1, y1). */
export function boxOf(p: { x0: number; x1: number; y0: number; y1: number }): Box {
  return { x: p.x0, y: p.y0, width: p.x1 - p.x0, height: p.y1 - p.y0 };
}
