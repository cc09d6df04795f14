import type { JobStatus } from "@/lib/domain/jobs";
import { badgeMark, IconBadge } from "./badge";
import { STATUS_LABELS } from "@/lib/domain/jobs";

/** Job status as an icon and a word: colour is never the only signal. */
const STYLES: Record<JobStatus, { cls: string; icon: React.ReactNode }> = {
  draft: {
    cls: "bg-unmeasured-50 text-unmeasured-600 ring-graphite-200",
    icon: badgeMark.dashedCircle(),
  },
  measuring: {
    cls: "bg-nominal-100 text-nominal-700 ring-nominal-300",
    icon: badgeMark.stroke("M6 1.5v9M1.5 6h9", 1.6),
  },
  in_review: {
    cls: "bg-accent-50 text-accent-800 ring-accent-300",
    icon: badgeMark.ringAndStroke([5, 5, 3.2], "M7.5 7.5 10.5 10.5", 1.6),
  },
  approved: {
    cls: "bg-pass-50 text-pass-700 ring-pass-600/30",
    icon: badgeMark.tick(1.8),
  },
  issued: {
    cls: "bg-graphite-800 text-white ring-graphite-800",
    icon: badgeMark.stroke("M2.5 1.5h5l2 2v7h-7z", 1.4, "none"),
  },
  accepted: {
    cls: "bg-pass-600 text-white ring-pass-600",
    icon: badgeMark.tick(),
  },
  rejected: {
    cls: "bg-fail-50 text-fail-700 ring-fail-600/30",
    icon: badgeMark.cross(1.8),
  },
  on_hold: {
    cls: "bg-white text-graphite-800 ring-graphite-400",
    icon: badgeMark.stroke("M4 2.5v7M8 2.5v7", 1.8),
  },
  cancelled: {
    cls: "bg-graphite-100 text-graphite-600 ring-graphite-300 line-through decoration-graphite-400",
    icon: badgeMark.ringAndStroke([6, 6, 4], "M3.2 8.8 8.8 3.2", 1.5),
  },
};

export function StatusBadge({ status }: { status: JobStatus }) {
  const s = STYLES[status];
  return (
    <IconBadge icon={s.icon} className={`px-2.5 py-0.5 text-sm font-medium ${s.cls}`}>
      {STATUS_LABELS[status]}
    </IconBadge>
  );
}
