// The UI kit's pure parts: the Table's sorting, empty state and card labels (rendered to HTML on
// the server, as a server page renders them), and how a server action's refusal maps onto a form.
import { createElement, type ReactElement } from "react";
import { renderToString } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { mapActionErrors } from "@/components/ui/form-errors";
import { Field, TextField } from "@/components/ui/field";
import { FormFields, HiddenFields } from "@/components/ui/form-fields";
import { buildTable, column, Table, type ColumnDef, type TableProps } from "@/components/ui/table";

type Row = { id: string; ref: string; n: number | null };
const rows: Row[] = [
  { id: "a", ref: "TR-2026-0052", n: 3 },
  { id: "b", ref: "TR-2026-0041", n: null },
  { id: "c", ref: "TR-2026-0057", n: 11 },
];
const columns: ColumnDef<Row, unknown>[] = [
  column<Row>("Reference", (r) => r.ref, { id: "ref", sortBy: (r) => r.ref, nowrap: true }),
  column<Row>("Count", (r) => r.n ?? "—", { id: "n", sortBy: (r) => r.n, numeric: true }),
  column<Row>("Note", () => "x"),
];
const render = (props: Partial<TableProps<Row>>) =>
  renderToString(
    createElement(Table<Row>, { data: rows, columns, caption: "Jobs", empty: "none", ...props }),
  );
const order = (sorting: { id: string; desc: boolean }[]) =>
  buildTable({ data: rows, columns, sorting, onSortingChange: () => {} })
    .getRowModel()
    .rows.map((r) => r.original.id);

describe("Table", () => {
  it("keeps the data's order when nothing is sorted", () => {
    expect(order([])).toEqual(["a", "b", "c"]);
  });
  it("keys each row by its own id, else its key, else its place, and by getRowId when given", () => {
    const ids = <T>(data: readonly T[], getRowId?: (r: T) => string) =>
      buildTable<T>({ data, columns: [], getRowId })
        .getRowModel()
        .rows.map((r) => r.id);
    expect(ids(rows)).toEqual(["a", "b", "c"]);
    expect(ids([{ key: "pivot" }, { key: "offset" }])).toEqual(["pivot", "offset"]);
    expect(ids([{ id: 7, key: "k" }])).toEqual(["7"]);
    expect(ids([{ label: "x" }, { label: "y" }])).toEqual(["0", "1"]);
    expect(ids(rows, (r: Row) => r.ref)).toEqual(["TR-2026-0052", "TR-2026-0041", "TR-2026-0057"]);
  });
  it("sorts text both ways", () => {
    expect(order([{ id: "ref", desc: false }])).toEqual(["b", "a", "c"]);
    expect(order([{ id: "ref", desc: true }])).toEqual(["c", "a", "b"]);
  });
  it("sorts numbers as numbers (11 after 3) and puts missing values last either way", () => {
    expect(order([{ id: "n", desc: false }])).toEqual(["a", "c", "b"]);
    expect(order([{ id: "n", desc: true }])).toEqual(["c", "a", "b"]);
  });
  it("leaves the order to the server when it sorts by links", () => {
    const t = buildTable({ data: rows, columns, sorting: [{ id: "ref", desc: false }], sortHref: () => "?" });
    expect(t.getRowModel().rows.map((r) => r.original.id)).toEqual(["a", "b", "c"]);
  });
  it("only columns with a sort value can be sorted, and only when the table is sortable", () => {
    const sortable = buildTable({ data: rows, columns, onSortingChange: () => {} });
    expect(sortable.getAllLeafColumns().map((c) => c.getCanSort())).toEqual([true, true, false]);
    const fixed = buildTable({ data: rows, columns });
    expect(fixed.getAllLeafColumns().some((c) => c.getCanSort())).toBe(false);
  });

  it("says the empty message instead of drawing an empty table", () => {
    const html = renderToString(
      createElement(Table<Row>, { data: [], columns, caption: "Jobs", empty: "No jobs match." }),
    );
    expect(html).toContain("No jobs match.");
    expect(html).not.toContain("<table");
  });
  it("names the table by its caption, labels each cell for the card layout and marks the sort", () => {
    const html = render({
      sorting: [{ id: "ref", desc: true }],
      sortHref: (id, desc) => `?sort=${id}&dir=${desc ? "desc" : "asc"}`,
    });
    expect(html).toMatch(/<caption[^>]*>Jobs<\/caption>/);
    expect(html).toContain('data-label="Reference"');
    expect(html).toContain('data-label="Count"');
    expect(html).toContain('aria-sort="descending"');
    // Pressing the header of the column sorted descending asks for ascending.
    expect(html).toContain('href="?sort=ref&amp;dir=asc"');
    // References never break mid-word; numbers are right-aligned tabular figures.
    expect(html).toMatch(/<td[^>]*data-label="Reference"[^>]*class="[^"]*whitespace-nowrap/);
    expect(html).toMatch(/<td[^>]*data-label="Count"[^>]*class="[^"]*num text-right/);
    // The server sorted: the rows stay as given.
    expect(html.indexOf("TR-2026-0052")).toBeLessThan(html.indexOf("TR-2026-0041"));
  });
  it("sorted in the browser, the rows come in order and the headers are buttons", () => {
    const html = render({ sorting: [{ id: "ref", desc: true }], onSortingChange: () => {} });
    expect(html).toMatch(/<th[^>]*aria-sort="descending"[^>]*><button type="button"/);
    expect(html.indexOf("TR-2026-0057")).toBeLessThan(html.indexOf("TR-2026-0052"));
    expect(html.indexOf("TR-2026-0052")).toBeLessThan(html.indexOf("TR-2026-0041"));
  });
  it("a table that must stay a table gets no card classes", () => {
    const html = render({ layout: "scroll" });
    expect(html).not.toContain("max-[900px]:");
  });
});

describe("mapActionErrors", () => {
  const fields = new Set(["serial", "calibrationDueOn"]);
  const isField = (n: string) => fields.has(n);
  it("puts each field's first message beside its field and the message once", () => {
    const r = mapActionErrors(
      {
        ok: false,
        code: "invalid",
        message: "Some fields need attention.",
        fieldErrors: { serial: ["The serial is required.", "second"], calibrationDueOn: ["Use a date."] },
      },
      isField,
    );
    expect(r.message).toBe("Some fields need attention.");
    expect(r.fields).toEqual([
      ["serial", "The serial is required."],
      ["calibrationDueOn", "Use a date."],
    ]);
  });
  it("adds errors that name no field of the form to the message, without repeating it", () => {
    const r = mapActionErrors(
      {
        ok: false,
        code: "invalid",
        message: "The file was refused.",
        fieldErrors: { _: ["The file was refused."], x_mm: ["row 4: not a number"], serial: ["taken"] },
      },
      isField,
    );
    expect(r.message).toBe("The file was refused. row 4: not a number");
    expect(r.fields).toEqual([["serial", "taken"]]);
  });
  it("a refusal without field errors is the message alone", () => {
    const r = mapActionErrors(
      { ok: false, code: "forbidden", message: "Only an administrator may." },
      isField,
    );
    expect(r).toEqual({ message: "Only an administrator may.", fields: [] });
  });
});

describe("FormFields", () => {
  const html = renderToString(
    createElement(FormFields, {
      columns: 4,
      fields: [
        { name: "serial", label: "Serial", numeric: true },
        { name: "massKg", label: "Mass (kg)", decimal: true, defaultValue: "12" },
        { name: "axis", label: "Axis", options: [{ value: "A", label: "A" }], placeholder: "Choose…" },
        { name: "notes", label: "Notes", rows: 3, hint: "Printed on the report." },
      ],
    }),
  );
  it("gives every field its label, its control by name and an inline error place", () => {
    for (const [name, label] of [
      ["serial", "Serial"],
      ["massKg", "Mass (kg)"],
      ["axis", "Axis"],
      ["notes", "Notes"],
    ]) {
      expect(html).toContain(`>${label}</label>`);
      expect(html).toMatch(new RegExp(`name="${name}"`));
      expect(html).toContain(`data-error-for="${name}"`);
    }
  });
  it("draws numbers with tabular figures, decimals with the decimal keypad, and the other kinds", () => {
    expect(html).toMatch(/<input[^>]*class="[^"]*\bnum\b[^"]*"[^>]*name="serial"/);
    expect(html).toMatch(
      /<input[^>]*inputMode="decimal"[^>]*autoComplete="off"[^>]*name="massKg"[^>]*value="12"/,
    );
    expect(html).toMatch(/<select[^>]*name="axis"[^>]*><option value=""[^>]*>Choose…<\/option>/);
    expect(html).toMatch(/<textarea[^>]*rows="3"[^>]*name="notes"/);
    expect(html).toContain("Printed on the report.");
    expect(html).toContain("lg:grid-cols-4");
  });
  it("sends fixed values as hidden inputs", () => {
    const hidden = renderToString(createElement(HiddenFields, { values: { jobId: "j1", action: "hold" } }));
    expect(hidden).toBe(
      '<input type="hidden" name="jobId" value="j1"/><input type="hidden" name="action" value="hold"/>',
    );
  });
});

describe("Field", () => {
  it("keeps an id the control names itself, so a page can move focus to it, and labels it", () => {
    const html = renderToString(
      createElement(Field, {
        name: "title",
        label: "Title",
        children: createElement("input", { id: "step-2-title" }) as ReactElement<{ id?: string }>,
      }),
    );
    expect(html).toMatch(/<label for="step-2-title"[^>]*>Title<\/label><input id="step-2-title"/);
  });
  it("gives a control without an id one of its own, tied to the label", () => {
    const html = renderToString(
      createElement(TextField, { name: "lower", label: "Lower limit", decimal: true }),
    );
    const id = /<label for="([^"]+)"/.exec(html)?.[1];
    expect(id).toMatch(/lower$/);
    expect(html).toMatch(
      new RegExp(`<input class="[^"]*\\bnum\\b[^"]*" inputMode="decimal" autoComplete="off" id="${id}"`),
    );
  });
});
