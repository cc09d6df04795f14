import { RegisterTabs } from "@/components/registers/register-tabs";
import { issuerSettingsRefusal } from "@/lib/policy/issuer";
import { registerReadRefusal } from "@/lib/policy/registers";
import { requirePageUser } from "@/lib/auth/session";

const ALL = [
  { href: "/registers", label: "Customers and machines", key: "customers" },
  { href: "/registers/heads", label: "Heads", key: "heads" },
  { href: "/registers/instruments", label: "Instruments", key: "instruments" },
  { href: "/registers/procedures", label: "Procedures", key: "procedures" },
  { href: "/registers/people", label: "People", key: "people" },
  { href: "/registers/outbox", label: "Outbox", key: "outbox" },
] as const;

export default async function RegistersLayout({ children }: { children: React.ReactNode }) {
  const user = await requirePageUser("/registers");
  const items = [
    ...ALL.filter((i) => registerReadRefusal(user, i.key) === null),
    ...(issuerSettingsRefusal(user) === null
      ? [{ href: "/registers/settings", label: "Issuer details" }]
      : []),
  ];
  return (
    <div className="space-y-6">
      <RegisterTabs items={items} />
      {children}
    </div>
  );
}
