import type { Metadata } from "next";
import { PageHeading } from "@/components/ui/page-heading";
import { notFound } from "next/navigation";
import { listHeads } from "@/db/queries/registers";
import { registerReadRefusal } from "@/lib/policy/registers";
import { requirePageUser } from "@/lib/auth/session";
import { HeadsTable } from "@/components/registers/heads-table";

export const metadata: Metadata = { title: "Heads" };

export default async function HeadsPage() {
  const user = await requirePageUser("/registers/heads");
  if (registerReadRefusal(user, "heads")) notFound();
  const heads = await listHeads(user);
  return (
    <div className="space-y-5">
      <PageHeading title="Heads">
        Every two-axis head on record, its axis configuration and where it is mounted now.
      </PageHeading>
      <HeadsTable rows={heads} />
    </div>
  );
}
