/** Colours of the 3D view, shared by the scene, its legend and the saved picture. */

export const NOMINAL = "#5f7d99";
export const FITTED = "#e08e0b";
/** The other fit of a pre/post pair: a deep teal, dashed, so it differs from nominal by hue and pattern. */
export const OTHER = "#0f766e";
export const BACKGROUND = "#f3f4f6";

/** One fit as the legend names it: its phase in words and the dataset it was fitted from. */
export interface ViewerFitLabel {
  analysisId: string;
  /** "before adjustment" or "after adjustment". */
  phaseText: string;
  dataset: string;
}
