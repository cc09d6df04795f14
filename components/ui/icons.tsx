/**
 * The app's line icons: drawn in the text colour (`currentColor`) on a 24-unit grid, hidden from
 * assistive technology because the words beside them say the same. `className` sizes and colours them.
 */
const STROKE = {
  fill: "none",
  stroke: "currentColor",
  strokeLinecap: "round",
  strokeLinejoin: "round",
} as const;

/** A warning triangle with an exclamation mark (safety notes). */
export function WarningIcon({ className }: { className: string }) {
  return (
    <svg viewBox="0 0 24 24" className={className} aria-hidden="true">
      <path d="M12 2.5 22 20.5H2z" {...STROKE} strokeWidth="2" />
      <path d="M12 9v5.5" {...STROKE} strokeWidth="2.2" />
      <circle cx="12" cy="17.5" r="1.3" fill="currentColor" />
    </svg>
  );
}

/** An arrow up out of a tray (choosing a file to upload). */
export function UploadIcon({ className }: { className: string }) {
  return (
    <svg viewBox="0 0 24 24" className={className} aria-hidden="true">
      <path
        d="M12 16V4m0 0-4 4m4-4 4 4M4 16v3a1 1 0 0 0 1 1h14a1 1 0 0 0 1-1v-3"
        {...STROKE}
        strokeWidth="1.8"
      />
    </svg>
  );
}
