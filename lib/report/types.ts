/**
 * Everything an acceptance report shows, already formatted as text where formatting is a
 * judgement (units, decimals). Built by the report service from the database and geometry/
 * results; rendered to PDF by lib/report/document.tsx and to HTML by the report page, so the two
 * always say the same thing.
 */
/** "recorded": a reading kept without a limit to judge it against. */
export type Decision = "pass" | "fail" | "undecided" | "not_measured" | "recorded";

export interface ReportSignature {
  name: string;
  role: string;
  meaning: string;
  /** ISO 8601 UTC; shown with its zone. */
  signedAtUtc: string;
}

export interface ReportData {
  reportId: string;
  reference: string;
  revision: number;
  amendment?: { supersedesRevision: number; reason: string };
  issuedAtUtc: string | null;
  issuer: { name: string; address?: string };
  customer: { name: string; site: string; address?: string };
  machine: { name: string; kind: string; builderModel?: string; serial?: string; control?: string };
  head: { serial: string; makerModel?: string; axes: string; nominalPivotLength: string; mass?: string };
  work: { kind: string; title: string; dates: string; airTemperature?: string; procedure: string; method: string; decisionRule: string };
  instruments: Array<{ kind: string; serial: string; resolution: string; uncertainty: string; calibrationDue: string; status: string }>;
  readings: Array<{ step: string; limits: string; pre?: string; post?: string; change?: string; decision: Decision; source: string }>;
  parameters: Array<{ name: string; symbol: string; value: string; expanded: string; tolerance?: string; decision: Decision; identifiable: string }>;
  testPart: Array<{ feature: string; characteristic: string; nominal: string; measured: string; deviation: string; limits: string; expanded: string; decision: Decision }>;
  figures: Array<{ caption: string; png: Buffer }>;
  remarks: string[];
  safety: string[];
  signatures: ReportSignature[];
  verifyUrl: string;
  /** SHA-256 of the canonical JSON of this data (the file's own hash cannot be inside the file). */
  contentSha256: string;
}
