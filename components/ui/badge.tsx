/** Marks for the badges, drawn in a 12 × 12 box in the text colour. */
export const badgeMark = {
  tick: (width = 2) => <path d="M2 6.2 4.8 9 10 3" fill="none" stroke="currentColor" strokeWidth={width} />,
  cross: (width = 2) => <path d="M2.5 2.5l7 7M9.5 2.5l-7 7" stroke="currentColor" strokeWidth={width} />,
  dashedCircle: () => (
    <circle cx="6" cy="6" r="4" fill="none" stroke="currentColor" strokeWidth="1.6" strokeDasharray="2 1.6" />
  ),
  /** One stroked path, open (`fill` none) or as drawn. */
  stroke: (d: string, width: number, fill?: "none") => (
    <path d={d} fill={fill} stroke="currentColor" strokeWidth={width} />
  ),
  /** A ring (centre x, y and radius) and one stroke `d` at the same width: a magnifier, a struck-out circle. */
  ringAndStroke: ([cx, cy, r]: [number, number, number], d: string, width: number) => (
    <>
      <circle cx={cx} cy={cy} r={r} fill="none" stroke="currentColor" strokeWidth={width} />
      <path d={d} stroke="currentColor" strokeWidth={width} />
    </>
  ),
};

/** A rounded badge: a mark and a word, so colour is never the only signal. */
export function IconBadge({
  icon,
  className,
  iconClassName = "h-3 w-3",
  children,
  ...rest
}: {
  icon: React.ReactNode;
  className: string;
  iconClassName?: string;
  children: React.ReactNode;
} & Omit<React.HTMLAttributes<HTMLSpanElement>, "className">) {
  return (
    <span
      className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full ring-1 ring-inset ${className}`}
      {...rest}
    >
      <svg viewBox="0 0 12 12" className={iconClassName} aria-hidden="true">
        {icon}
      </svg>
      {children}
    </span>
  );
}
