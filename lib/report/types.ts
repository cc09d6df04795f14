/**
 * Everything an acceptance report shows, already formatted as text where formatting is a
 * judgement (units, decimals). Built by the report service from the database and geometry/
 * results; rendered to PDF by lib/report/document.tsx and to HTML by the report page, so the two
 * always say the same thing.
 */
import type { RecordedDecision } from "@/lib/domain/decisions";
import type { PhotoAppendixRow } from "./sections/photo-rows";
import type { ReportRecords } from "@/lib/report/sections/records";
import type { ReportBudget } from "@/lib/report/sections/budget";
import type { ReportPositioningTest } from "@/lib/report/sections/positioning";
import type { ReportControlValues } from "@/lib/report/sections/control";

/** geometry's decision, or "not_measured", or "recorded": a reading kept without a limit to judge it against. */
export type Decision = RecordedDecision;

export interface ReportSignature {
  name: string;
  role: string;
  meaning: string;
  /** ISO 8601 UTC; shown with its zone. */
  signedAtUtc: string;
}

export interface ReportData {
  /** A draft preview: printed with a DRAFT watermark, no signatures and no verification block; never stored. */
  draft?: boolean;
  reportId: string;
  reference: string;
  revision: number;
  amendment?: { supersedesRevision: number; reason: string };
  issuedAtUtc: string | null;
  issuer: { name: string; address?: string; contact?: string };
  customer: { name: string; site: string; address?: string };
  machine: { name: string; kind: string; builderModel?: string; serial?: string; control?: string };
  head: { serial: string; makerModel?: string; axes: string; nominalPivotLength: string; mass?: string };
  work: {
    kind: string;
    title: string;
    dates: string;
    airTemperature?: string;
    procedure: string;
    method: string;
    decisionRule: string;
  };
  instruments: Array<{
    kind: string;
    serial: string;
    resolution: string;
    uncertainty: string;
    calibrationDue: string;
    status: string;
  }>;
  readings: Array<{
    step: string;
    limits: string;
    pre?: string;
    post?: string;
    change?: string;
    decision: Decision;
    source: string;
    /** The decision rule and limit source of a judged row; absent in reports issued before it was printed. */
    basis?: string;
    /** The counting reading's expanded uncertainty, or "—" with the reason; absent in older reports. */
    expanded?: string;
    /** A multi-point step's points as entered, per phase ("After: 12: 0.004 · 3: 0.006 … mm"); absent otherwise. */
    points?: string;
  }>;
  parameters: Array<{
    name: string;
    symbol: string;
    value: string;
    expanded: string;
    tolerance?: string;
    limitSource?: string;
    decision: Decision;
    identifiable: string;
    basis?: string;
  }>;
  testPart: Array<{
    feature: string;
    characteristic: string;
    nominal: string;
    measured: string;
    deviation: string;
    limits: string;
    expanded: string;
    decision: Decision;
    basis?: string;
  }>;
  /**
   * Pictures saved by the engineer (the 3D view): named by the SHA-256 of the PNG, whose bytes are
   * handed to the renderer beside the data, so the signed content hash covers the picture.
   */
  figures: ReportFigure[];
  /** Charts drawn from numbers (vector in the PDF, SVG online); absent in reports issued before charts existed. */
  charts?: ReportCharts;
  /**
   * The statement of conformity (ISO/IEC 17025:2017 §7.8.6), from the judged rows and the recorded
   * deviations; absent in reports issued before it existed.
   */
  conformity?: {
    verdict: "conforms" | "conforms_with_deviations" | "does_not_conform" | "not_judged";
    text: string;
  };
  /** Results carried as deviations, each with its written justification and the approving engineer. */
  deviations?: Array<{
    result: string;
    decision: string;
    justification: string;
    approvedBy: string;
    recordedAtUtc: string;
  }>;
  /** Record details and traceability (ISO/IEC 17025:2017 §7.8.2.1); absent in reports issued before them. */
  records?: ReportRecords;
  /** The control's values as found, to enter and as left; absent when none were recorded. */
  controlValues?: ReportControlValues;
  /** The approved fit's uncertainty budget; absent without an approved fit. */
  budget?: ReportBudget;
  /** ISO 230-2 positioning of the rotary axes (5.4), one test per axis; absent when none is stored. */
  rotaryPositioning?: ReportPositioningTest[];
  remarks: string[];
  /** Photos of the steps that ask for one (lib/report/sections/photo-rows.ts); absent when none. */
  photos?: PhotoAppendixRow[];
  safety: string[];
  signatures: ReportSignature[];
  verifyUrl: string;
  /** SHA-256 of the canonical JSON of this data (the file's own hash cannot be inside the file). */
  contentSha256: string;
}

export interface ReportFigure {
  caption: string;
  /** SHA-256 of the PNG bytes, lower-case hex. */
  sha256: string;
  /** The saved view's id (its picture is served at /api/analysis-views/{id}/image). */
  viewId: string;
  widthPx: number;
  heightPx: number;
}

export interface ReportCharts {
  /** Each step with limits: its limits and the before and after values, in the unit the readings table uses (mm or ″). */
  readings?: Array<{
    step: string;
    lower: number | null;
    upper: number | null;
    pre: number | null;
    post: number | null;
    unit: string;
    /** decimals shown (default 1) */ digits?: number;
  }>;
  /** Each judged head parameter: value and U against its limits, in its own unit. */
  parameters?: Array<{
    symbol: string;
    value: number;
    U: number;
    lower: number | null;
    upper: number | null;
    unit: string;
    decision: Decision;
  }>;
  /** Residual magnitude per pose (µm), at most a few hundred points (the largest of each bucket), with s and the 3 s outlier line. */
  residuals?: { valuesUm: number[]; totalPoses: number; sUm: number; perPoint: number };
}

export type { VerificationResult } from "@/lib/domain/reports";
