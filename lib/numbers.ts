/** Numbers as people read them in tables and reports: fixed decimals, the real minus sign, never −0. No imports, so the PDF renderer and charts can use it without the fit modules. */
/** Fixed decimals with a real minus sign, and no sign on a value that rounds to zero (never "−0.0000"). */
export function fixed(v: number, digits: number): string {
  const s = Math.abs(v).toFixed(digits);
  return v < 0 && Number(s) !== 0 ? `−${s}` : s;
}

/** Signed, fixed decimals, with a real minus sign. */
export function signed(v: number, digits: number): string {
  const s = Math.abs(v).toFixed(digits);
  if (Number(s) === 0) return s;
  return `${v < 0 ? "−" : "+"}${s}`;
}
