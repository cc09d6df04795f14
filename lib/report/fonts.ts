/**
 * Fonts for the PDF, all shipped in fonts/: IBM Plex Sans for text, IBM Plex Mono for values
 * (tabular figures), DejaVu Sans as the per-glyph fallback for anything Plex lacks. WOFF and
 * TTF only — the renderer's font engine crashes on WOFF2.
 */
import path from "node:path";
import { Font } from "@react-pdf/renderer";

let registered = false;

export const BODY_FONT = ["PlexSans", "DejaVu"];
export const MONO_FONT = ["PlexMono", "DejaVuMono"];

/**
 * Each family with the files for its regular (400) and bold (700) weights: Plex Mono's Medium
 * stands in for bold; DejaVu Sans Mono ships no bold here, so its regular serves both.
 */
const FACES: ReadonlyArray<readonly [family: string, regular: string, bold: string]> = [
  ["PlexSans", "IBMPlexSans-Regular.woff", "IBMPlexSans-Bold.woff"],
  ["PlexMono", "IBMPlexMono-Regular.woff", "IBMPlexMono-Medium.woff"],
  ["DejaVu", "DejaVuSans.ttf", "DejaVuSans-Bold.ttf"],
  ["DejaVuMono", "DejaVuSansMono.ttf", "DejaVuSansMono.ttf"],
];

export function registerReportFonts(
  fontsDir = path.join(/*turbopackIgnore: true*/ process.cwd(), "fonts"),
): void {
  if (registered) return;
  for (const [family, regular, bold] of FACES) {
    Font.register({
      family,
      fonts: [
        { src: path.join(fontsDir, regular), fontWeight: 400 },
        { src: path.join(fontsDir, bold), fontWeight: 700 },
      ],
    });
  }
  // Numbers and identifiers must never be hyphenated across lines.
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}
