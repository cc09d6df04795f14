// Tailwind 4 runs as a PostCSS plugin; the theme lives in tailwind.config.ts.
export default { plugins: { "@tailwindcss/postcss": {} } };
