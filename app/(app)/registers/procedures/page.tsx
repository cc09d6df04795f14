import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { LIMIT_SOURCE_LABELS } from "@/lib/domain/procedures";
import { JobCreateForm } from "@/components/registers/job-create-form";
import { buttonClass } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { Table } from "@/components/ui/table";
import { listHeads, listMachines } from "@/db/queries/registers";
import { listTemplatesWithSteps } from "@/db/queries/templates";
import { listActiveInstallers } from "@/db/queries/users-admin";
import { getUnitSystem } from "@/db/queries/user-prefs";
import { procedureEditRefusal } from "@/lib/policy/procedures";
import { registerEditRefusal, registerReadRefusal } from "@/lib/policy/registers";
import { requirePageUser } from "@/lib/auth/session";
import { DECISION_RULE_WORDS } from "@/lib/domain/decisions";
import { formatDateTimeUtc } from "@/lib/format";
import { HEAD_PARAMETER_KEYS, headParameterUnit } from "@/geometry";
import { limitText, PARAMETER_WORDS } from "@/lib/fit-display";
import { formatLimits } from "@/lib/units";
import {
  HEAD_AXIS_ROLE_WORDS,
  POSITIONING_QUANTITY_WORDS,
  type PositioningQuantity,
} from "@/lib/domain/positioning";
import { arcsecText } from "@/lib/rotary-positioning-display";

export const metadata: Metadata = { title: "Procedures" };

export default async function ProceduresPage() {
  const user = await requirePageUser("/registers/procedures");
  if (registerReadRefusal(user, "procedures")) notFound();
  const mayEdit = registerEditRefusal(user, "procedures") === null;
  const mayBuild = procedureEditRefusal(user, null) === null;
  const [templates, unitSystem] = await Promise.all([listTemplatesWithSteps(user), getUnitSystem(user)]);
  // Retired machines and heads are left out of the pickers for new work.
  const [machines, heads, installers] = mayEdit
    ? await Promise.all([
        listMachines(user).then((rows) => rows.filter((m) => !m.retiredAt)),
        listHeads(user).then((rows) => rows.filter((h) => !h.retiredAt)),
        listActiveInstallers(),
      ])
    : [[], [], []];
  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-2xl font-semibold">Procedures</h1>
        <p className="text-sm text-graphite-600">
          The checklists jobs follow. Each step has its quantity, limits, decision rule and the source of the
          limit. Editing makes a new version; a job keeps the version it started with.
        </p>
        {mayBuild ? (
          <Link href="/registers/procedures/new" className={buttonClass("primary", "mt-3")}>
            New procedure
          </Link>
        ) : null}
      </div>
      {templates.map((t) => (
        <Card
          key={t.id}
          title={`${t.name} · version ${t.version}${t.isCurrent ? " (current)" : ""}${t.retiredAt ? " · retired" : ""}`}
          actions={
            <Link href={`/registers/procedures/${t.id}`} className={buttonClass("secondary")}>
              {mayBuild && t.isCurrent && !t.retiredAt ? "Open and edit steps" : "Open"}
              <span className="sr-only">
                {" "}
                {t.name}, version {t.version}
              </span>
            </Link>
          }
        >
          <p className="mb-3 text-sm text-graphite-600">
            {t.description} Created {formatDateTimeUtc(t.createdAt)}.
          </p>
          <Table
            caption={`Step limits, version ${t.version}`}
            empty="This version has no steps."
            bare
            data={t.steps}
            columns={(column) => [
              column("Step", (s) => (
                <>
                  <span className="num text-graphite-500">{s.position}</span> {s.title}
                  {s.safetyNote ? (
                    <span className="ml-2 rounded bg-accent-50 px-1.5 text-xs text-accent-800 ring-1 ring-accent-300">
                      caution
                    </span>
                  ) : null}
                </>
              )),
              column("Quantity", (s) => s.quantity),
              column("Limits", (s) => formatLimits(s.lowerLimit, s.upperLimit, s.quantityKind, unitSystem), {
                numeric: true,
              }),
              column("Rule", (s) => DECISION_RULE_WORDS[s.decisionRule]),
              column("Source", (s) => LIMIT_SOURCE_LABELS[s.limitSource], {
                cellProps: (s) => ({ title: s.limitSourceNote ?? undefined }),
              }),
            ]}
          />
          <h3 className="mb-2 mt-5 text-sm font-semibold">Limits for the fitted head parameters</h3>
          {t.parameterLimits.length === 0 ? (
            <p className="text-sm text-graphite-600">
              None: a head fit on a job with this version is recorded, not judged.
            </p>
          ) : (
            <Table
              caption={`Head parameter limits, version ${t.version}`}
              empty={null}
              bare
              data={HEAD_PARAMETER_KEYS.flatMap((key) => {
                const l = t.parameterLimits.find((x) => x.parameter === key);
                return l ? [{ key, ...l }] : [];
              })}
              columns={(column) => [
                column("Parameter", (l) => PARAMETER_WORDS[l.key]),
                column(
                  "Limits",
                  (l) => limitText(l.lowerLimit, l.upperLimit, headParameterUnit(l.key)) ?? "—",
                  {
                    numeric: true,
                  },
                ),
                column("Rule", (l) => DECISION_RULE_WORDS[l.decisionRule]),
                column("Source", (l) => LIMIT_SOURCE_LABELS[l.limitSource], {
                  cellProps: (l) => ({ title: l.limitSourceNote ?? undefined }),
                }),
              ]}
            />
          )}
          {t.positioningLimits.length ? (
            <>
              <h3 className="mb-2 mt-5 text-sm font-semibold">
                Limits for the positioning of the rotary axes (ISO 230-2)
              </h3>
              <p className="mb-2 text-sm text-graphite-600">
                A job with this version needs a positioning test of each axis listed before its report is
                issued. Kept by each later version of this procedure.
              </p>
              <Table
                caption={`Rotary positioning limits, version ${t.version}`}
                empty={null}
                bare
                data={t.positioningLimits}
                columns={(column) => [
                  column("Axis", (l) => HEAD_AXIS_ROLE_WORDS[l.axis]),
                  column(
                    "Quantity",
                    (l) =>
                      `${POSITIONING_QUANTITY_WORDS[l.quantity as PositioningQuantity] ?? l.quantity} (${l.quantity})`,
                  ),
                  column("Limit", (l) => `≤ ${arcsecText(l.upperLimitArcsec)}`, { numeric: true }),
                  column("Source", (l) => LIMIT_SOURCE_LABELS[l.limitSource], {
                    cellProps: (l) => ({ title: l.limitSourceNote ?? undefined }),
                  }),
                ]}
              />
            </>
          ) : null}
          {mayEdit && t.isCurrent ? (
            <details className="mt-4 rounded-card border border-graphite-200 p-4">
              <summary className="min-h-touch cursor-pointer py-2 font-medium">
                Open a job with this procedure
              </summary>
              <JobCreateForm
                templateId={t.id}
                machines={machines.map((m) => ({
                  id: m.id,
                  label: `${m.name} — ${m.customerName}, ${m.siteName}`,
                }))}
                heads={heads.map((h) => ({
                  id: h.id,
                  label: `${h.serial} (${h.primaryAxis}/${h.secondaryAxis})${h.machineName ? ` on ${h.machineName}` : ""}`,
                }))}
                installers={installers.map((u) => ({ id: u.id, label: u.name }))}
              />
            </details>
          ) : null}
        </Card>
      ))}
    </div>
  );
}
