/**
 * A set of the control's kinematic values as the engineer types them: in the control's units
 * (mm or in for lengths, degrees for angles). Unknown keys are refused by name, never dropped.
 */
import { z } from "zod";
import { CONTROL_VALUE_DEFS, CONTROL_VALUE_STAGES, type ControlValueKey } from "@/lib/domain/control-values";

/** Largest magnitude accepted: a length of 2 m (a pivot longer than any head) or a full turn. */
export const CONTROL_VALUE_MAX = { length_mm: 2000, angle_deg: 360 } as const;

const number = (label: string) =>
  z.preprocess(
    (v) => (typeof v === "string" ? v.trim().replace(",", ".") : v),
    z.coerce
      .number({ message: `${label}: enter a number.` })
      .refine(Number.isFinite, `${label}: enter a number.`),
  );

const valueShape = Object.fromEntries(
  CONTROL_VALUE_DEFS.map((d) => [d.key, number(d.label).optional()]),
) as Record<ControlValueKey, z.ZodOptional<ReturnType<typeof number>>>;

export const controlValuesRecordSchema = z
  .object({
    stage: z.enum(CONTROL_VALUE_STAGES, { message: "Say whether these are the values as found or as left." }),
    unitSystem: z.enum(["metric", "inch"], { message: "Say whether the control works in mm or in inch." }),
    values: z
      .object(valueShape)
      .strict()
      .refine((v) => Object.values(v).some((x) => x !== undefined), "Enter at least one value."),
    note: z.preprocess(
      (v) => (typeof v === "string" && v.trim() === "" ? undefined : v),
      z.string().trim().max(2000, "At most 2000 characters.").optional(),
    ),
  })
  .superRefine((body, ctx) => {
    for (const d of CONTROL_VALUE_DEFS) {
      const v = body.values[d.key];
      if (v === undefined) continue;
      const mm = d.kind === "length" && body.unitSystem === "inch" ? v * 25.4 : v;
      const max = d.kind === "length" ? CONTROL_VALUE_MAX.length_mm : CONTROL_VALUE_MAX.angle_deg;
      if (Math.abs(mm) > max)
        ctx.addIssue({
          code: "custom",
          path: ["values", d.key],
          message: `${d.label}: outside ±${max} ${d.kind === "length" ? "mm" : "°"}.`,
        });
    }
  });
export type ControlValuesRecordInput = z.infer<typeof controlValuesRecordSchema>;
