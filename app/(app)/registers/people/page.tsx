import type { Metadata } from "next";
import { PageHeading } from "@/components/ui/page-heading";
import { notFound } from "next/navigation";
import { AccountRecoveryButtons } from "@/components/registers/account-recovery-buttons";
import { InviteForm, PersonControls } from "@/components/registers/people-forms";
import { Card } from "@/components/ui/card";
import { defineTable, Table } from "@/components/ui/table";
import { listPeople } from "@/db/queries/registers";
import { listCustomersForSelect } from "@/db/queries/users-admin";
import { ROLE_LABELS } from "@/lib/domain/roles";
import { registerReadRefusal } from "@/lib/policy/registers";
import { requirePageUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "People" };

type PersonRow = Awaited<ReturnType<typeof listPeople>>[number];

/** Everyone with an account; the signed-in person (`selfId`) cannot change their own role here. */
const peopleTable = (selfId: string) =>
  defineTable<PersonRow>({
    caption: "People",
    empty: "Nobody has an account yet.",
    columns: (column) => [
      column("Name", (p) => p.name),
      column("E-mail", (p) => p.email),
      column("Role", (p) => ROLE_LABELS[p.role]),
      column("Company", (p) => p.customerName ?? "Service company"),
      column("Account", (p) => (p.disabled ? "Disabled" : "Active")),
      column(
        "Change",
        (p) =>
          p.id === selfId ? (
            <span className="text-xs text-graphite-500">You</span>
          ) : (
            <PersonControls
              userId={p.id}
              role={p.role}
              disabled={p.disabled}
              isCustomer={p.role === "customer"}
            />
          ),
        { wide: true },
      ),
      column("Sign-in help", (p) => <AccountRecoveryButtons userId={p.id} disabled={p.disabled} />),
    ],
  });

export default async function PeoplePage() {
  const user = await requirePageUser("/registers/people");
  if (registerReadRefusal(user, "people")) notFound();
  const [people, customers] = await Promise.all([listPeople(user), listCustomersForSelect()]);
  return (
    <div className="space-y-6">
      <PageHeading title="People">
        Who signs in, in which role. A role change or disabling takes effect on the person&apos;s next request
        and ends their open sessions.
      </PageHeading>
      <Table {...peopleTable(user.id)} data={people} />
      <Card title="Invite someone">
        <InviteForm customers={customers} />
      </Card>
    </div>
  );
}
