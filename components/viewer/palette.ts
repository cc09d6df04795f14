/** Colours of the 3D view, shared by the scene, its legend and the saved picture (from lib/domain/theme). */
import { drawing, palette } from "@/lib/domain/theme";

export const NOMINAL = palette.nominal[500];
export const FITTED = palette.accent[500];
/** The other fit of a pre/post pair: a deep teal, dashed, so it differs from nominal by hue and pattern. */
export const OTHER = drawing.overlay;
export const BACKGROUND = drawing.sceneBackground;

/** One fit as the legend names it: its phase in words and the dataset it was fitted from. */
export interface ViewerFitLabel {
  analysisId: string;
  /** "before adjustment" or "after adjustment". */
  phaseText: string;
  dataset: string;
}
