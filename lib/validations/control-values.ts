/**
 * A set of the control's kinematic values as the engineer types them: in the control's units
 * (mm or in for lengths, degrees for angles). Unknown keys are refused by name, never dropped.
 */
import { z } from "zod";
import { zUuid } from "@/lib/domain/uuid";
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

const optionalNumber = (label: string) =>
  z.preprocess((v) => (typeof v === "string" && v.trim() === "" ? undefined : v), number(label).optional());

/**
 * The page's form: one flat field per control value (empty = not recorded), turned into the same
 * record the API takes, so both paths check the same ranges.
 */
export const controlValuesFormSchema = z
  .object({
    jobId: zUuid("No such job."),
    stage: z.enum(CONTROL_VALUE_STAGES, { message: "Say whether these are the values as found or as left." }),
    unitSystem: z.enum(["metric", "inch"], { message: "Say whether the control works in mm or in inch." }),
    note: z.string().trim().max(2000, "At most 2000 characters.").optional(),
    ...(Object.fromEntries(CONTROL_VALUE_DEFS.map((d) => [d.key, optionalNumber(d.label)])) as Record<
      ControlValueKey,
      ReturnType<typeof optionalNumber>
    >),
  })
  .transform((f, ctx) => {
    const values = Object.fromEntries(
      CONTROL_VALUE_DEFS.flatMap((d) => (f[d.key] === undefined ? [] : [[d.key, f[d.key]]])),
    );
    const parsed = controlValuesRecordSchema.safeParse({
      stage: f.stage,
      unitSystem: f.unitSystem,
      values,
      note: f.note,
    });
    if (parsed.success) return { jobId: f.jobId, record: parsed.data };
    // Report each problem on the form's own field (values.pivot_length_mm → pivot_length_mm).
    for (const i of parsed.error.issues)
      ctx.addIssue({
        code: "custom",
        path: i.path[0] === "values" && i.path.length > 1 ? [i.path[1]!] : i.path,
        message: i.path.length === 1 && i.path[0] === "values" ? "Enter at least one value." : i.message,
      });
    return z.NEVER;
  });

const optionalId = z.preprocess((v) => (v === "" || v === null ? undefined : v), zUuid().optional());
const optionalRange = (label: string, max: number) =>
  z.preprocess(
    (v) => (typeof v === "string" && v.trim() === "" ? undefined : v),
    number(label)
      .refine((x) => x >= 0 && x <= max, `${label}: between 0 and ${max}.`)
      .optional(),
  );

/** The budget form: instruments from the register and the temperature band (ΔT in K, α in 10⁻⁶/K). */
export const budgetInputsFormSchema = z.object({
  jobId: zUuid("No such job."),
  analysisId: zUuid("No such analysis."),
  probeInstrumentId: optionalId,
  sphereInstrumentId: optionalId,
  presetterInstrumentId: optionalId,
  deltaTK: optionalRange("Temperature half-range", 50),
  alphaPpmPerK: optionalRange("Expansion coefficient", 100),
});
