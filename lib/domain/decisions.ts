/**
 * Conformity decisions. geometry/decision.ts is the one source of the decision itself (pass, fail
 * or undecided under a declared rule); the checklist and the report add the outcomes that are not
 * decisions (nothing measured, or a value kept without a limit).
 */
import type { Decision, DecisionRule } from "@/geometry/decision";

export type { Decision, DecisionRule };

export const DECISION_RULES = ["simple", "guarded"] as const satisfies readonly DecisionRule[];

/** A report line's outcome: a decision, nothing measured, or a reading kept without a limit. */
export type RecordedDecision = Decision | "not_measured" | "recorded";
