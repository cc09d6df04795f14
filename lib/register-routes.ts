/**
 * The office's register API (`/api/customers`, `/api/sites`, `/api/machines`, `/api/heads`,
 * `/api/instruments`): each route file names its register, its query functions and its zod
 * schema, and these build the handlers with the same steps every time — who is asking, may they
 * change this register (403 before the body is read), the body, the query. Reads and writes go
 * through the same db/queries functions, and so the same lib/policy rules, as the pages.
 */
import "server-only";
import type { z } from "zod";
import { assertRegisterEdit } from "@/db/queries/registers-admin";
import { requireUser } from "@/lib/auth/session";
import type { Actor } from "@/lib/domain/roles";
import { notFound } from "@/lib/errors";
import { readJson, route } from "@/lib/http";
import type { Register } from "@/lib/policy/registers";

type IdCtx = { params: Promise<{ id: string }> };

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
    GET: route(async () => {
      const actor = await requireUser();
      return Response.json({ [o.plural]: await o.list(actor) });
    }),
    POST: route(async (req) => {
      const actor = await requireUser();
      assertRegisterEdit(actor, o.register);
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
    PATCH: route<IdCtx>(async (req, ctx) => {
      const { id } = await ctx.params;
      const actor = await requireUser();
      assertRegisterEdit(actor, o.register);
      const input = o.schema.parse(await readJson(req));
      const row = await o.update(actor, id, input);
      if (!row) throw notFound(o.singular);
      return Response.json({ [o.singular]: row });
    }),
  };
}
