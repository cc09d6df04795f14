/** The exaggeration factor of the 3D view: from the slider, and as printed (shared by server and client code). */

/** k from the slider position (log10 k, 0…4), rounded to two significant figures so the printed factor is the one used. */
export function factorFromSlider(v: number): number {
  return Number((10 ** v).toPrecision(2));
}

/** "10 000" with a thin space between thousands. */
export function formatFactor(k: number): string {
  return k.toLocaleString("en-GB").replace(/,/g, "\u2009");
}
