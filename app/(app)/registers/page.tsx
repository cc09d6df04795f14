import type { Metadata } from "next";
import { PageHeading } from "@/components/ui/page-heading";
import { notFound } from "next/navigation";
import { HeadsTable } from "@/components/registers/heads-table";
import { CustomerForm, HeadForm, MachineForm, SiteForm } from "@/components/registers/register-forms";
import { Card } from "@/components/ui/card";
import { listSitesForSelect } from "@/db/queries/registers-admin";
import { defineTable, Table } from "@/components/ui/table";
import { listCustomersWithSites, listHeads, listMachines } from "@/db/queries/registers";
import { registerEditRefusal, registerReadRefusal } from "@/lib/policy/registers";
import { requirePageUser } from "@/lib/auth/session";
import { namedRow, retireColumn } from "@/components/registers/retire-column";
import { RegisterSection } from "@/components/registers/register-section";

export const metadata: Metadata = { title: "Registers" };

type CustomerRow = Awaited<ReturnType<typeof listCustomersWithSites>>[number];
type MachineRow = Awaited<ReturnType<typeof listMachines>>[number];

/** The page's two register tables; `mayEdit` adds the retire / bring back column to each. */
const registerTables = (mayEdit: boolean) => ({
  customers: defineTable<CustomerRow>({
    caption: "Customers",
    empty: "No customers yet.",
    columns: (column) => [
      column("Name", (c) => c.name),
      column("Sites", (c) => c.sites.join(", ") || "—"),
      column("Contact", (c) => (c.retiredAt ? "Retired" : (c.contactEmail ?? "—"))),
      ...retireColumn(column, mayEdit, "customers", namedRow),
    ],
  }),
  machines: defineTable<MachineRow>({
    caption: "Host machines",
    empty: "No host machines yet.",
    columns: (column) => [
      column("Machine", (m) => m.name),
      column("Kind", (m) => m.kind),
      column("Builder and model", (m) => [m.builder, m.model].filter(Boolean).join(" ") || "—"),
      column("Serial", (m) => <span className="num">{m.serial ?? "—"}</span>),
      column("Customer, site", (m) =>
        m.retiredAt ? `${m.customerName}, ${m.siteName} (retired)` : `${m.customerName}, ${m.siteName}`,
      ),
      ...retireColumn(column, mayEdit, "machines", namedRow),
    ],
  }),
});

export default async function RegistersPage() {
  const user = await requirePageUser("/registers");
  if (registerReadRefusal(user, "customers")) notFound();
  const mayEdit = registerEditRefusal(user, "customers") === null;
  const [customers, machines, heads, siteOptions] = await Promise.all([
    listCustomersWithSites(user),
    listMachines(user),
    listHeads(user),
    listSitesForSelect(),
  ]);
  const tables = registerTables(mayEdit);
  return (
    <div className="space-y-8">
      <PageHeading title="Registers">
        Customers and their sites, host machines and heads. People, instruments and procedures have their own
        tabs.
      </PageHeading>
      <RegisterSection id="customers" title="Customers">
        <Table {...tables.customers} data={customers} />
      </RegisterSection>
      <RegisterSection id="machines" title="Host machines">
        <Table {...tables.machines} data={machines} />
      </RegisterSection>
      <RegisterSection id="heads" title="Heads">
        <HeadsTable rows={heads} mayRetire={mayEdit} />
      </RegisterSection>
      {mayEdit ? (
        <section className="grid gap-6 lg:grid-cols-2" aria-label="Add to the registers">
          <Card title="Add a customer">
            <CustomerForm />
          </Card>
          <Card title="Add a site">
            <SiteForm
              customers={customers.filter((c) => !c.retiredAt).map((c) => ({ id: c.id, label: c.name }))}
            />
          </Card>
          <Card title="Add a host machine" className="lg:col-span-2">
            <MachineForm
              sites={siteOptions.map((s) => ({ id: s.id, label: `${s.customerName}, ${s.name}` }))}
            />
          </Card>
          <Card title="Add a head" className="lg:col-span-2">
            <HeadForm />
          </Card>
        </section>
      ) : null}
    </div>
  );
}
