/** The upload panel's state and its transitions, in one reducer instead of sixteen setters. */
import type { CsvScan } from "./csv-scan";
import { COLUMNS, guessMapping, type DatasetKindKey } from "./kinds";
import type { Issue } from "./upload-checks";
import type { HeadAxisRole } from "@/lib/domain/positioning";

export type Units = { units: "mm" | "in"; travel: "mm" | "in"; reading: "um" | "mm" | "in" };

export interface UploadState {
  kind: DatasetKindKey;
  phase: "pre" | "post";
  units: Units;
  radius: string;
  /** The test part's U in mm, or the rotary positioning test's U in arc seconds. */
  uncertainty: string;
  /** Which of the head's axes a rotary positioning file is about. */
  axis: HeadAxisRole;
  comma: boolean;
  file: File | null;
  scan: CsvScan | null;
  scanProgress: number;
  scanning: boolean;
  mapping: Record<string, number>;
  mappingOpen: boolean;
  uploadProgress: number | null;
  serverIssues: Issue[];
  message: string | null;
}

export const initialUploadState: UploadState = {
  kind: "test_part",
  phase: "post",
  units: { units: "mm", travel: "mm", reading: "um" },
  radius: "",
  uncertainty: "",
  axis: "primary",
  comma: false,
  file: null,
  scan: null,
  scanProgress: 0,
  scanning: false,
  mapping: {},
  mappingOpen: false,
  uploadProgress: null,
  serverIssues: [],
  message: null,
};

export type UploadAction =
  | {
      type: "set";
      patch: Partial<
        Pick<
          UploadState,
          "phase" | "units" | "radius" | "uncertainty" | "axis" | "comma" | "mappingOpen" | "scanProgress"
        >
      >;
    }
  | { type: "map"; column: string; index: number }
  | { type: "kind"; kind: DatasetKindKey }
  | { type: "pick"; file: File | null }
  | { type: "scanned"; scan: CsvScan }
  | { type: "scanFailed" }
  | { type: "sending" }
  | { type: "progress"; fraction: number }
  | { type: "refused"; message: string; issues: Issue[] };

const missingRequired = (kind: DatasetKindKey, m: Record<string, number>) =>
  COLUMNS[kind].some((c) => c.required && (m[c.name] ?? -1) < 0);

export function uploadReducer(s: UploadState, a: UploadAction): UploadState {
  switch (a.type) {
    case "set":
      return { ...s, ...a.patch };
    case "map":
      return { ...s, mapping: { ...s.mapping, [a.column]: a.index } };
    case "kind": {
      if (!s.scan) return { ...s, kind: a.kind, serverIssues: [] };
      const mapping = guessMapping(a.kind, s.scan.headers);
      return {
        ...s,
        kind: a.kind,
        serverIssues: [],
        mapping,
        mappingOpen: s.mappingOpen || missingRequired(a.kind, mapping),
      };
    }
    case "pick":
      return {
        ...s,
        file: a.file,
        scan: null,
        serverIssues: [],
        message: null,
        uploadProgress: null,
        scanning: a.file !== null,
        scanProgress: 0,
      };
    case "scanned": {
      const mapping = guessMapping(s.kind, a.scan.headers);
      return {
        ...s,
        scan: a.scan,
        scanning: false,
        mapping,
        mappingOpen: missingRequired(s.kind, mapping),
        comma: a.scan.looksDecimalComma,
      };
    }
    case "scanFailed":
      return {
        ...s,
        scanning: false,
        message: "The file could not be read in the browser. Is it a CSV text file?",
      };
    case "sending":
      return { ...s, uploadProgress: 0, message: null, serverIssues: [] };
    case "progress":
      return { ...s, uploadProgress: a.fraction };
    case "refused":
      return { ...s, uploadProgress: null, message: a.message, serverIssues: a.issues };
  }
}
