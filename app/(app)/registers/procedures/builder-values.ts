/** Stored procedure rows → the builder's form values (every field a string, limits in the step's unit). */
import {
  headJudgingValues,
  type BuilderStep,
  type BuilderValues,
} from "@/components/procedures/builder-values";
import { stepInputFromRow, type StepRow } from "@/lib/validations/procedures";

const str = (v: string | number | null | undefined) => (v == null ? "" : String(v));

export function builderValuesFrom(
  t: Parameters<typeof headJudgingValues>[0] & {
    name: string;
    description: string | null;
    jobKinds: string[] | null;
    headModel: string | null;
    steps: (Omit<StepRow, "limitUnit" | "limitSource" | "derivation" | "pointResult" | "quantityKind"> & {
      limitUnit: string | null;
      limitSource: string;
      derivation: string;
      pointResult: string | null;
      quantityKind: string;
    })[];
  },
): BuilderValues {
  return {
    ...headJudgingValues(t),
    name: t.name,
    description: str(t.description),
    jobKinds: t.jobKinds ?? [],
    headModel: str(t.headModel),
    steps: t.steps.map((row): BuilderStep => {
      const s = stepInputFromRow(row as StepRow);
      return {
        title: s.title,
        kind: s.kind,
        instructions: str(s.instructions),
        safety: str(s.safety),
        quantity: str(s.quantity),
        unit: s.unit ?? "mm",
        lower: str(s.lower),
        upper: str(s.upper),
        decisionRule: s.decisionRule,
        limitSource: s.limitSource,
        limitSourceNote: str(s.limitSourceNote),
        points: (s.points ?? []).join(", "),
        pointResult: s.pointResult ?? "tir",
        distanceMm: str(s.distanceMm),
        recordUnit: str(s.recordUnit),
        photoRequired: s.photoRequired,
      };
    }),
  };
}
