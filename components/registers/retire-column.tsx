import { RetireButton } from "@/components/registers/retire-controls";
import type { ColumnDef, ColumnFactory } from "@/components/ui/table";
import type { RETIRABLE_REGISTERS } from "@/lib/validations/registers";

/**
 * The "Retirement" column of a register table: for the administrator (`show`), a retire / bring
 * back button on each row; for everyone else no column at all. `row` says what the row is;
 * `column` is the factory the table hands its `columns` function.
 */
export function retireColumn<T>(
  column: ColumnFactory<T>,
  show: boolean,
  register: (typeof RETIRABLE_REGISTERS)[number],
  row: (r: T) => { id: string; retired: boolean; label: string },
): ColumnDef<T, unknown>[] {
  return show ? [column("Retirement", (r) => <RetireButton register={register} {...row(r)} />)] : [];
}

/** What a retire button says of a row known by its name (customers, machines). */
export const namedRow = (r: { id: string; name: string; retiredAt: unknown }) => ({
  id: r.id,
  retired: Boolean(r.retiredAt),
  label: r.name,
});
