import { palette } from "@/lib/domain/theme";
/** Trammel's mark: two crossed axes with an arc swept between them. */
export function LogoMark({ className = "h-7 w-7" }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true" focusable="false">
      <rect x="1" y="1" width="30" height="30" rx="7" fill={palette.graphite[800]} />
      {/* The two axes, crossed. */}
      {[24, 8].map((y1) => (
        <line
          key={y1}
          x1="8"
          y1={y1}
          x2="24"
          y2={32 - y1}
          stroke={palette.nominal[300]}
          strokeWidth="2.2"
          strokeLinecap="round"
        />
      ))}
      <path
        d="M9.5 19.5 A 9 9 0 0 1 19.5 9.5"
        fill="none"
        stroke={palette.accent[500]}
        strokeWidth="2.6"
        strokeLinecap="round"
      />
      <circle cx="16" cy="16" r="2.2" fill={palette.accent[500]} />
    </svg>
  );
}

/** The mark and the name side by side, in three sizes: the header's, a form page's, the sign-in panel's. */
const WORDMARK = {
  md: { gap: "gap-2", mark: "h-7 w-7", name: "text-lg font-semibold tracking-tight" },
  lg: { gap: "gap-3", mark: "h-9 w-9", name: "text-xl font-semibold" },
  xl: { gap: "gap-3", mark: "h-10 w-10", name: "text-2xl font-semibold tracking-tight text-white" },
} as const;

export function Wordmark({
  size = "md",
  className = "",
}: {
  size?: keyof typeof WORDMARK;
  className?: string;
}) {
  const w = WORDMARK[size];
  return (
    <div className={`flex items-center ${w.gap} ${className}`.trim()}>
      <LogoMark className={w.mark} />
      <span className={w.name}>Trammel</span>
    </div>
  );
}
