/**
 * The office's job forms and JSON bodies: opening a job, editing its record fields, assigning the
 * installer, and the hold / release / cancel moves. One schema each, shared by the server actions,
 * the API routes and the forms (react-hook-form runs the same schema in the browser).
 */
import { z } from "zod";
import { DECISION_RULES } from "@/lib/domain/decisions";
import { JOB_KINDS, JOB_SORT_KEYS, JOB_STATUSES } from "@/lib/domain/jobs";
import { JOB_QUEUES } from "@/lib/policy/job-queues";
import { isTimeZone, zonedToUtc } from "@/lib/domain/schedule";
import { zUuid } from "@/lib/domain/uuid";

/** An empty form field means "none": stored as null. */
const blankToNull = (v: unknown) => (typeof v === "string" && v.trim() === "" ? null : v);
const optionalText = (max: number) =>
  z.preprocess(
    blankToNull,
    z.string().trim().max(max, `Use at most ${max} characters.`).nullable().optional(),
  );
const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, "Use a date like 2027-03-31.");

const recordFields = {
  orderReference: optionalText(120),
  customerContactName: optionalText(120),
  customerContactEmail: z.preprocess(
    blankToNull,
    z.email({ message: "Enter an e-mail address." }).max(254).nullable().optional(),
  ),
  /** The schedule: wall-clock date and time in the named IANA zone; all three or none. */
  scheduledDate: z.preprocess(blankToNull, isoDate.nullable().optional()),
  scheduledTime: z.preprocess(
    blankToNull,
    z
      .string()
      .regex(/^([01]\d|2[0-3]):[0-5]\d$/, "Use a 24-hour time like 08:30.")
      .nullable()
      .optional(),
  ),
  timeZone: z.preprocess(
    blankToNull,
    z
      .string()
      .refine(isTimeZone, "Not a time zone this server knows (use a name like Europe/Berlin).")
      .nullable()
      .optional(),
  ),
  assignedInstallerId: z.preprocess(blankToNull, zUuid("Choose an installer.").nullable().optional()),
  notes: optionalText(4000),
};

type ScheduleFields = {
  scheduledDate?: string | null | undefined;
  scheduledTime?: string | null | undefined;
  timeZone?: string | null | undefined;
};

/**
 * The schedule's fields go together: a date and a time need the zone they are in, and the time
 * must exist in that zone on that day. A zone alone (the form fills in the browser's) is no schedule.
 */
function checkSchedule(v: ScheduleFields, ctx: z.RefinementCtx) {
  if (!v.scheduledDate && !v.scheduledTime) return;
  if (!v.scheduledDate)
    ctx.addIssue({ code: "custom", path: ["scheduledDate"], message: "Give the date too." });
  if (!v.scheduledTime)
    ctx.addIssue({ code: "custom", path: ["scheduledTime"], message: "Give the time too." });
  if (!v.timeZone)
    ctx.addIssue({ code: "custom", path: ["timeZone"], message: "Give the time zone the time is in." });
  if (
    v.scheduledDate &&
    v.scheduledTime &&
    v.timeZone &&
    !zonedToUtc(v.scheduledDate, v.scheduledTime, v.timeZone)
  )
    ctx.addIssue({
      code: "custom",
      path: ["scheduledTime"],
      message: `That time does not exist in ${v.timeZone} on ${v.scheduledDate} (the clocks go forward); choose another.`,
    });
}

/**
 * The schedule as stored: the UTC instant and the zone, both null to clear (date and time given
 * empty); undefined = unchanged (neither date nor time given).
 */
export function scheduleOf(
  v: ScheduleFields,
): { scheduledFor: Date | null; timeZone: string | null } | undefined {
  if (v.scheduledDate === undefined && v.scheduledTime === undefined) return undefined;
  if (!v.scheduledDate || !v.scheduledTime || !v.timeZone) return { scheduledFor: null, timeZone: null };
  return { scheduledFor: zonedToUtc(v.scheduledDate, v.scheduledTime, v.timeZone), timeZone: v.timeZone };
}

/** "New job": where (customer → site → machine → head), what (kind, title, procedure, rule), and the office's fields. */
export const jobOpenSchema = z
  .object({
    customerId: z.preprocess(blankToNull, zUuid("Choose a customer.").nullable().optional()),
    siteId: z.preprocess(blankToNull, zUuid("Choose a site.").nullable().optional()),
    machineId: zUuid("Choose a host machine."),
    headId: zUuid("Choose a head."),
    kind: z.enum(JOB_KINDS, { message: "Choose the kind of job." }),
    title: z.string().trim().min(3, "Give the job a title.").max(200, "Use at most 200 characters."),
    templateId: zUuid("Choose a procedure."),
    decisionRule: z.enum(DECISION_RULES, { message: "Choose a decision rule." }),
    ...recordFields,
  })
  .superRefine(checkSchedule);
export type JobOpenInput = z.infer<typeof jobOpenSchema>;

/** Editing a job's record fields (PATCH /api/jobs/{id} and the job page): absent = unchanged. */
const editFields = {
  title: z.string().trim().min(3, "Give the job a title.").max(200, "Use at most 200 characters.").optional(),
  ...recordFields,
  conditionAsFound: optionalText(2000),
  nextRecheckOn: z.preprocess(blankToNull, isoDate.nullable().optional()),
};
export const jobRecordSchema = z.object(editFields).strict().superRefine(checkSchedule);
/** The job page's edit forms: the same fields, with the job they are about. */
export const jobRecordFormSchema = z
  .object({ jobId: zUuid(), ...editFields })
  .strict()
  .superRefine(checkSchedule);
export type JobRecordInput = z.infer<typeof jobRecordSchema>;

/** Hold, release and cancel: a reason is required to cancel, optional to hold. */
const moveVariants = <T extends z.ZodRawShape>(extra: T) =>
  z.discriminatedUnion("action", [
    z.object({ ...extra, action: z.literal("hold"), reason: optionalText(500) }).strict(),
    z.object({ ...extra, action: z.literal("release") }).strict(),
    z
      .object({
        ...extra,
        action: z.literal("cancel"),
        reason: z
          .string({ message: "Say why the job is cancelled." })
          .trim()
          .min(5, "Say why the job is cancelled (at least 5 characters).")
          .max(500, "Use at most 500 characters."),
      })
      .strict(),
  ]);
export const jobMoveSchema = moveVariants({});
export type JobMoveInput = z.infer<typeof jobMoveSchema>;
/** The job page's hold / release / cancel buttons. */
export const jobMoveFormSchema = moveVariants({ jobId: zUuid() });

/** The jobs board's URL (and GET /api/jobs): filters, sort, search, the role's queue and the page. */
export const jobBoardQuerySchema = z.object({
  status: z.enum(JOB_STATUSES).optional(),
  q: z.string().max(100).optional(),
  sort: z.enum(JOB_SORT_KEYS).optional(),
  dir: z.enum(["asc", "desc"]).optional(),
  queue: z.enum(JOB_QUEUES).optional(),
  page: z.coerce.number().int().min(1).max(1000).optional(),
  /** Without it a page holds 500 jobs; `total` says how many match. */
  pageSize: z.coerce.number().int().min(5).max(500).optional(),
});
export type JobBoardQuery = z.infer<typeof jobBoardQuerySchema>;
