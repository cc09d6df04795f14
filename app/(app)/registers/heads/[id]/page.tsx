import type { Metadata } from "next";
import { Breadcrumb } from "@/components/ui/breadcrumb";
import { headFacts } from "@/components/heads/head-facts";
import { notFound } from "next/navigation";
import { MountHeadForm } from "@/components/registers/mount-head-form";
import { Card, Facts } from "@/components/ui/card";
import { getHeadFitHistory, getHeadWithHistory } from "@/db/queries/heads-admin";
import { listMachines } from "@/db/queries/registers";
import { registerEditRefusal, registerReadRefusal } from "@/lib/policy/registers";
import { requirePageUser } from "@/lib/auth/session";
import { formatDateTimeUtc } from "@/lib/format";
import { FitHistory } from "@/components/heads/fit-history";
import { pageUuid } from "@/lib/domain/uuid";

export const metadata: Metadata = { title: "Head" };

type Props = { params: Promise<{ id: string }> };

export default async function HeadPage({ params }: Props) {
  const id = pageUuid((await params).id);
  const user = await requirePageUser(`/registers/heads/${id}`);
  if (registerReadRefusal(user, "heads")) notFound();
  const mayEdit = registerEditRefusal(user, "heads") === null;
  const [h, fits] = await Promise.all([getHeadWithHistory(user, id), getHeadFitHistory(user, id)]);
  if (!h || !fits) notFound();
  const machines = mayEdit ? (await listMachines(user)).filter((m) => !m.retiredAt) : [];
  const { head } = h;
  return (
    <div className="space-y-6">
      <Breadcrumb parent={{ href: "/registers/heads", label: "Heads" }}>
        <span className="num">{head.serial}</span>
      </Breadcrumb>
      <h1 className="text-2xl font-semibold">
        Head <span className="num">{head.serial}</span>
      </h1>
      <div className="grid gap-6 lg:grid-cols-2">
        <Card title="Configuration">
          <Facts
            items={[
              ...headFacts(head),
              {
                label: "Mounted on",
                value: h.machineName ? `${h.machineName} — ${h.customerName}, ${h.siteName}` : "Not mounted",
              },
            ]}
          />
        </Card>
        <Card title="Where it has been">
          {h.history.length === 0 ? (
            <p className="text-sm text-graphite-600">No moves recorded since it was registered.</p>
          ) : (
            <ol className="space-y-2 text-sm">
              {h.history.map((e) => (
                <li key={e.id} className="flex flex-wrap gap-x-3">
                  <span className="num text-graphite-600">{formatDateTimeUtc(e.at)}</span>
                  <span>
                    {e.action === "head.removed"
                      ? "Taken off"
                      : `Mounted on ${String((e.newValues as { machine?: string } | null)?.machine ?? "?")}`}
                  </span>
                  <span className="text-graphite-500">by {e.actorEmail}</span>
                </li>
              ))}
            </ol>
          )}
          {mayEdit ? (
            <div className="mt-4 border-t border-graphite-100 pt-4">
              <MountHeadForm
                headId={head.id}
                current={head.machineId}
                machines={machines.map((m) => ({
                  id: m.id,
                  label: `${m.name} — ${m.customerName}, ${m.siteName}`,
                }))}
              />
            </div>
          ) : null}
        </Card>
      </div>
      <FitHistory history={fits} />
    </div>
  );
}
