import { badgeMark, IconBadge } from "@/components/ui/badge";
import { DECISION_LABELS, type StepDecision } from "@/lib/checklist";

/** A reading's result as an icon and a word; colour is never the only signal. */
const STYLES: Record<StepDecision, { cls: string; icon: React.ReactNode }> = {
  pass: {
    cls: "bg-pass-50 text-pass-700 ring-pass-600/40",
    icon: badgeMark.tick(),
  },
  fail: {
    cls: "bg-fail-50 text-fail-700 ring-fail-600/40",
    icon: badgeMark.cross(),
  },
  undecided: {
    cls: "bg-undecided-50 text-undecided-700 ring-undecided-600/40",
    icon: (
      <>
        <path
          d="M4 4.2a2 2 0 1 1 2.6 1.9c-.5.2-.6.5-.6 1v.6"
          fill="none"
          stroke="currentColor"
          strokeWidth="1.6"
        />
        <circle cx="6" cy="10" r="0.9" fill="currentColor" />
      </>
    ),
  },
  no_limit: {
    cls: "bg-nominal-100 text-nominal-700 ring-nominal-300",
    icon: <circle cx="6" cy="6" r="3" fill="currentColor" />,
  },
  not_measured: {
    cls: "bg-unmeasured-50 text-unmeasured-600 ring-graphite-200",
    icon: badgeMark.dashedCircle(),
  },
};

export function DecisionBadge({
  decision,
  size = "md",
  label,
}: {
  decision: StepDecision;
  size?: "md" | "lg";
  label?: string;
}) {
  const s = STYLES[decision];
  return (
    <IconBadge
      data-decision={decision}
      icon={s.icon}
      iconClassName={size === "lg" ? "h-4 w-4" : "h-3 w-3"}
      className={`font-semibold ${size === "lg" ? "px-3 py-1 text-base" : "px-2.5 py-0.5 text-sm"} ${s.cls}`}
    >
      {label ?? DECISION_LABELS[decision]}
    </IconBadge>
  );
}
