/** The saved picture: the scene re-rendered at print resolution, with the factor and legend printed into it. */
import { palette } from "@/lib/domain/theme";
import type * as THREE from "three";
import { formatFactor } from "./factor";
import { BACKGROUND, FITTED, NOMINAL, OTHER, type ViewerFitLabel } from "./palette";

/** Pixels per CSS pixel of a saved picture: twice the screen's at least, so it stays sharp in print (~250 dpi across an A4 page). */
const PRINT_PIXEL_RATIO = 2;

/**
 * The scene drawn once more at PRINT_PIXEL_RATIO into a copy, then the screen's own resolution
 * restored. Fat lines keep their look: their width is set against the CSS size, which does not
 * change.
 */
export function renderForPrint(
  gl: THREE.WebGLRenderer,
  scene: THREE.Scene,
  camera: THREE.Camera,
): HTMLCanvasElement {
  const screenRatio = gl.getPixelRatio();
  const out = document.createElement("canvas");
  try {
    gl.setPixelRatio(Math.max(PRINT_PIXEL_RATIO, screenRatio));
    gl.render(scene, camera);
    out.width = gl.domElement.width;
    out.height = gl.domElement.height;
    out.getContext("2d")?.drawImage(gl.domElement, 0, 0);
  } finally {
    gl.setPixelRatio(screenRatio);
    gl.render(scene, camera);
  }
  return out;
}

/**
 * The picture as saved: the canvas, with the factor and the legend's words printed into it so the
 * saved PNG cannot be mistaken for real size, whatever page it ends up on.
 */
export async function viewPicture(
  canvas: HTMLCanvasElement,
  k: number,
  shown: ViewerFitLabel,
  other: ViewerFitLabel | null,
): Promise<Blob> {
  const px = Math.max(12, Math.round(canvas.width / 70));
  // Two or three legend lines, 1.4 text heights apart, with a margin below the last.
  const band = Math.round(px * (other ? 5.2 : 3.8));
  const out = document.createElement("canvas");
  out.width = canvas.width;
  out.height = canvas.height + band;
  const g = out.getContext("2d");
  if (!g) throw new Error("This browser cannot make the picture (no 2D canvas).");
  g.fillStyle = BACKGROUND;
  g.fillRect(0, 0, out.width, out.height);
  g.drawImage(canvas, 0, 0);
  g.font = `600 ${px}px sans-serif`;
  const label = `Errors drawn ×${formatFactor(k)}${other ? " for both fits" : ""} — not to scale`;
  const w = g.measureText(label).width;
  g.fillStyle = "rgba(255,255,255,0.92)";
  g.fillRect(px * 0.6, px * 0.6, w + px * 1.2, px * 1.9);
  g.fillStyle = palette.graphite[900];
  g.fillText(label, px * 1.2, px * 1.95);
  g.fillStyle = palette.white;
  g.fillRect(0, canvas.height, out.width, band);
  g.font = `${Math.round(px * 0.85)}px sans-serif`;
  const line = (y: number, colour: string, dashed: boolean, text: string) => {
    g.strokeStyle = colour;
    g.lineWidth = Math.max(2, px / 5);
    g.setLineDash(dashed ? [px * 0.5, px * 0.35] : []);
    g.beginPath();
    g.moveTo(px, y);
    g.lineTo(px * 3, y);
    g.stroke();
    g.fillStyle = palette.graphite[800];
    g.fillText(text, px * 3.6, y + px * 0.3);
  };
  const y0 = canvas.height + px * 1.2;
  line(y0, NOMINAL, true, "Nominal axes and tip path");
  line(
    y0 + px * 1.4,
    FITTED,
    false,
    `Fitted axes and actual tip path, ${shown.phaseText} (${shown.dataset})`,
  );
  if (other)
    line(y0 + px * 2.8, OTHER, true, `Fitted axes and tip path ${other.phaseText} (${other.dataset})`);
  return new Promise((resolve, reject) =>
    out.toBlob((b) => (b ? resolve(b) : reject(new Error("The picture could not be made."))), "image/png"),
  );
}
