import type { Metadata } from "next";
import { PageHeading } from "@/components/ui/page-heading";
import { notFound } from "next/navigation";
import { IssuerSettingsForm } from "@/components/registers/issuer-settings-form";
import { getIssuerForEdit } from "@/db/queries/issuer";
import { requirePageUser } from "@/lib/auth/session";
import { issuerDetailsMissing, issuerSettingsRefusal } from "@/lib/policy/issuer";

export const metadata: Metadata = { title: "Issuer details" };

/** The company that issues the reports: name, address, contact, accreditation (administrator). */
export default async function IssuerSettingsPage() {
  const user = await requirePageUser("/registers/settings");
  if (issuerSettingsRefusal(user)) notFound();
  const current = await getIssuerForEdit(user);
  const missing = issuerDetailsMissing(current);
  return (
    <div className="space-y-6">
      <PageHeading title="Issuer details">
        The company that issues the reports, as printed at the head of each one (ISO/IEC 17025:2017 §7.8.2.1
        b). A report already issued keeps the details it was issued with.
      </PageHeading>
      {missing.length ? (
        <p role="status" className="rounded-card border border-accent-300 bg-accent-50 p-3 text-sm">
          No report can be issued until the issuer&apos;s {missing.join(" and ")}{" "}
          {missing.length === 1 ? "is" : "are"} filled in.
        </p>
      ) : null}
      <section className="rounded-card border border-graphite-200 bg-white p-4 shadow-sm">
        <IssuerSettingsForm current={current} />
      </section>
    </div>
  );
}
