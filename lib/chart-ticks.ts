/**
 * Axis ticks for the server-rendered charts: "nice" steps of 1, 2 or 5 × 10ⁿ covering [lo, hi]
 * with about `target` intervals (the usual 1-2-5 rule of chart axes).
 */
export function niceTicks(
  lo: number,
  hi: number,
  target = 4,
): { min: number; max: number; step: number; ticks: number[] } {
  if (!Number.isFinite(lo) || !Number.isFinite(hi))
    throw new RangeError("niceTicks: the range must be finite");
  if (hi < lo) [lo, hi] = [hi, lo];
  if (hi === lo) {
    const d = lo === 0 ? 1 : Math.abs(lo) * 0.1;
    lo -= d;
    hi += d;
  }
  const raw = (hi - lo) / Math.max(1, target);
  const mag = 10 ** Math.floor(Math.log10(raw));
  const f = raw / mag;
  const step = (f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10) * mag;
  const min = Math.floor(lo / step + 1e-9) * step;
  const max = Math.ceil(hi / step - 1e-9) * step;
  const ticks: number[] = [];
  for (let v = min; v <= max + step * 1e-6; v += step) ticks.push(Number(v.toPrecision(12)));
  return { min, max, step, ticks };
}
