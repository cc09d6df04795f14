/**
 * Trammel's colours, in one place for Tailwind (tailwind.config.ts), the charts on the page and in
 * the PDF (lib/report), and the 3D view. Graphite neutrals, one warm accent (amber) for actions and
 * fitted geometry, a cool blue-grey for nominal geometry, and status colours that always come with
 * an icon and a word. Contrast pairs chosen for WCAG AA on white and on graphite.
 */
export const palette = {
  white: "#ffffff",
  graphite: {
    50: "#f6f7f8",
    100: "#eceef0",
    200: "#d5d9de",
    300: "#b3bac3",
    400: "#8a939e",
    500: "#5f6873",
    600: "#555d68",
    700: "#434a53",
    800: "#2d3238",
    900: "#1d2125",
    950: "#121518",
  },
  // 600 and darker carry white text at WCAG AA (≥ 4.5:1); 500 is for strokes and fills only.
  accent: {
    50: "#fff8eb",
    100: "#feeac7",
    300: "#f9c266",
    500: "#e08e0b",
    600: "#9a5a06",
    700: "#7d4907",
    800: "#633a0b",
  },
  nominal: { 100: "#e3eaf1", 300: "#9fb3c8", 500: "#5f7d99", 700: "#3e5670" },
  pass: { 50: "#ecf8f0", 600: "#1f7a45", 700: "#17613a" },
  fail: { 50: "#fdeeee", 600: "#c2302b", 700: "#9c2420" },
  undecided: { 50: "#f3effb", 600: "#6a45b0", 700: "#553791" },
  unmeasured: { 50: "#f1f2f4", 600: "#5c6470" },
} as const;

/** What drawings use beyond the UI's scale: chart axes and bands, print strokes, 3D materials. */
export const drawing = {
  /** Axis labels and tick text. */
  axisText: "#4b5563",
  /** Stronger label text under a chart. */
  labelText: "#374151",
  /** Grid lines. */
  grid: "#e3e6ea",
  /** The zero line of a chart; the 3D view's head body. */
  zeroLine: "#6b7280",
  /** Faint strokes: whiskers, the 3D view's machine parts. */
  faint: "#9aa3ad",
  /** The shaded band between limits. */
  limitBand: "#e7efe9",
  /** The accent dark enough for thin lines and print. */
  accentLine: "#b86e05",
  /** Accent text on white. */
  accentText: "#8a5204",
  /** A value beyond its limit on a chart. */
  warning: "#b45309",
  /** Text naming such a value. */
  warningText: "#7c2d12",
  /** The other phase's fit drawn beside the shown one in the 3D view. */
  overlay: "#0f766e",
  /** The 3D view's background. */
  sceneBackground: "#f3f4f6",
} as const;
