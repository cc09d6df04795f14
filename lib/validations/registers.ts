/** Register forms (administrator): instruments, users. Numbers from forms are coerced. */
import { z } from "zod";
import { ROLES } from "@/lib/auth/roles";

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, "Use a date like 2027-03-31.");

export const instrumentCreateSchema = z
  .object({
    kind: z.string().trim().min(2, "Say what kind of instrument it is.").max(120),
    serial: z.string().trim().min(1, "The serial is required.").max(80),
    maker: z.string().trim().max(120).optional(),
    quantityKind: z.enum(["length", "angle"]),
    /** In the unit below; stored canonically (mm or arcsec). */
    resolution: z.coerce.number({ message: "Enter a number." }).positive("The resolution must be positive."),
    standardUncertainty: z.coerce.number({ message: "Enter a number." }).positive("The standard uncertainty must be positive."),
    unit: z.enum(["mm", "in", "um", "arcsec"]),
    calibratedOn: isoDate.optional().or(z.literal("")),
    calibrationDueOn: isoDate,
    certificateRef: z.string().trim().max(120).optional(),
  })
  .refine((v) => (v.quantityKind === "angle") === (v.unit === "arcsec"), { path: ["unit"], message: "Angle instruments use arcsec; length instruments mm, in or µm." })
  .refine((v) => !v.calibratedOn || v.calibratedOn <= v.calibrationDueOn, { path: ["calibrationDueOn"], message: "The due date is before the calibration date." });

export const userInviteSchema = z
  .object({
    email: z.email({ message: "Enter an e-mail address." }).max(254),
    name: z.string().trim().min(2, "Enter the person's name.").max(120),
    role: z.enum(ROLES),
    customerId: z.preprocess((v) => (v === "" ? undefined : v), z.uuid().optional()),
  })
  .refine((v) => (v.role === "customer") === Boolean(v.customerId), { path: ["customerId"], message: "Customer users belong to a customer; staff to none." });

export const userUpdateSchema = z.object({
  userId: z.uuid(),
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
