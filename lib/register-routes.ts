/**
 * The office's register API (`/api/customers`, `/api/sites`, `/api/machines`, `/api/heads`,
 * `/api/instruments`): the tables below name each register's query functions and zod schemas, and
 * these build the handlers with the same steps every time — who is asking, may they change this
 * register (403 before the body is read), the body, the query. Each route file is one line over
 * `registerCollectionApi` or `registerItemApi`. Reads and writes go through the same db/queries
 * functions, and so the same lib/policy rules, as the pages.
 */
import "server-only";
import type { z } from "zod";
import { createInstrument, listInstruments, updateInstrument } from "@/db/queries/instruments";
import * as lists from "@/db/queries/registers";
import * as admin from "@/db/queries/registers-admin";
import { signedInRoute } from "@/lib/auth/route";
import type { Actor } from "@/lib/domain/roles";
import { notFound } from "@/lib/errors";
import { readJson } from "@/lib/http";
import type { Register } from "@/lib/policy/registers";
import * as v from "@/lib/validations/registers";

/** `GET` answers `{ <plural>: [...] }`; `POST` answers 201 `{ <singular>: row }`. */
export function registerCollection<S extends z.ZodType>(o: {
  register: Register;
  plural: string;
  singular: string;
  list: (actor: Actor) => Promise<unknown[]>;
  schema: S;
  create: (actor: Actor, input: z.infer<S>) => Promise<unknown>;
}) {
  return {
    GET: signedInRoute(async (_req, actor) => {
      return Response.json({ [o.plural]: await o.list(actor) });
    }),
    POST: signedInRoute(async (req, actor) => {
      admin.assertRegisterEdit(actor, o.register);
      const input = o.schema.parse(await readJson(req));
      return Response.json({ [o.singular]: await o.create(actor, input) }, { status: 201 });
    }),
  };
}

/** `PATCH …/{id}`: a correction of the named fields → 200 `{ <singular>: row }`, 404 when there is no such row. */
export function registerItem<S extends z.ZodType>(o: {
  register: Register;
  singular: string;
  schema: S;
  update: (actor: Actor, id: string, input: z.infer<S>) => Promise<unknown>;
}) {
  return {
    PATCH: signedInRoute<{ id: string }>(async (req, actor, { id }) => {
      admin.assertRegisterEdit(actor, o.register);
      const input = o.schema.parse(await readJson(req));
      const row = await o.update(actor, id, input);
      if (!row) throw notFound(o.singular);
      return Response.json({ [o.singular]: row });
    }),
  };
}

type Create<S extends z.ZodType> = (actor: Actor, input: z.infer<S>) => Promise<unknown>;
type Update<S extends z.ZodType> = (actor: Actor, id: string, input: z.infer<S>) => Promise<unknown>;

/** A register's list, add schema and add query; the schema and the query are checked to match here. */
const adds = <S extends z.ZodType>(
  list: (actor: Actor) => Promise<unknown[]>,
  schema: S,
  create: Create<S>,
) => ({
  list,
  schema: schema as z.ZodType,
  create: create as Create<z.ZodType>,
});
/** A register's correction schema and query, checked to match. */
const corrects = <S extends z.ZodType>(schema: S, update: Update<S>) => ({
  schema: schema as z.ZodType,
  update: update as Update<z.ZodType>,
});

const ADD = {
  customers: adds(lists.listCustomersWithSites, v.customerCreateSchema, admin.createCustomer),
  sites: adds(lists.listSites, v.siteCreateSchema, admin.createSite),
  machines: adds(lists.listMachines, v.machineCreateSchema, admin.createMachine),
  heads: adds(lists.listHeads, v.headCreateSchema, admin.createHead),
  instruments: adds(listInstruments, v.instrumentCreateSchema, createInstrument),
};
const CORRECT: Record<RegisterApi, ReturnType<typeof corrects>> = {
  customers: corrects(v.customerPatchSchema, admin.updateCustomer),
  sites: corrects(v.sitePatchSchema, admin.updateSite),
  machines: corrects(v.machinePatchSchema, admin.updateMachine),
  heads: corrects(v.headPatchSchema, admin.updateHead),
  instruments: corrects(v.instrumentPatchSchema, updateInstrument),
};
/** Whose rule decides a change: sites belong to the customers register. */
const POLICY: Record<RegisterApi, Register> = {
  customers: "customers",
  sites: "customers",
  machines: "machines",
  heads: "heads",
  instruments: "instruments",
};
/** The path name of a register API (`/api/<name>`); its JSON keys are the name and the name less its "s". */
export type RegisterApi = keyof typeof ADD;

/** `GET` and `POST` of `/api/<name>`. */
export const registerCollectionApi = (name: RegisterApi) =>
  registerCollection({ register: POLICY[name], plural: name, singular: name.slice(0, -1), ...ADD[name] });

/** `PATCH` of `/api/<name>/{id}`. */
export const registerItemApi = (name: RegisterApi) =>
  registerItem({ register: POLICY[name], singular: name.slice(0, -1), ...CORRECT[name] });
