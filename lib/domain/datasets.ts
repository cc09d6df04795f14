/** Uploaded datasets: their kinds, the two phases of the work, and the list row pages show. */
import { closedSet } from "./closed-set";

export const { values: DATASET_KINDS, labels: DATASET_KIND_LABELS } = closedSet({
  sphere_probe: "Sphere probing",
  tram: "Indicator tram",
  sweep: "Indicator sweep",
  test_part: "Test-part measurements",
  tcp_check: "Tool-centre-point check",
  rotary_positioning: "Rotary positioning (ISO 230-2)",
});
export type DatasetKind = (typeof DATASET_KINDS)[number];

/** What a stored analysis is: today only the head fit of a sphere-probe dataset. */
export const { values: ANALYSIS_KINDS, labels: ANALYSIS_KIND_LABELS } = closedSet({ head_fit: "Head fit" });

/** The CSV format each kind is read with: a TCP check is sphere-probe data (geometry/README.md). */
export const CSV_FORMAT_OF = {
  sphere_probe: "sphere_probe",
  tram: "tram",
  sweep: "sweep",
  test_part: "test_part",
  tcp_check: "sphere_probe",
  rotary_positioning: "rotary_positioning",
} as const satisfies Record<DatasetKind, string>;

export const DATASET_STATUSES = ["stored", "deleted"] as const;
export type DatasetStatus = (typeof DATASET_STATUSES)[number];

/** Before or after the adjustment: readings, datasets and fits each belong to one. */
export const { values: PHASES, labels: PHASE_LABELS } = closedSet({
  pre: "Before adjustment",
  post: "After adjustment",
});
export type Phase = (typeof PHASES)[number];

/** The same in running text ("the before adjustment reading"). */
export function phaseText(phase: Phase): string {
  return PHASE_LABELS[phase].toLowerCase();
}

/** One dataset as the job's data page lists it. */
export interface DatasetListRow {
  id: string;
  jobId: string;
  kind: DatasetKind;
  phase: Phase;
  status: DatasetStatus;
  rows: number;
  sha256: string;
  sizeBytes: number;
  originalFilename: string;
  units: unknown;
  warnings: string[];
  uploadedAt: Date;
  deletedAt: Date | null;
  uploaderName: string | null;
}
