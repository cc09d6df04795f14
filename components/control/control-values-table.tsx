import { defineTable, Table } from "@/components/ui/table";
import type { ControlRow } from "@/lib/control-values";

const LOOP_TABLE = defineTable<ControlRow>({
  caption: "The control's kinematic values",
  empty: "No control values.",
  columns: (column) => [
    column("Setting", (r) => r.label, { rowHeader: true, className: "font-medium" }),
    column("As found", (r) => r.asFoundText, { numeric: true }),
    column("Correction", (r) => r.correctionText, { numeric: true }),
    column("Value to enter", (r) => r.toEnterText, { numeric: true, className: "font-semibold" }),
    column("As left", (r) => r.asLeftText, { numeric: true }),
    column(
      "Check",
      (r) =>
        r.flag ? (
          <span className="font-semibold text-fail-700" data-flag={r.flag}>
            {r.flagText}
            {r.flag === "differs" ? ` (${r.differenceText})` : ""}
          </span>
        ) : r.asLeft !== null ? (
          "As computed"
        ) : (
          ""
        ),
      {},
    ),
  ],
});

/** As found, correction, value to enter and as left side by side, with the flag on each differing row. */
export function ControlValuesLoopTable({ rows }: { rows: readonly ControlRow[] }) {
  return <Table {...LOOP_TABLE} bare data={rows} />;
}
