/**
 * The report's control-values section as a pure view model: the control's values as found, the
 * values to enter from the approved fit and the values as left, with the flags, the sign
 * convention and the caution. Printed by lib/report/sections/control-pdf.tsx and
 * components/report/control-values-section.tsx.
 */
import { CONTROL_CAUTION, SIGN_CONVENTION, type ControlLoop } from "@/lib/control-values";
import { endSentence, formatDateTimeUtc } from "@/lib/format";
import { limitSourceWords } from "@/lib/fit-display";
import { judgementBasis } from "@/lib/report/build";
import type { Decision } from "@/lib/report/types";
import type { TcpCheckView } from "@/lib/tcp-check-display";

export interface ReportControlValues {
  unitSystem: "metric" | "inch";
  /** Where the values to enter come from, or why there are none. */
  basis: string;
  rows: Array<{
    setting: string;
    asFound: string;
    correction: string;
    toEnter: string;
    asLeft: string;
    /** The flag in words; "As computed" when as left matches the value to enter; empty before as left. */
    check: string;
  }>;
  recorded: string[];
  flagged: number;
  signConvention: string;
  caution: string;
  /** The latest tool-centre-point check after compensation, judged against the procedure's limits. */
  tcpCheck?: {
    file: string;
    basis: string;
    /** basis: the rule and the limit's source a judged row was judged by (as every judged row prints). */
    rows: Array<{ quantity: string; value: string; limit: string; decision: Decision; basis?: string }>;
    decision: Decision;
  };
}

export interface ControlRecordInput {
  createdAt: Date;
  recordedBy: string | null;
  note: string | null;
}

/** Null when neither as-found nor as-left values were recorded (the section is left out). */
export function controlValuesSection(input: {
  loop: ControlLoop;
  asFound: ControlRecordInput | null;
  asLeft: ControlRecordInput | null;
  approved: { approvedBy: string | null; approvedAt: Date } | null;
  asLeftStale: boolean;
  tcp?: { filename: string; uploadedAt: Date; view: TcpCheckView } | null;
  /** Where the procedure's TCP-check limits come from (procedure_templates), and its note. */
  tcpLimitSource?: { source: string | null; note: string | null } | null;
}): ReportControlValues | null {
  const { loop, asFound, asLeft, approved, tcp } = input;
  if (!asFound && !asLeft && !tcp) return null;
  const line = (what: string, r: ControlRecordInput | null) =>
    r
      ? `${what} recorded ${formatDateTimeUtc(r.createdAt)}${r.recordedBy ? ` by ${r.recordedBy}` : ""}${r.note ? `: ${endSentence(r.note)}` : "."}`
      : `${what}: not recorded.`;
  return {
    unitSystem: loop.unitSystem,
    basis: approved
      ? `Values to enter = as found + the correction from the head parameters approved by ${approved.approvedBy ?? "an engineer"} on ${formatDateTimeUtc(approved.approvedAt)}. Lengths in ${loop.unitSystem === "inch" ? "inch with mm beside" : "mm"}, angles in degrees with arc seconds beside.`
      : "No head parameters were approved, so no values to enter were computed.",
    rows: loop.rows
      .filter((r) => r.asFound !== null || r.asLeft !== null)
      .map((r) => ({
        setting: r.label,
        asFound: r.asFoundText,
        correction: r.correctionText,
        toEnter: r.toEnterText,
        asLeft: r.asLeftText,
        check: r.flag
          ? `${r.flagText}${r.flag === "differs" ? ` (${r.differenceText})` : ""}`
          : r.asLeft !== null
            ? "As computed"
            : "",
      })),
    recorded: [
      line("As found", asFound),
      line("As left", asLeft),
      ...(input.asLeftStale ? ["The as-left values were recorded against an earlier approval."] : []),
    ],
    flagged: loop.flagged.length,
    signConvention: SIGN_CONVENTION,
    caution: CONTROL_CAUTION,
    ...(tcp
      ? {
          tcpCheck: {
            file: tcp.filename,
            basis: `Sphere centres reported by the control with its tool-centre-point function on, ${tcp.view.poses} poses, uploaded ${formatDateTimeUtc(tcp.uploadedAt)}. Each figure is judged against the procedure's limit by simple acceptance.`,
            rows: tcp.view.rows.map((r) => {
              const from = input.tcpLimitSource?.source;
              const basis = judgementBasis(
                r.decision,
                "simple",
                from ? limitSourceWords(from, input.tcpLimitSource?.note) : "source not recorded",
              );
              return {
                quantity: r.quantity,
                value: r.valueText,
                limit: r.limitText,
                decision: r.decision,
                ...(basis ? { basis } : {}),
              };
            }),
            decision: tcp.view.decision,
          },
        }
      : {}),
  };
}
