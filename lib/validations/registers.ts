/** Register forms (administrator): instruments, users. Numbers from forms are coerced. */
import { z } from "zod";
import { AXIS_LETTERS } from "@/lib/domain/heads";
import { ROLES } from "@/lib/domain/roles";
import { QUANTITY_KINDS } from "@/lib/domain/units";
import { zUuid } from "@/lib/domain/uuid";

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, "Use a date like 2027-03-31.");

const optionalNumber = z.preprocess(
  (v) => (v === "" || v === null ? undefined : typeof v === "string" ? v.trim().replace(",", ".") : v),
  z.coerce.number({ message: "Enter a number." }).refine(Number.isFinite, "Enter a number.").optional(),
);

const instrumentFields = z.object({
  kind: z.string().trim().min(2, "Say what kind of instrument it is.").max(120),
  serial: z.string().trim().min(1, "The serial is required.").max(80),
  maker: z.string().trim().max(120).optional(),
  quantityKind: z.enum(QUANTITY_KINDS),
  /** In the unit below; stored canonically (mm or arcsec). */
  resolution: z.coerce.number({ message: "Enter a number." }).positive("The resolution must be positive."),
  standardUncertainty: z.coerce
    .number({ message: "Enter a number." })
    .positive("The standard uncertainty must be positive."),
  unit: z.enum(["mm", "in", "um", "arcsec"]),
  calibratedOn: isoDate.optional().or(z.literal("")),
  calibrationDueOn: isoDate,
  certificateRef: z.string().trim().max(120).optional(),
  /** The span it reads over, in the unit above (empty: not stated, not checked on entry). */
  rangeMin: optionalNumber,
  rangeMax: optionalNumber,
});

const rangeInOrder = (v: { rangeMin?: number; rangeMax?: number }) =>
  v.rangeMin === undefined || v.rangeMax === undefined || v.rangeMin < v.rangeMax;
const rangeMessage = { path: ["rangeMax"], message: "The top of the range must be above its bottom." };

export const instrumentCreateSchema = instrumentFields
  .refine(rangeInOrder, rangeMessage)
  .refine((v) => (v.quantityKind === "angle") === (v.unit === "arcsec"), {
    path: ["unit"],
    message: "Angle instruments use arcsec; length instruments mm, in or µm.",
  })
  .refine((v) => !v.calibratedOn || v.calibratedOn <= v.calibrationDueOn, {
    path: ["calibrationDueOn"],
    message: "The due date is before the calibration date.",
  });

export const userInviteSchema = z
  .object({
    email: z.email({ message: "Enter an e-mail address." }).max(254),
    name: z.string().trim().min(2, "Enter the person's name.").max(120),
    role: z.enum(ROLES),
    customerId: z.preprocess((v) => (v === "" ? undefined : v), zUuid().optional()),
  })
  .refine((v) => (v.role === "customer") === Boolean(v.customerId), {
    path: ["customerId"],
    message: "Customer users belong to a customer; staff to none.",
  });

export const userUpdateSchema = z.object({
  userId: zUuid(),
  role: z.enum(ROLES).optional(),
  disabled: z.preprocess((v) => (v === "true" ? true : v === "false" ? false : v), z.boolean().optional()),
});

export const setPasswordSchema = z
  .object({
    token: z.string().min(20).max(200),
    password: z.string().min(10, "Use at least 10 characters.").max(200),
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The passwords do not match." });

const optional = (max: number) => z.string().trim().max(max).optional();

export const customerCreateSchema = z.object({
  name: z.string().trim().min(2, "Enter the customer's name.").max(200),
  contactEmail: z
    .union([z.email({ message: "Enter an e-mail address or leave it empty." }), z.literal("")])
    .optional(),
});
export const siteCreateSchema = z.object({
  customerId: zUuid("Choose a customer."),
  name: z.string().trim().min(1, "Name the site.").max(200),
  address: optional(400),
});
export const machineCreateSchema = z.object({
  siteId: zUuid("Choose a site."),
  name: z.string().trim().min(1, "Name the machine.").max(200),
  kind: z.string().trim().min(2, "Say what kind of machine it is.").max(100),
  builder: optional(200),
  model: optional(200),
  serial: optional(100),
  control: optional(200),
});
const headFields = z.object({
  serial: z.string().trim().min(1, "The serial is required.").max(80),
  maker: optional(200),
  model: optional(200),
  primaryAxis: z.enum(AXIS_LETTERS),
  secondaryAxis: z.enum(AXIS_LETTERS),
  nominalPivotLengthMm: z.coerce
    .number({ message: "Enter the nominal pivot length in mm." })
    .positive("The pivot length must be positive."),
  toolAxisOffsetMm: z.coerce.number({ message: "Enter a number (mm)." }).default(0),
  massKg: z.preprocess(
    (v) => (v === "" ? undefined : v),
    z.coerce.number().positive("The mass must be positive.").optional(),
  ),
});
export const headCreateSchema = headFields.refine((v) => v.primaryAxis !== v.secondaryAxis, {
  path: ["secondaryAxis"],
  message: "The secondary axis must differ from the primary.",
});

/**
 * Corrections through the office's API (`PATCH /api/<register>/{id}`): any subset of the fields
 * a row was created with, except what ties it to other records (a site's customer, a machine's
 * site, a head's axes, an instrument's quantity), and `retired: true | false`. Unknown fields are refused by name, so a typo
 * is not silently ignored; an empty body changes nothing and is refused too.
 */
const patch = <T extends z.ZodRawShape>(fields: z.ZodObject<T>) => {
  const known = new Set([...Object.keys(fields.shape), "retired"]);
  return fields
    .extend({ retired: z.boolean({ message: "Say true to retire the row, false to bring it back." }) })
    .partial()
    .catchall(z.unknown())
    .superRefine((v, ctx) => {
      const keys = Object.keys(v);
      for (const k of keys)
        if (!known.has(k))
          ctx.addIssue({
            code: "custom",
            path: [k],
            message: "This field does not exist or cannot be changed here.",
          });
      if (keys.length === 0)
        ctx.addIssue({ code: "custom", path: [], message: "Send at least one field to change." });
    });
};

export const customerPatchSchema = patch(customerCreateSchema);
export const sitePatchSchema = patch(siteCreateSchema.omit({ customerId: true }));
export const machinePatchSchema = patch(machineCreateSchema.omit({ siteId: true }));
export const headPatchSchema = patch(
  headFields
    .omit({ primaryAxis: true, secondaryAxis: true })
    // No default here: a correction that does not name the offset leaves it as it is.
    .extend({ toolAxisOffsetMm: z.coerce.number({ message: "Enter a number (mm)." }) }),
);
/** Resolution and uncertainty come with their unit; calibration is a record of its own. */
export const instrumentPatchSchema = patch(
  instrumentFields.pick({
    kind: true,
    serial: true,
    maker: true,
    resolution: true,
    standardUncertainty: true,
    unit: true,
    rangeMin: true,
    rangeMax: true,
  }),
)
  .refine(rangeInOrder, rangeMessage)
  .refine(
    (v) =>
      (v.resolution === undefined &&
        v.standardUncertainty === undefined &&
        v.rangeMin === undefined &&
        v.rangeMax === undefined) ||
      v.unit !== undefined,
    {
      path: ["unit"],
      message: "Give the unit of the resolution and uncertainty.",
    },
  );

/** `GET /api/users?role=`: the people register, optionally one role. */
export const userListQuerySchema = z.object({ role: z.enum(ROLES).optional() });

const calibrationFields = z.object({
  calibratedOn: isoDate,
  dueOn: isoDate,
  certificateRef: z.string().trim().min(1, "Give the certificate number.").max(120),
  laboratory: z.string().trim().min(2, "Name the laboratory that calibrated it.").max(200),
});
const dueAfter = (v: { calibratedOn: string; dueOn: string }) => v.calibratedOn < v.dueOn;
const dueAfterMessage = { path: ["dueOn"], message: "The due date must follow the calibration." };

/** `POST /api/instruments/{id}/calibrations`: one calibration, as its certificate states it. */
export const calibrationCreateSchema = calibrationFields.strict().refine(dueAfter, dueAfterMessage);
/** The register page's recalibration form: the same fields and the instrument. */
export const calibrationFormSchema = calibrationFields
  .extend({ instrumentId: zUuid() })
  .refine(dueAfter, dueAfterMessage);

/** The register pages' retire / bring back control. */
export const RETIRABLE_REGISTERS = ["customers", "sites", "machines", "heads", "instruments"] as const;
export const retireFormSchema = z.object({
  register: z.enum(RETIRABLE_REGISTERS),
  id: zUuid(),
  retired: z.enum(["true", "false"]).transform((v) => v === "true"),
});
