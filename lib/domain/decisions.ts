/**
 * Conformity decisions. geometry/decision.ts is the one source of the decision itself (pass, fail
 * or undecided under a declared rule); the checklist and the report add the outcomes that are not
 * decisions (nothing measured, or a value kept without a limit).
 */
import type { Decision, DecisionRule } from "@/geometry/decision";
import { closedSet } from "./closed-set";

export type { Decision, DecisionRule };

/** The decision rules a job or a limit is judged by (ISO 14253-1), with their names. */
export const { values: DECISION_RULES, labels: DECISION_RULE_LABELS } = closedSet({
  simple: "Simple acceptance",
  guarded: "Guarded acceptance (ISO 14253-1)",
} satisfies Record<DecisionRule, string>);

/** A rule in one word, where a table column or a select in a table row has no room for its name. */
export const DECISION_RULE_WORDS: Readonly<Record<DecisionRule, string>> = {
  simple: "Simple",
  guarded: "Guarded",
};

/** What each rule decides, in one sentence, wherever a page explains the rule it judged by. */
export const DECISION_RULE_MEANINGS: Readonly<Record<DecisionRule, string>> = {
  simple:
    "Simple acceptance: a value inside its limits passes and outside fails; the expanded uncertainty U is shown, not subtracted.",
  guarded:
    "Guarded acceptance (ISO 14253-1): a value passes only inside its limits narrowed by U, fails only outside them widened by U, and is undecided between, where neither conformance nor non-conformance is proven.",
};

/** A report line's outcome: a decision, nothing measured, or a reading kept without a limit. */
export type RecordedDecision = Decision | "not_measured" | "recorded";

/** A report line's outcome as the report prints it, online and in the PDF: a mark carries it without colour. */
export const RECORDED_DECISION_TEXT: Readonly<Record<RecordedDecision, string>> = {
  pass: "✓ Pass",
  fail: "✗ Fail",
  undecided: "? Undecided",
  not_measured: "– Not measured",
  recorded: "• Recorded",
};
