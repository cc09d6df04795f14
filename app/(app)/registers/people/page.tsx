import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { AccountRecoveryButtons } from "@/components/registers/account-recovery-buttons";
import { InviteForm, PersonControls } from "@/components/registers/people-forms";
import { Card } from "@/components/ui/card";
import { SimpleTable } from "@/components/ui/simple-table";
import { listPeople } from "@/db/queries/registers";
import { listCustomersForSelect } from "@/db/queries/users-admin";
import { canReadRegisterOf, ROLE_LABELS } from "@/lib/auth/roles";
import { requirePageUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "People" };

export default async function PeoplePage() {
  const user = await requirePageUser("/registers/people");
  if (!canReadRegisterOf(user.role, "people")) notFound();
  const [people, customers] = await Promise.all([listPeople(user), listCustomersForSelect()]);
  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-2xl font-semibold">People</h1>
        <p className="text-sm text-graphite-600">
          Who signs in, in which role. A role change or disabling takes effect on the person&apos;s next
          request and ends their open sessions.
        </p>
      </div>
      <SimpleTable
        caption="People"
        rows={people}
        columns={[
          { header: "Name", cell: (p) => p.name },
          { header: "E-mail", cell: (p) => p.email },
          { header: "Role", cell: (p) => ROLE_LABELS[p.role] },
          { header: "Company", cell: (p) => p.customerName ?? "Service company" },
          { header: "Account", cell: (p) => (p.disabled ? "Disabled" : "Active") },
          {
            header: "Change",
            cell: (p) =>
              p.id === user.id ? (
                <span className="text-xs text-graphite-500">You</span>
              ) : (
                <PersonControls
                  userId={p.id}
                  role={p.role}
                  disabled={p.disabled}
                  isCustomer={p.role === "customer"}
                />
              ),
          },
          {
            header: "Sign-in help",
            cell: (p) => <AccountRecoveryButtons userId={p.id} disabled={p.disabled} />,
          },
        ]}
      />
      <Card title="Invite someone">
        <InviteForm customers={customers} />
      </Card>
    </div>
  );
}
