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

export function registerReportFonts(
  fontsDir = path.join(/*turbopackIgnore: true*/ process.cwd(), "fonts"),
): void {
  if (registered) return;
  const f = (name: string) => path.join(fontsDir, name);
  Font.register({
    family: "PlexSans",
    fonts: [
      { src: f("IBMPlexSans-Regular.woff"), fontWeight: 400 },
      { src: f("IBMPlexSans-Bold.woff"), fontWeight: 700 },
    ],
  });
  Font.register({
    family: "PlexMono",
    fonts: [
      { src: f("IBMPlexMono-Regular.woff"), fontWeight: 400 },
      { src: f("IBMPlexMono-Medium.woff"), fontWeight: 700 },
    ],
  });
  Font.register({
    family: "DejaVu",
    fonts: [
      { src: f("DejaVuSans.ttf"), fontWeight: 400 },
      { src: f("DejaVuSans-Bold.ttf"), fontWeight: 700 },
    ],
  });
  Font.register({
    family: "DejaVuMono",
    fonts: [
      { src: f("DejaVuSansMono.ttf"), fontWeight: 400 },
      { src: f("DejaVuSansMono.ttf"), fontWeight: 700 },
    ],
  });
  // Numbers and identifiers must never be hyphenated across lines.
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}
