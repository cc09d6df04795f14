import type { ReadinessInput } from "@/lib/report/readiness";

/**
 * A job with nothing to measure and no fit asked for, signed "performed" and "inspected" over its
 * current state: ready unless what a test adds (a TCP check, a positioning test) blocks it.
 */
export const signedEmptyJob: ReadinessInput = {
  jobId: "j",
  steps: [],
  instruments: [],
  datasets: [],
  requiresFit: false,
  approvedFit: null,
  results: [],
  signatures: [
    { meaning: "performed", signerName: "A", stateSha256: "s" },
    { meaning: "inspected", signerName: "B", stateSha256: "s" },
  ],
  currentStateSha256: "s",
  deviationSubjects: [],
};
