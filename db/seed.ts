/**
 * Demo data: an invented scenario for trying Trammel locally. Every company, person, machine and
 * number below is made up. Idempotent (upserts by natural keys); refused in production.
 *   npm run db:seed
 */
import { env } from "@/lib/env";
import { and, eq, sql } from "drizzle-orm";
import { db, pool } from "@/db";
import { hasRows, insertDemoJob } from "@/db/seed-helpers";
import { customers, heads, issuerSettings, jobs, machines, sites, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { seedReports } from "./seed-reports";
import type { Role } from "@/lib/domain/roles";

export const DEMO_PASSWORD = "trammel-demo";
export const SERVICE_COMPANY = "Halvard Field Service";

export const DEMO_USERS: ReadonlyArray<{ email: string; name: string; role: Role; customer?: string }> = [
  { email: "admin@halvard.example", name: "Ada Brennan", role: "admin" },
  { email: "installer@halvard.example", name: "Iver Sandvik", role: "installer" },
  { email: "inspector@halvard.example", name: "Ines Okafor", role: "inspector" },
  { email: "engineer@halvard.example", name: "Emil Haraldsen", role: "engineer" },
  {
    email: "buyer@marlowcreek.example",
    name: "Morgan Tate",
    role: "customer",
    customer: "Marlow Creek Aerostructures",
  },
  {
    email: "buyer@tollan.example",
    name: "Tomasz Lindqvist",
    role: "customer",
    customer: "Tollan Mold Works",
  },
];

async function upsertCustomer(name: string, contactEmail: string) {
  const [row] = await db
    .insert(customers)
    .values({ name, contactEmail })
    .onConflictDoUpdate({ target: customers.name, set: { contactEmail } })
    .returning();
  return row!;
}

async function ensureSite(customerId: string, name: string, address: string) {
  const found = await db
    .select()
    .from(sites)
    .where(and(eq(sites.customerId, customerId), eq(sites.name, name)))
    .limit(1);
  if (found[0]) return found[0];
  const [row] = await db.insert(sites).values({ customerId, name, address }).returning();
  return row!;
}

async function ensureMachine(siteId: string, values: Omit<typeof machines.$inferInsert, "siteId">) {
  const found = await db
    .select()
    .from(machines)
    .where(and(eq(machines.siteId, siteId), eq(machines.name, values.name)))
    .limit(1);
  if (found[0]) return found[0];
  const [row] = await db
    .insert(machines)
    .values({ ...values, siteId })
    .returning();
  return row!;
}

async function upsertHead(values: typeof heads.$inferInsert) {
  const [row] = await db
    .insert(heads)
    .values(values)
    .onConflictDoUpdate({ target: heads.serial, set: { machineId: values.machineId } })
    .returning();
  return row!;
}

export async function seed(): Promise<void> {
  if (env.NODE_ENV === "production" && env.TRAMMEL_ALLOW_SEED !== "1") {
    throw new Error("Refusing to seed demo data into a production database.");
  }
  // The issuer printed on the demo's reports (invented); only where none is set yet.
  await db
    .insert(issuerSettings)
    .values({
      id: 1,
      name: SERVICE_COMPANY,
      address: "7 Tinker's Yard, Halvard Industrial Estate, Halvard HV3 9QT (invented)",
      contactEmail: "reports@halvard.example",
      contactPhone: "+44 1632 960 417",
      accreditation: "",
      reproductionStatement:
        "This report shall not be reproduced except in full without the written approval of Halvard Field Service.",
    })
    .onConflictDoNothing();
  const marlow = await upsertCustomer("Marlow Creek Aerostructures", "buyer@marlowcreek.example");
  const tollan = await upsertCustomer("Tollan Mold Works", "buyer@tollan.example");
  const byCustomer: Record<string, string> = { [marlow.name]: marlow.id, [tollan.name]: tollan.id };

  let passwordHash: string | undefined;
  const userIds: Record<string, string> = {};
  for (const u of DEMO_USERS) {
    const existing = await db
      .select()
      .from(users)
      .where(sql`lower(${users.email}) = ${u.email}`)
      .limit(1);
    if (existing[0]) {
      userIds[u.email] = existing[0].id;
      continue;
    }
    passwordHash ??= await hashPassword(DEMO_PASSWORD);
    const [row] = await db
      .insert(users)
      .values({
        email: u.email,
        name: u.name,
        role: u.role,
        customerId: u.customer ? byCustomer[u.customer] : null,
        passwordHash,
        unitSystem: u.role === "installer" ? "inch" : "metric",
      })
      .returning();
    userIds[u.email] = row!.id;
  }

  const plant2 = await ensureSite(marlow.id, "Plant 2", "14 Quarry Road, Marlow Creek (invented)");
  const gantry = await ensureMachine(plant2.id, {
    name: "Gantry mill G-7",
    builder: "Invented Gantry Works",
    model: "GX-6020",
    serial: "GX6020-0117",
    kind: "gantry mill",
    control: "five-axis control with tool-centre-point function",
  });
  const head = await upsertHead({
    serial: "TH-2241",
    maker: "Invented Head Co.",
    model: "CA-40",
    primaryAxis: "C",
    secondaryAxis: "A",
    toolDirection: [0, 0, -1],
    nominalPivotLengthMm: 152.4,
    toolAxisOffsetMm: 0,
    massKg: 410,
    machineId: gantry.id,
  });

  const tollanSite = await ensureSite(tollan.id, "Main shop", "3 Foundry Lane, Tollan (invented)");
  const vmc = await ensureMachine(tollanSite.id, {
    name: "Bridge mill B-2",
    builder: "Invented Machine Tools",
    model: "BM-3016",
    serial: "BM3016-0442",
    kind: "bridge mill",
    control: "five-axis control with tool-centre-point function",
  });
  const tollanHead = await upsertHead({
    serial: "TH-1907",
    maker: "Invented Head Co.",
    model: "CB-30",
    primaryAxis: "C",
    secondaryAxis: "B",
    toolDirection: [0, 0, -1],
    nominalPivotLengthMm: 127,
    toolAxisOffsetMm: 0,
    massKg: 260,
    machineId: vmc.id,
  });

  const installer = userIds["installer@halvard.example"]!;
  const engineer = userIds["engineer@halvard.example"]!;
  const demoJobs: Array<typeof jobs.$inferInsert> = [
    {
      reference: "TR-2026-0041",
      title: "Head installation on gantry mill G-7",
      kind: "installation",
      status: "issued",
      customerId: marlow.id,
      machineId: gantry.id,
      headId: head.id,
      assignedInstallerId: installer,
      decisionRule: "simple",
      scheduledFor: new Date("2026-10-12T07:00:00Z"),
      timeZone: "Europe/London",
      airTempC: 20.6,
      orderReference: "PO 4500-7781 (invented)",
      customerContactName: "Dana Okafor (invented)",
      customerContactEmail: "quality@marlowcreek.example",
      conditionAsFound:
        "Head delivered crated, seals intact; mounted on the gantry ram, not yet aligned. No visible damage.",
      nextRecheckOn: "2027-04-12",
    },
    {
      reference: "TR-2026-0052",
      title: "Six-month re-verification of head TH-2241",
      kind: "reverification",
      status: "measuring",
      customerId: marlow.id,
      machineId: gantry.id,
      headId: head.id,
      assignedInstallerId: installer,
      decisionRule: "guarded",
      scheduledFor: new Date("2026-12-03T07:00:00Z"),
      airTempC: 20.2,
    },
    {
      reference: "TR-2026-0057",
      title: "Check after spindle collision on G-7",
      kind: "after_crash",
      status: "draft",
      customerId: marlow.id,
      machineId: gantry.id,
      headId: head.id,
      assignedInstallerId: null,
      decisionRule: "simple",
      scheduledFor: null,
    },
    {
      reference: "TR-2026-0048",
      title: "Head installation on bridge mill B-2",
      kind: "installation",
      status: "in_review",
      customerId: tollan.id,
      machineId: vmc.id,
      headId: tollanHead.id,
      assignedInstallerId: installer,
      decisionRule: "simple",
      scheduledFor: new Date("2026-11-20T07:00:00Z"),
      airTempC: 21.1,
    },
  ];
  for (const j of demoJobs) {
    if (await hasRows(jobs, eq(jobs.reference, j.reference))) continue;
    await insertDemoJob({ id: engineer, email: "engineer@halvard.example" }, { ...j, createdById: engineer });
  }
  // The starter procedures every install has (not demo data), beside the demo's own.
  await (await import("./library")).loadStarterLibrary();
  await (await import("./seed-checklists")).seedChecklists();
  await (await import("./seed-datasets")).seedDatasets();
  await (await import("./seed-analyses")).seedAnalyses();
  await (await import("./seed-records")).seedRecords();
  await (await import("./seed-control")).seedControlLoop(DEMO_PASSWORD);
  await (await import("./seed-positioning")).seedPositioning();
  // Last: the issued report renders whatever the steps above recorded.
  await seedReports(DEMO_PASSWORD);
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const t0 = Date.now();
  try {
    await seed();
    console.error(`db/seed: demo data in place (${Date.now() - t0} ms)`);
  } finally {
    await pool.end();
  }
}
