/**
 * The report's appendix of photos as rows: for each step whose procedure asks for a photo, the
 * photos kept with it, listed by step, phase, time (UTC), who took them, size and SHA-256 (so the
 * stored image can be matched to the signed report). The images themselves stay in the job's
 * record. Pure: the page (components/report/photo-appendix.tsx) and the PDF (photos.tsx) print it.
 */
import { formatDateTimeUtc } from "@/lib/format";

export interface PhotoAppendixRow {
  step: string;
  phase: string;
  takenAtUtc: string;
  by: string;
  size: string;
  sha256: string;
}

const PHASE = { pre: "before adjustment", post: "after adjustment" } as const;

/** The rows of the appendix, in step order, then by time; photos of steps that ask for none are left out. */
export function photoAppendixRows(
  steps: ReadonlyArray<{ stepId: string; position: number; title: string; photoRequired: boolean }>,
  photos: ReadonlyArray<{
    stepId: string;
    phase: "pre" | "post";
    takenAt: Date;
    uploadedBy: string | null;
    width: number;
    height: number;
    sha256: string;
  }>,
): PhotoAppendixRow[] {
  return steps
    .filter((s) => s.photoRequired)
    .sort((a, b) => a.position - b.position)
    .flatMap((s) =>
      photos
        .filter((p) => p.stepId === s.stepId)
        .sort((a, b) => a.takenAt.getTime() - b.takenAt.getTime())
        .map((p) => ({
          step: `${s.position} ${s.title}`,
          phase: PHASE[p.phase],
          takenAtUtc: formatDateTimeUtc(p.takenAt),
          by: p.uploadedBy ?? "—",
          size: `${p.width} × ${p.height} px`,
          sha256: p.sha256,
        })),
    );
}

/** One photo as the appendix lists it, on the page and in the PDF alike. */
export function photoLine(r: PhotoAppendixRow): string {
  return `Step ${r.step}, ${r.phase}, ${r.takenAtUtc}, by ${r.by}, ${r.size}`;
}

export const PHOTO_APPENDIX_TITLE = "Appendix: photos kept with the record";
