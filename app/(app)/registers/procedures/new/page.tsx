import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { BackLink } from "@/components/ui/breadcrumb";
import { emptyBuilderValues } from "@/components/procedures/builder-values";
import { ProcedureBuilder } from "@/components/procedures/procedure-builder";
import { BuilderCaution } from "@/components/procedures/builder-caution";
import { headAxesByModel } from "@/db/queries/procedures";
import { requirePageUser } from "@/lib/auth/session";
import { procedureEditRefusal } from "@/lib/policy/procedures";
import { createProcedureAction } from "../actions";

export const metadata: Metadata = { title: "New procedure" };

export default async function NewProcedurePage() {
  const user = await requirePageUser("/registers/procedures/new");
  if (procedureEditRefusal(user, null)) notFound();
  return (
    <div className="space-y-6">
      <div>
        <BackLink href="/registers/procedures">Procedures</BackLink>
        <h1 className="text-2xl font-semibold">New procedure</h1>
        <p className="text-sm text-graphite-600">
          Write the steps in the order the installer works. Nothing is stored until you create it.
        </p>
      </div>
      <BuilderCaution />
      <ProcedureBuilder
        mode="new"
        initial={emptyBuilderValues()}
        submitLabel="Create procedure"
        action={createProcedureAction}
        headAxes={await headAxesByModel()}
      />
    </div>
  );
}
