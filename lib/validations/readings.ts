/** Input of a checklist reading, shared by the API, the server action and the tablet form. */
import { z } from "zod";
import { PHASES } from "@/lib/domain/datasets";
import { zUuid } from "@/lib/domain/uuid";

export const ENTRY_UNITS = ["mm", "in", "um", "arcsec"] as const;

const optionalText = (max: number) =>
  z.preprocess(
    (v) => (typeof v === "string" && v.trim() === "" ? undefined : v),
    z.string().trim().max(max, `At most ${max} characters.`).optional(),
  );

const optionalNumber = z.preprocess(
  (v) => (v === "" || v === null ? undefined : v),
  z.coerce.number({ message: "Enter a number." }).refine(Number.isFinite, "Enter a number.").optional(),
);

export const readingCreateSchema = z.object({
  stepId: zUuid("Choose a checklist step."),
  phase: z.enum(PHASES, { message: "Say whether this is before or after the adjustment." }),
  /** The value read (direct, angle over a distance, record steps); other kinds send none. */
  value: z.preprocess(
    (v) => (typeof v === "string" ? (v.trim() === "" ? undefined : v.trim().replace(",", ".")) : v),
    z.coerce
      .number({ message: "Enter the reading as a number." })
      .refine(Number.isFinite, "Enter the reading as a number.")
      .optional(),
  ),
  /** Yes/no check steps: the answer. */
  answer: z.preprocess(
    (v) => (v === "" || v === null ? undefined : typeof v === "string" ? v.trim().toLowerCase() : v),
    z.enum(["yes", "no"], { message: "Answer yes or no." }).optional(),
  ),
  /** Multi-point steps: the reading at each named point, in `unit` (checked per point on the server). */
  points: z
    .record(z.string().max(20), z.union([z.number(), z.string().max(40), z.null()]), {
      message: "points must map each point's name to its reading.",
    })
    .optional(),
  /** Note steps: the note; record steps: where the value applies (shim positions). */
  text: optionalText(2000),
  unit: z.enum(ENTRY_UNITS, { message: "The unit must be mm, in, um or arcsec." }),
  /** angle_over_distance steps: the travel the reading was taken over, in the travelUnit. */
  travel: optionalNumber,
  travelUnit: z.enum(["mm", "in"]).optional(),
  /** Required for steps read with an instrument (direct, angle over a distance, multi-point). */
  instrumentId: z.preprocess(
    (v) => (v === "" || v === null ? undefined : v),
    zUuid("Choose the instrument used from the register.").optional(),
  ),
  note: optionalText(2000),
  takenAt: z.preprocess(
    (v) => (v === "" ? undefined : v),
    z.coerce.date({ message: "The time of the reading is not a date." }).optional(),
  ),
  /** A correction: the reading this one replaces (it is kept, marked superseded). */
  supersedesId: z.preprocess((v) => (v === "" ? undefined : v), zUuid().optional()),
  /**
   * A correction made on the tablet of a reading that was itself still waiting to send: the
   * replaced reading named by its clientId (the queue sends in order, so it is stored first).
   */
  supersedesClientId: z.preprocess((v) => (v === "" ? undefined : v), zUuid().optional()),
  /** The id the device made when the reading was typed; sending it again returns the stored reading. */
  clientId: z.preprocess(
    (v) => (v === "" ? undefined : v),
    zUuid("clientId must be a UUID made on the device.").optional(),
  ),
  /** The device's clock when the reading was entered (orders readings of one step from several devices). */
  deviceTime: z.preprocess(
    (v) => (v === "" ? undefined : v),
    z.coerce.date({ message: "deviceTime is not a date." }).optional(),
  ),
});
export type ReadingCreateInput = z.infer<typeof readingCreateSchema>;
