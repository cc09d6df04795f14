"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { createInstrument, recordCalibration, updateInstrument } from "@/db/queries/instruments";
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
import { inviteUser, updateUser } from "@/db/queries/users-admin";
import { action } from "@/lib/actions";
import type { Actor } from "@/lib/domain/roles";
import { registerEditRefusal, type Register } from "@/lib/policy/registers";
import { notFound } from "@/lib/errors";
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

/**
 * "Add …" on the registers page: the register's edit rule, then the new row, then the pages that
 * list it are refreshed.
 */
function registerCreateAction<S extends z.ZodType>(
  schema: S,
  register: Register,
  create: (actor: Actor, input: z.infer<S>) => Promise<{ id: string }>,
  listedOn: readonly string[] = ["/registers"],
) {
  return action({ schema, refusal: (a) => registerEditRefusal(a, register) }, async (input, actor) => {
    const r = await create(actor, input);
    for (const page of listedOn) revalidatePath(page);
    return { id: r.id };
  });
}

export const createCustomerAction = registerCreateAction(customerCreateSchema, "customers", createCustomer);
export const createSiteAction = registerCreateAction(siteCreateSchema, "customers", createSite);
export const createMachineAction = registerCreateAction(machineCreateSchema, "machines", createMachine);
export const createHeadAction = registerCreateAction(headCreateSchema, "heads", createHead, [
  "/registers",
  "/registers/heads",
]);

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
