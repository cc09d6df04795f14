// The issuer's details (ISO/IEC 17025:2017 §7.8.2.1 b: the name and address of the laboratory)
// against the real database: the administrator keeps them through the settings form's action,
// with old and new values in the audit trail; other roles are refused and nothing changes; an
// empty name or address is a readiness blocker, so no report is issued without them; the issued
// report prints the issuer as the settings hold it.
import { desc, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { db } from "@/db";
import { getIssuer } from "@/db/queries/issuer";
import { getReadiness } from "@/db/queries/readiness";
import { getActor } from "@/db/queries/users";
import { auditEvents, issuerSettings } from "@/db/schema";
import type { Actor } from "@/lib/domain/roles";
import { formData, jobIdByReference, signInAs } from "./helpers";

vi.mock("next/cache", () => ({ revalidatePath: vi.fn(), revalidateTag: vi.fn() }));
const { updateIssuerSettingsAction } = await import("@/app/(app)/registers/settings/actions");

let original: Awaited<ReturnType<typeof getIssuer>>;
let engineer: Actor;
const filled = {
  name: "Issuer Test Ltd (invented)",
  address: "1 Test Street, Testville (invented)",
  contactEmail: "reports@issuer-test.example",
  contactPhone: "+44 1632 960 000",
  accreditation: "",
  reproductionStatement: "Reproduce only in full.",
};

beforeAll(async () => {
  original = await getIssuer();
  engineer = (await getActor((await signInAs("engineer@halvard.example"))!))!;
});
afterAll(async () => {
  await db
    .update(issuerSettings)
    .set({ ...original })
    .where(eq(issuerSettings.id, 1));
});

describe("issuer settings", () => {
  it("the demo seed fills the issuer's name and address", () => {
    expect(original.name).toBe("Halvard Field Service");
    expect(original.address).toMatch(/Halvard/);
  });

  it("the administrator saves them; the audit trail names old and new values", async () => {
    await signInAs("admin@halvard.example");
    const r = await updateIssuerSettingsAction(formData(filled));
    expect(r.ok).toBe(true);
    expect(await getIssuer()).toEqual(filled);
    const [ev] = await db
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.action, "issuer_settings.update"))
      .orderBy(desc(auditEvents.id))
      .limit(1);
    expect((ev!.oldValues as { name: string }).name).toBe(original.name);
    expect((ev!.newValues as { name: string }).name).toBe(filled.name);
  });

  it("a bad e-mail is refused for its field and nothing is stored", async () => {
    await signInAs("admin@halvard.example");
    const r = await updateIssuerSettingsAction(
      formData({ ...filled, name: "Changed", contactEmail: "not-mail" }),
    );
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.fieldErrors?.contactEmail).toBeDefined();
    expect((await getIssuer()).name).toBe(filled.name);
  });

  for (const who of ["engineer", "inspector", "installer", "buyer"] as const) {
    it(`${who} is refused and nothing changes`, async () => {
      await signInAs(who === "buyer" ? "buyer@marlowcreek.example" : `${who}@halvard.example`);
      const r = await updateIssuerSettingsAction(formData({ ...filled, name: `Set by ${who}` }));
      expect(r).toMatchObject({ ok: false, code: "forbidden" });
      expect((await getIssuer()).name).toBe(filled.name);
    });
  }

  it("an empty name or address blocks issuing, naming what is missing", async () => {
    const jobId = await jobIdByReference("TR-2026-0052");
    const codes = async () => (await getReadiness(engineer, jobId))!.blockers;
    expect((await codes()).map((b) => b.code)).not.toContain("issuer_details_missing");
    await signInAs("admin@halvard.example");
    expect((await updateIssuerSettingsAction(formData({ ...filled, address: "  " }))).ok).toBe(true);
    const missing = (await codes()).filter((b) => b.code === "issuer_details_missing");
    expect(missing).toHaveLength(1);
    expect(missing[0]!.message).toMatch(/address/);
    expect(missing[0]!.message).not.toMatch(/name and/);
    expect(missing[0]!.href).toBe("/registers/settings");
    expect((await updateIssuerSettingsAction(formData({ ...filled, name: "", address: "" }))).ok).toBe(true);
    expect((await codes()).find((b) => b.code === "issuer_details_missing")!.message).toMatch(
      /name and address/,
    );
  });
});
