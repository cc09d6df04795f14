// Database-level guarantees: the audit trail is append-only and hash-chained.
import { sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { appendAudit, verifyAuditChain } from "@/db/queries/audit";
import { dbError } from "./fixtures";

describe("audit trail", () => {
  it("refuses UPDATE and DELETE in the database itself", async () => {
    await db.transaction((tx) =>
      appendAudit(tx, {
        actorId: null,
        actorEmail: "test",
        action: "test.event",
        entityType: "test",
        entityId: "1",
      }),
    );
    expect(await dbError(db.execute(sql`update audit_events set action = 'changed'`))).toMatch(/append-only/);
    expect(await dbError(db.execute(sql`delete from audit_events`))).toMatch(/append-only/);
    expect(await dbError(db.execute(sql`truncate audit_events`))).toMatch(/append-only/);
  });

  it("chains every event to the one before and verifies", async () => {
    await db.transaction(async (tx) => {
      await appendAudit(tx, {
        actorId: null,
        actorEmail: "test",
        action: "a",
        entityType: "test",
        entityId: "2",
        newValues: { x: 1 },
      });
      await appendAudit(tx, {
        actorId: null,
        actorEmail: "test",
        action: "b",
        entityType: "test",
        entityId: "2",
        oldValues: { x: 1 },
        newValues: { x: 2 },
      });
    });
    const result = await verifyAuditChain(db);
    expect(result.checked).toBeGreaterThanOrEqual(3);
    expect(result.firstBrokenId).toBeNull();
  });

  it("names the first broken link when a row was altered behind the trigger's back", async () => {
    const { rows } = await db.execute<{ id: number }>(
      sql`select id from audit_events order by id limit 1 offset 1`,
    );
    const target = Number(rows[0]!.id);
    // Simulate tampering by someone who disabled the trigger (a superuser); then restore it.
    await db
      .transaction(async (tx) => {
        await tx.execute(sql`alter table audit_events disable trigger audit_events_no_update`);
        await tx.execute(sql`update audit_events set new_values = '{"tampered":true}' where id = ${target}`);
        const result = await verifyAuditChain(tx);
        expect(result.firstBrokenId).toBe(target);
        throw new Error("rollback");
      })
      .catch((e: Error) => expect(e.message).toBe("rollback"));
    expect((await verifyAuditChain(db)).firstBrokenId).toBeNull();
  });
});

describe("npm run audit:verify", () => {
  it("reports an intact chain with exit code 0", async () => {
    const { execFileSync } = await import("node:child_process");
    const out = execFileSync(
      "npx",
      ["tsx", "--import", "./lib/scripts/allow-server-only.mjs", "db/audit-verify.ts"],
      { env: process.env, encoding: "utf8" },
    );
    expect(out).toMatch(/audit trail intact: \d+ events/);
  });
});
