import type { Metadata } from "next";
import { PageHeading } from "@/components/ui/page-heading";
import { notFound } from "next/navigation";
import { InstrumentForm } from "@/components/registers/instrument-form";
import { CalibrationForm } from "@/components/registers/retire-controls";
import { Card } from "@/components/ui/card";
import { defineTable, Table } from "@/components/ui/table";
import { listInstruments } from "@/db/queries/instruments";
import { getUnitSystem } from "@/db/queries/user-prefs";
import { registerEditRefusal, registerReadRefusal } from "@/lib/policy/registers";
import { requirePageUser } from "@/lib/auth/session";
import { formatValue, fromCanonical, type UnitSystem } from "@/lib/units";
import { retireColumn } from "@/components/registers/retire-column";

/** Resolution and uncertainty are small: micrometres (and tenths for inch users), not rounded to the display step. */
function small(v: number, kind: "length" | "angle", system: UnitSystem): string {
  if (kind === "angle") return formatValue(v, kind, system);
  const um = `${Number((v * 1000).toPrecision(3))} µm`;
  return system === "inch" ? `${Number(fromCanonical(v, "in").toPrecision(3))} in (${um})` : um;
}

export const metadata: Metadata = { title: "Instruments" };

type InstrumentRow = Awaited<ReturnType<typeof listInstruments>>[number];

/** The register in the reader's units, each row's calibration state as of `today`; `mayEdit` adds retiring. */
const instrumentsTable = ({
  mayEdit,
  unitSystem,
  today,
}: {
  mayEdit: boolean;
  unitSystem: UnitSystem;
  today: string;
}) =>
  defineTable<InstrumentRow>({
    caption: "Instruments",
    empty: "No instruments in the register yet.",
    columns: (column) => [
      column("Serial", (i) => <span className="num">{i.serial}</span>),
      column("Kind", (i) => `${i.kind}${i.maker ? ` (${i.maker})` : ""}`),
      column("Resolution", (i) => small(i.resolution, i.quantityKind, unitSystem), { numeric: true }),
      column("Std. uncertainty", (i) => small(i.standardUncertainty, i.quantityKind, unitSystem), {
        numeric: true,
      }),
      column("Calibrated", (i) => <span className="num">{i.calibratedOn ?? "—"}</span>),
      column("Due", (i) => <span className="num">{i.calibrationDueOn}</span>),
      column("State", (i) =>
        i.retired ? "Retired" : <CalibrationState due={i.calibrationDueOn} today={today} />,
      ),
      ...retireColumn(column, mayEdit, "instruments", (i) => ({
        id: i.id,
        retired: i.retired,
        label: `instrument ${i.serial}`,
      })),
    ],
  });

function CalibrationState({ due, today }: { due: string; today: string }) {
  const past = due < today;
  const soon = !past && new Date(due).getTime() - new Date(today).getTime() < 30 * 86_400_000;
  const cls = past
    ? "bg-fail-50 text-fail-700 ring-fail-600/40"
    : soon
      ? "bg-accent-50 text-accent-800 ring-accent-300"
      : "bg-pass-50 text-pass-700 ring-pass-600/40";
  const word = past ? "Past due — refused" : soon ? "Due within 30 days" : "In calibration";
  return (
    <span
      className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full px-2.5 py-0.5 text-sm font-medium ring-1 ring-inset ${cls}`}
    >
      <svg viewBox="0 0 12 12" className="h-3 w-3" aria-hidden="true">
        {past ? (
          <path d="M2.5 2.5l7 7M9.5 2.5l-7 7" stroke="currentColor" strokeWidth="1.8" />
        ) : soon ? (
          <path d="M6 2v4.5l2.5 1.5" fill="none" stroke="currentColor" strokeWidth="1.6" />
        ) : (
          <path d="M2 6.2 4.8 9 10 3" fill="none" stroke="currentColor" strokeWidth="1.8" />
        )}
      </svg>
      {word}
    </span>
  );
}

export default async function InstrumentsPage() {
  const user = await requirePageUser("/registers/instruments");
  if (registerReadRefusal(user, "instruments")) notFound();
  const mayEdit = registerEditRefusal(user, "instruments") === null;
  const [rows, unitSystem] = await Promise.all([listInstruments(user), getUnitSystem(user)]);
  const today = new Date().toISOString().slice(0, 10);
  return (
    <div className="space-y-6">
      <PageHeading title="Instruments">
        Every instrument a reading may name, with its resolution, standard uncertainty and calibration. A
        reading with an instrument past its due date is refused.
      </PageHeading>
      <Table {...instrumentsTable({ mayEdit, unitSystem, today })} data={rows} />
      {mayEdit ? (
        <>
          <Card title="Record a recalibration">
            <p className="mb-3 text-sm text-graphite-600">
              Each calibration is kept in the instrument&apos;s history; recording one brings a retired or
              past-due instrument back into use.
            </p>
            <CalibrationForm
              instruments={rows.map((i) => ({ id: i.id, label: `${i.serial} · ${i.kind}` }))}
            />
          </Card>
          <Card title="Add an instrument">
            <InstrumentForm />
          </Card>
        </>
      ) : null}
    </div>
  );
}
