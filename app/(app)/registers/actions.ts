"use server";

import { revalidatePath } from "next/cache";
import type { HeadParameterKey } from "@/geometry";
import { z } from "zod";
import { createInstrument, recordCalibration, updateInstrument } from "@/db/queries/instruments";
import { createJobFromTemplate } from "@/db/queries/job-status";
import { mountHead } from "@/db/queries/heads-admin";
import {
  createCustomer,
  createHead,
  createMachine,
  createSite,
  updateCustomer,
  updateHead,
  updateMachine,
  updateSite,
} from "@/db/queries/registers-admin";
import { createTemplateVersion } from "@/db/queries/templates";
import { inviteUser, updateUser } from "@/db/queries/users-admin";
import { action } from "@/lib/actions";
import { DECISION_RULES } from "@/lib/domain/decisions";
import { JOB_KINDS } from "@/lib/domain/jobs";
import { jobOpenFormRefusal } from "@/lib/policy/jobs";
import { registerEditRefusal } from "@/lib/policy/registers";
import { invalid, notFound } from "@/lib/errors";
import { toCanonical } from "@/lib/units";
import {
  calibrationFormSchema,
  customerCreateSchema,
  retireFormSchema,
  headCreateSchema,
  instrumentCreateSchema,
  machineCreateSchema,
  siteCreateSchema,
  userInviteSchema,
  userUpdateSchema,
} from "@/lib/validations/registers";
import { zUuid } from "@/lib/domain/uuid";

export const createInstrumentAction = action(
  { schema: instrumentCreateSchema, refusal: (a) => registerEditRefusal(a, "instruments") },
  async (input, actor) => {
    const row = await createInstrument(actor, input);
    revalidatePath("/registers/instruments");
    return { id: row.id };
  },
);

export const inviteUserAction = action(
  { schema: userInviteSchema, refusal: (a) => registerEditRefusal(a, "people") },
  async (input, actor) => {
    const { userId } = await inviteUser(actor, input);
    revalidatePath("/registers/people");
    // The token goes out only in the e-mail.
    return { userId };
  },
);

export const updateUserAction = action(
  { schema: userUpdateSchema, refusal: (a) => registerEditRefusal(a, "people") },
  async (input, actor) => {
    const r = await updateUser(actor, input);
    revalidatePath("/registers/people");
    return r;
  },
);

const limit = z.preprocess(
  (v) => (v === "" || v == null ? null : typeof v === "string" ? v.replace(",", ".") : v),
  z.coerce.number({ message: "Enter a number or leave it empty." }).nullable(),
);

/** Form fields step.<position>.<field>; lengths in `unit` (mm or in), angles in arcsec. */
const templateVersionSchema = z
  .object({ templateId: zUuid(), unit: z.enum(["mm", "in"]) })
  .catchall(z.unknown());

const LIMIT_SOURCES = ["standard", "maker_manual", "common_practice", "customer_spec"] as const;
function invalidSource(p: number): never {
  throw invalid(`Step ${p}: say where the limit comes from.`, [
    { field: `step.${p}.limitSource`, message: "Choose a source." },
  ]);
}

export const createTemplateVersionAction = action(
  { schema: templateVersionSchema, refusal: (a) => registerEditRefusal(a, "procedures") },
  async (input, actor) => {
    const positions = new Set<number>();
    for (const k of Object.keys(input)) {
      const m = /^step\.(\d+)\./.exec(k);
      if (m) positions.add(Number(m[1]));
    }
    const edits = [...positions].map((p) => {
      const get = (f: string) => (input as Record<string, unknown>)[`step.${p}.${f}`];
      const kind = get("kind") === "angle" ? "angle" : "length";
      const conv = (v: number | null) =>
        v == null ? null : kind === "angle" ? v : toCanonical(v, input.unit);
      const lo = limit.safeParse(get("lowerLimit"));
      const hi = limit.safeParse(get("upperLimit"));
      if (!lo.success || !hi.success)
        throw invalid(`Step ${p}: a limit is not a number.`, [
          {
            field: `step.${p}.${lo.success ? "upperLimit" : "lowerLimit"}`,
            message: "Enter a number or leave it empty.",
          },
        ]);
      return {
        position: p,
        lowerLimit: conv(lo.data),
        upperLimit: conv(hi.data),
        decisionRule: get("decisionRule") === "guarded" ? ("guarded" as const) : ("simple" as const),
        limitSource: LIMIT_SOURCES.find((x) => x === get("limitSource")) ?? invalidSource(p),
        limitSourceNote:
          typeof get("limitSourceNote") === "string" && (get("limitSourceNote") as string).trim()
            ? (get("limitSourceNote") as string).trim().slice(0, 500)
            : null,
      };
    });
    // Head parameter limits: fields param.<key>.*, in µm or arc seconds as the key says.
    const keys = new Set<string>();
    for (const k of Object.keys(input)) {
      const m = /^param\.([a-z_]+)\./.exec(k);
      if (m) keys.add(m[1]!);
    }
    const parameterEdits = [...keys].map((key) => {
      const get = (f: string) => (input as Record<string, unknown>)[`param.${key}.${f}`];
      const lo = limit.safeParse(get("lowerLimit"));
      const hi = limit.safeParse(get("upperLimit"));
      if (!lo.success || !hi.success)
        throw invalid(`${key}: a limit is not a number.`, [
          {
            field: `param.${key}.${lo.success ? "upperLimit" : "lowerLimit"}`,
            message: "Enter a number or leave it empty.",
          },
        ]);
      const note = get("limitSourceNote");
      return {
        parameter: key as HeadParameterKey,
        lowerLimit: lo.data,
        upperLimit: hi.data,
        decisionRule: get("decisionRule") === "guarded" ? ("guarded" as const) : ("simple" as const),
        limitSource: LIMIT_SOURCES.find((x) => x === get("limitSource")) ?? "customer_spec",
        limitSourceNote: typeof note === "string" && note.trim() ? note.trim().slice(0, 500) : null,
      };
    });
    const t = await createTemplateVersion(actor, input.templateId, edits, parameterEdits);
    revalidatePath("/registers/procedures");
    return { id: t.id, version: t.version };
  },
);

const jobCreateSchema = z.object({
  templateId: zUuid("Choose a procedure."),
  machineId: zUuid("Choose a host machine."),
  headId: zUuid("Choose a head."),
  kind: z.enum(JOB_KINDS),
  title: z.string().trim().min(3, "Give the job a title.").max(200),
  assignedInstallerId: z.preprocess((v) => (v === "" ? undefined : v), zUuid().optional()),
  decisionRule: z.enum(DECISION_RULES),
});

export const createJobAction = action(
  { schema: jobCreateSchema, refusal: jobOpenFormRefusal },
  async (input, actor) => {
    const job = await createJobFromTemplate(actor, input);
    revalidatePath("/jobs");
    return { id: job.id, reference: job.reference };
  },
);

export const mountHeadAction = action(
  {
    schema: z.object({
      headId: zUuid(),
      machineId: z.preprocess((v) => (v === "" ? null : v), zUuid().nullable()),
    }),
    refusal: (a) => registerEditRefusal(a, "heads"),
  },
  async ({ headId, machineId }, actor) => {
    const r = await mountHead(actor, headId, machineId);
    revalidatePath(`/registers/heads/${headId}`);
    return r;
  },
);

export const createCustomerAction = action(
  { schema: customerCreateSchema, refusal: (a) => registerEditRefusal(a, "customers") },
  async (input, actor) => {
    const r = await createCustomer(actor, input);
    revalidatePath("/registers");
    return { id: r.id };
  },
);
export const createSiteAction = action(
  { schema: siteCreateSchema, refusal: (a) => registerEditRefusal(a, "customers") },
  async (input, actor) => {
    const r = await createSite(actor, input);
    revalidatePath("/registers");
    return { id: r.id };
  },
);
export const createMachineAction = action(
  { schema: machineCreateSchema, refusal: (a) => registerEditRefusal(a, "machines") },
  async (input, actor) => {
    const r = await createMachine(actor, input);
    revalidatePath("/registers");
    return { id: r.id };
  },
);
export const createHeadAction = action(
  { schema: headCreateSchema, refusal: (a) => registerEditRefusal(a, "heads") },
  async (input, actor) => {
    const r = await createHead(actor, input);
    revalidatePath("/registers");
    revalidatePath("/registers/heads");
    return { id: r.id };
  },
);

/** Retire a register row, or bring it back: the same correction as `PATCH …/{id}` `{ retired }`. */
export const retireRegisterRowAction = action(
  { schema: retireFormSchema, refusal: (a) => registerEditRefusal(a, "customers") },
  async ({ register, id, retired }, actor) => {
    const update = {
      customers: updateCustomer,
      sites: updateSite,
      machines: updateMachine,
      heads: updateHead,
      instruments: updateInstrument,
    }[register];
    const row = await update(actor, id, { retired });
    if (!row) throw notFound("record");
    revalidatePath("/registers", "layout");
    return { retired };
  },
);

/** Record a recalibration from the instruments page; the instrument is back in use. */
export const recordCalibrationAction = action(
  { schema: calibrationFormSchema, refusal: (a) => registerEditRefusal(a, "instruments") },
  async ({ instrumentId, ...input }, actor) => {
    const r = await recordCalibration(actor, instrumentId, input);
    if (!r) throw notFound("instrument");
    revalidatePath("/registers/instruments");
    return { id: r.calibration.id };
  },
);
