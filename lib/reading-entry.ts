/**
 * The tablet's reading entry as plain data: the form's values, the request a save sends (the shape
 * the readings route parses), the values a queued reading is edited from, and the tablet's local
 * time in the one "YYYY-MM-DD HH:MM" format. Pure, so the rules are unit-tested without a browser.
 */
import type { StepKind } from "@/lib/domain/procedures";

export interface EntryValues {
  phase: "pre" | "post";
  value: string;
  /** check steps: "yes" or "no" ("" until answered). */
  answer: "" | "yes" | "no";
  /** multi_point steps: the reading at each point, in the procedure's order. */
  pointValues: string[];
  /** note steps: the note; record steps: where the value applies. */
  text: string;
  travel: string;
  instrumentId: string;
  note: string;
  takenAt: string;
}

/** This tablet's time now as "YYYY-MM-DD HH:MM" (24-hour), the one format the app writes times in. */
export function localNow(now = new Date()): string {
  const d = new Date(now);
  d.setMinutes(d.getMinutes() - d.getTimezoneOffset());
  return d.toISOString().slice(0, 16).replace("T", " ");
}

/** "YYYY-MM-DD HH:MM" in this tablet's zone → the instant, or null when it is not such a time. */
export function parseLocal(text: string): Date | null {
  const t = text.trim();
  if (!/^\d{4}-\d{2}-\d{2}[ T]\d{2}:\d{2}$/.test(t)) return null;
  const d = new Date(t.replace(" ", "T"));
  return Number.isNaN(d.getTime()) ? null : d;
}

/** The form after a save: what was read is cleared, the phase, travel and instrument stay. */
export function clearedEntry(
  values: EntryValues,
  pointNames: readonly string[],
  now = new Date(),
): EntryValues {
  return {
    ...values,
    value: "",
    answer: "",
    text: "",
    pointValues: pointNames.map(() => ""),
    note: "",
    takenAt: localNow(now),
  };
}

/** What a save sends for one step: only the fields its kind reads, plus who it replaces. */
export function readingRequestBody(input: {
  stepId: string;
  kind: StepKind;
  values: EntryValues;
  phase: "pre" | "post";
  unit: string;
  travelUnit: "in" | "mm";
  points: Record<string, string>;
  withInstrument: boolean;
  clientId: string;
  supersedes: { id: string } | { clientId: string } | null;
  now?: Date;
}) {
  const { kind, values: f, supersedes } = input;
  const now = input.now ?? new Date();
  return {
    stepId: input.stepId,
    phase: input.phase,
    unit: input.unit,
    ...(kind === "check" ? { answer: f.answer } : {}),
    ...(kind === "note" || kind === "record" ? { text: f.text } : {}),
    ...(kind === "multi_point" ? { points: input.points } : {}),
    ...(kind !== "check" && kind !== "note" && kind !== "multi_point"
      ? { value: f.value.trim().replace(",", ".") }
      : {}),
    ...(kind === "angle_over_distance" ? { travel: f.travel, travelUnit: input.travelUnit } : {}),
    ...(input.withInstrument ? { instrumentId: f.instrumentId } : {}),
    note: f.note,
    takenAt: (parseLocal(f.takenAt) ?? now).toISOString(),
    clientId: input.clientId,
    deviceTime: now.toISOString(),
    ...(supersedes && "id" in supersedes ? { supersedesId: supersedes.id } : {}),
    ...(supersedes && "clientId" in supersedes ? { supersedesClientId: supersedes.clientId } : {}),
  };
}

/** The form's values for editing a reading still queued on this tablet (its time is taken anew). */
export function entryFromQueued(
  body: { phase: "pre" | "post"; points?: unknown } & Record<string, unknown>,
  pointNames: readonly string[],
  travelNow: string,
  now = new Date(),
): EntryValues {
  const b = body as Record<string, string | undefined>;
  const pts = (body.points ?? {}) as Record<string, string>;
  return {
    phase: body.phase,
    value: b.value ?? "",
    answer: b.answer === "yes" || b.answer === "no" ? b.answer : "",
    text: b.text ?? "",
    pointValues: pointNames.map((p) => String(pts[p] ?? "")),
    travel: b.travel ?? travelNow,
    instrumentId: b.instrumentId ?? "",
    note: b.note ?? "",
    takenAt: localNow(now),
  };
}
