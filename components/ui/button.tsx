/** The app's buttons: one look per purpose, a touch-sized target, and a pending label while the server works. */
export type ButtonVariant = "primary" | "secondary" | "danger" | "quiet";

const BASE =
  "inline-flex min-h-touch items-center justify-center gap-2 rounded-md px-4 text-sm font-semibold disabled:cursor-not-allowed disabled:opacity-60";

const VARIANTS: Record<ButtonVariant, string> = {
  primary: "bg-accent-600 text-white shadow-sm hover:bg-accent-700",
  secondary: "border border-graphite-300 bg-white text-graphite-800 hover:bg-graphite-100",
  danger: "border border-fail-600 bg-white text-fail-700 hover:bg-fail-50",
  quiet: "text-graphite-700 underline-offset-2 hover:underline",
};

/** Class names for a link or label that should look like a button. */
export function buttonClass(variant: ButtonVariant = "primary", className = ""): string {
  return `${BASE} ${VARIANTS[variant]} ${className}`.trim();
}

export function Button({
  variant = "primary",
  pending = false,
  pendingLabel = "Saving…",
  className = "",
  type = "button",
  disabled,
  children,
  ...rest
}: React.ButtonHTMLAttributes<HTMLButtonElement> & {
  variant?: ButtonVariant;
  /** While true the button is disabled and says `pendingLabel`, so nobody sends twice. */
  pending?: boolean;
  pendingLabel?: string;
}) {
  return (
    <button
      type={type}
      disabled={disabled || pending}
      aria-busy={pending || undefined}
      className={buttonClass(variant, className)}
      {...rest}
    >
      {pending ? pendingLabel : children}
    </button>
  );
}
