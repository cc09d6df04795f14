/**
 * Trammel's design tokens for Tailwind. The colours come from lib/domain/theme.ts, which the PDF
 * and the 3D view use too, so the three never drift apart.
 */
import type { Config } from "tailwindcss";
// Relative: the config is loaded without the app's path alias.
import { palette } from "./lib/domain/theme";

export default {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        graphite: palette.graphite,
        accent: palette.accent,
        nominal: palette.nominal,
        pass: palette.pass,
        fail: palette.fail,
        undecided: palette.undecided,
        unmeasured: palette.unmeasured,
      },
      fontFamily: {
        sans: ["var(--font-sans)", "system-ui", "sans-serif"],
        mono: ["var(--font-mono)", "ui-monospace", "monospace"],
      },
      borderRadius: { card: "0.625rem" },
      minHeight: { touch: "2.75rem" },
      minWidth: { touch: "2.75rem" },
    },
  },
} satisfies Config;
