/** Air and machine temperature at the machine, entered with the readings (API and tablet). */
import { z } from "zod";
import { PHASES } from "@/lib/domain/datasets";
import { zUuid } from "@/lib/domain/uuid";

/**
 * Temperatures a shop floor can have, °C. Outside this a digit slipped (or °F was typed); the
 * bounds are common practice for a plausibility check, not a published limit.
 */
export const PLAUSIBLE_TEMP_C = { min: -20, max: 60 } as const;

const temp = (what: string) =>
  z.preprocess(
    (v) => (v === "" || v === null ? undefined : typeof v === "string" ? v.trim().replace(",", ".") : v),
    z.coerce
      .number({ message: `Enter the ${what} temperature in °C as a number.` })
      .refine(Number.isFinite, `Enter the ${what} temperature in °C as a number.`)
      .refine(
        (t) => t >= PLAUSIBLE_TEMP_C.min && t <= PLAUSIBLE_TEMP_C.max,
        `The ${what} temperature must be between ${PLAUSIBLE_TEMP_C.min} and ${PLAUSIBLE_TEMP_C.max} °C (was °F typed?).`,
      )
      .optional(),
  );

export const environmentCreateSchema = z
  .object({
    phase: z.enum(PHASES, { message: "Say whether this is before or after the adjustment." }),
    airTempC: temp("air"),
    machineTempC: temp("machine"),
    note: z.preprocess(
      (v) => (typeof v === "string" && v.trim() === "" ? undefined : v),
      z.string().trim().max(500, "At most 500 characters.").optional(),
    ),
    takenAt: z.preprocess(
      (v) => (v === "" ? undefined : v),
      z.coerce.date({ message: "The time is not a date." }).optional(),
    ),
    clientId: z.preprocess((v) => (v === "" ? undefined : v), zUuid("clientId must be a UUID.").optional()),
  })
  .refine((v) => v.airTempC !== undefined || v.machineTempC !== undefined, {
    path: ["airTempC"],
    message: "Enter the air or the machine temperature.",
  });
export type EnvironmentCreateInput = z.infer<typeof environmentCreateSchema>;
