/** The app's buttons: one look per purpose, a touch-sized target, and a pending label while the server works. */
export type ButtonVariant = "primary" | "amber" | "secondary" | "dark" | "danger" | "quiet";

const BASE =
  "inline-flex min-h-touch items-center justify-center gap-2 rounded-md font-semibold disabled:cursor-not-allowed disabled:opacity-60";

const VARIANTS: Record<ButtonVariant, string> = {
  primary: "bg-accent-600 text-white shadow-sm hover:bg-accent-700",
  amber: "bg-accent-500 text-graphite-900 hover:bg-accent-300",
  secondary: "border border-graphite-300 bg-white text-graphite-800 hover:bg-graphite-100",
  dark: "bg-graphite-800 text-white hover:bg-graphite-900",
  danger: "border border-fail-600 bg-white text-fail-700 hover:bg-fail-50",
  quiet: "text-graphite-700 underline-offset-2 hover:underline",
};

const SIZES = { md: "px-4 text-sm", lg: "px-5 text-base" } as const;

/** Class names for a link or label that should look like a button. */
export function buttonClass(
  variant: ButtonVariant = "primary",
  className = "",
  size: keyof typeof SIZES = "md",
): string {
  return `${BASE} ${SIZES[size]} ${VARIANTS[variant]} ${className}`.trim();
}

export function Button({
  variant = "primary",
  size = "md",
  pending = false,
  pendingLabel = "Saving…",
  className = "",
  type = "button",
  disabled,
  children,
  ...rest
}: React.ButtonHTMLAttributes<HTMLButtonElement> & {
  variant?: ButtonVariant;
  /** "lg" for the one main action of a page (larger text for the tablet). */
  size?: keyof typeof SIZES;
  /** While true the button is disabled and says `pendingLabel`, so nobody sends twice. */
  pending?: boolean;
  pendingLabel?: string;
}) {
  return (
    <button
      type={type}
      disabled={disabled || pending}
      aria-busy={pending || undefined}
      className={buttonClass(variant, className, size)}
      {...rest}
    >
      {pending ? pendingLabel : children}
    </button>
  );
}

/** The answer to an action beside its button: a status when it worked, an alert when refused. */
export function ActionNotice({
  ok,
  children,
  className = "",
}: {
  ok: boolean;
  children: React.ReactNode;
  className?: string;
}) {
  return (
    <p
      role={ok ? "status" : "alert"}
      className={`text-sm ${ok ? "text-pass-700" : "text-fail-700"} ${className}`}
    >
      {children}
    </p>
  );
}
