import "server-only";
import { and, asc, desc, eq, inArray, isNull, sql } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { db } from "@/db";
import { appendAudit, jobEvent } from "@/db/queries/audit";
import { getJobDetail, rowsOfTemplate, visibleJob } from "@/db/queries/jobs";
import { instruments, jobs, procedureTemplates, readings, templateSteps, users } from "@/db/schema";
import type { Reading, TemplateStep } from "@/db/schema";
import { type Actor } from "@/lib/domain/roles";
import { readingsRefusal } from "@/lib/policy/readings";
import { calibrationRefusal, expandedUncertainty, judge, type StepDecision } from "@/lib/checklist";
import { AppError, forbidden, invalid } from "@/lib/errors";
import {
  needsInstrument,
  rangeProblem,
  stepEntry,
  TEXT_KINDS,
  type KindStep,
  type ShownReading,
} from "@/lib/step-kinds";
import { CANONICAL_UNIT, toCanonical } from "@/lib/units";
import type { ReadingCreateInput } from "@/lib/validations/readings";
import { lockJob, refuseLockedReadings } from "./locks";

const recorders = alias(users, "recorder");

export async function listTemplateSteps(templateId: string | null): Promise<TemplateStep[]> {
  return rowsOfTemplate(templateSteps, templateId, templateSteps.position);
}

export type ReadingRow = Reading & {
  instrumentSerial: string | null;
  instrumentKind: string | null;
  recordedByName: string | null;
  instrumentStdU: number | null;
};

/** A reading with its instrument's serial, kind and uncertainty and its recorder's name. */
const readingWithNames = {
  r: readings,
  instrumentSerial: instruments.serial,
  instrumentKind: instruments.kind,
  instrumentStdU: instruments.standardUncertainty,
  recordedByName: recorders.name,
};

async function jobReadings(jobId: string): Promise<ReadingRow[]> {
  const rows = await db
    .select(readingWithNames)
    .from(readings)
    .leftJoin(instruments, eq(instruments.id, readings.instrumentId))
    .leftJoin(recorders, eq(recorders.id, readings.recordedById))
    .where(eq(readings.jobId, jobId))
    .orderBy(asc(readings.takenAt), asc(readings.createdAt));
  return rows.map((x) => ({
    ...x.r,
    instrumentSerial: x.instrumentSerial,
    instrumentKind: x.instrumentKind,
    instrumentStdU: x.instrumentStdU,
    recordedByName: x.recordedByName,
  }));
}

/** Instruments that can be chosen, with their calibration state (expired ones are listed, and refused on save). */
export async function listUsableInstruments() {
  return db
    .select({
      id: instruments.id,
      kind: instruments.kind,
      serial: instruments.serial,
      quantityKind: instruments.quantityKind,
      calibrationDueOn: instruments.calibrationDueOn,
      retired: instruments.retired,
      resolution: instruments.resolution,
      standardUncertainty: instruments.standardUncertainty,
      rangeMin: instruments.rangeMin,
      rangeMax: instruments.rangeMax,
    })
    .from(instruments)
    .where(eq(instruments.retired, false))
    .orderBy(asc(instruments.kind), asc(instruments.serial));
}

/** Everything the checklist page shows: the job, its template version, steps, readings and instruments. */
export async function getChecklist(actor: Actor, jobId: string) {
  const d = await getJobDetail(actor, jobId);
  if (!d) return null;
  // Four independent reads, side by side once the job is known to be visible.
  const [[template], steps, rs, insts] = await Promise.all([
    d.job.templateId
      ? db.select().from(procedureTemplates).where(eq(procedureTemplates.id, d.job.templateId))
      : Promise.resolve([]),
    listTemplateSteps(d.job.templateId),
    jobReadings(d.job.id),
    listUsableInstruments(),
  ]);
  return {
    detail: d,
    template: template ?? null,
    steps,
    readings: rs,
    instruments: insts,
    refusal: readingsRefusal(actor, d.job),
  };
}

/** The unit `value` is in: canonical for readings, the step's own for a record, none for answers and notes. */
function readingUnit(step: TemplateStep): string | null {
  if (step.derivation === "record") return step.recordUnit;
  if (step.derivation === "check" || step.derivation === "note") return null;
  return CANONICAL_UNIT[step.quantityKind];
}

/** The API's JSON form of a reading: canonical value with its unit, what was entered, and the decision. */
function readingJson(r: ReadingRow, step: TemplateStep | undefined) {
  const U = step ? expandedUncertainty(step, r.instrumentStdU) : 0;
  return {
    id: r.id,
    stepId: r.stepId,
    step: step ? { position: step.position, title: step.title } : null,
    phase: r.phase,
    kind: step?.derivation ?? null,
    value: r.value,
    unit: step ? readingUnit(step) : null,
    entered: { value: r.enteredValue, unit: r.enteredUnit },
    inputs: r.inputs,
    textValue: r.textValue,
    expandedUncertainty: U,
    decision: step ? judge(step, r.value, U) : "not_measured",
    instrument: r.instrumentId
      ? { id: r.instrumentId, serial: r.instrumentSerial, kind: r.instrumentKind }
      : null,
    note: r.note,
    takenAt: r.takenAt,
    recordedBy: r.recordedByName,
    supersededById: r.supersededById,
    clientId: r.clientId,
    deviceTime: r.deviceTime,
  };
}

/** GET /api/jobs/{id}/readings: every reading of the job, superseded ones included and marked. */
export async function listReadingsJson(actor: Actor, jobId: string) {
  const d = await visibleJob(actor, jobId);
  const [steps, rs] = await Promise.all([listTemplateSteps(d.job.templateId), jobReadings(d.job.id)]);
  const byId = new Map(steps.map((s) => [s.id, s]));
  return {
    job: { id: d.job.id, reference: d.job.reference, status: d.job.status },
    readings: rs.map((r) => readingJson(r, byId.get(r.stepId))),
  };
}

/** The stored reading a repeated send of `clientId` refers to, if this actor stored it. */
async function storedByClientId(
  q: Pick<typeof db, "select">,
  actor: Actor,
  jobId: string,
  input: ReadingCreateInput,
): Promise<ReturnType<typeof readingJson> | null> {
  if (!input.clientId) return null;
  const rows = await q
    .select({ ...readingWithNames, step: templateSteps })
    .from(readings)
    .innerJoin(templateSteps, eq(templateSteps.id, readings.stepId))
    .leftJoin(instruments, eq(instruments.id, readings.instrumentId))
    .leftJoin(recorders, eq(recorders.id, readings.recordedById))
    .where(and(eq(readings.jobId, jobId), eq(readings.clientId, input.clientId)));
  const hit = rows[0];
  if (!hit) return null;
  if (hit.r.recordedById !== actor.id || hit.r.stepId !== input.stepId || hit.r.phase !== input.phase)
    throw new AppError(
      409,
      "conflict",
      "Another reading on this job already carries that clientId; make a new one on the device.",
    );
  const { r, step, ...names } = hit;
  return readingJson({ ...r, ...names }, step);
}

/** A step of the job's procedure, or a 422 naming stepId (a step of another procedure is not this job's). */
export async function stepOfJob(templateId: string | null, stepId: string): Promise<TemplateStep> {
  const [step] = templateId
    ? await db
        .select()
        .from(templateSteps)
        .where(and(eq(templateSteps.id, stepId), eq(templateSteps.templateId, templateId)))
    : [];
  if (!step)
    throw invalid("That step is not part of this job's checklist.", [
      { field: "stepId", message: "Not a step of this job's procedure." },
    ]);
  return step;
}

/** The time that orders readings of one step and phase: the device's clock, else when it was stored. */
const orderKey = (r: Pick<Reading, "deviceTime" | "createdAt">) => (r.deviceTime ?? r.createdAt).getTime();

/**
 * Records a reading (or a correction that supersedes an earlier one). Checks, in order: the job
 * is visible (404); a `clientId` already stored answers with that reading (`replay: true`, nothing
 * written); the actor may write now (403), the step is the job's, the instrument exists,
 * measures the right kind of quantity and is in calibration on the day of the reading (422 with
 * the reason), then stores the canonical value with what was entered, and audits it.
 * Several readings of one step and phase (two tablets, or a re-measurement) are all kept; the one
 * with the latest device time is current and the others are marked superseded by it.
 */
export async function recordReading(actor: Actor, jobId: string, input: ReadingCreateInput) {
  const d = await visibleJob(actor, jobId);
  const replayed = await storedByClientId(db, actor, d.job.id, input);
  if (replayed) return { ...replayed, replay: true };
  const refusal = readingsRefusal(actor, d.job);
  if (refusal) throw forbidden(refusal);
  const step = await stepOfJob(d.job.templateId, input.stepId);

  const takenAt = input.takenAt ?? new Date();
  const deviceTime = input.deviceTime ?? new Date();
  if (takenAt.getTime() > Date.now() + 5 * 60_000)
    throw invalid("A reading cannot be taken in the future.", [
      { field: "takenAt", message: "The time is in the future." },
    ]);
  if (deviceTime.getTime() > Date.now() + 5 * 60_000)
    throw invalid("The device's clock is ahead of the server's; set the tablet's date and time.", [
      { field: "deviceTime", message: "The device time is in the future." },
    ]);
  // What this kind of step takes (a yes/no, the points, a note…), checked before the instrument.
  const entry = stepEntry(step, {
    value: input.value ?? null,
    unit: input.unit,
    travelMm: input.travel != null ? toCanonical(input.travel, input.travelUnit ?? "mm") : null,
    answer: input.answer ?? null,
    points: input.points ?? null,
    text: input.text ?? null,
  });
  if (!entry.ok) throw invalid(entry.problems[0]!.message, [...entry.problems]);
  const derived = entry.stored;

  if (!input.instrumentId && needsInstrument(step.derivation))
    throw invalid("Choose the instrument used from the register.", [
      { field: "instrumentId", message: "Choose the instrument used from the register." },
    ]);
  const [inst] = input.instrumentId
    ? await db.select().from(instruments).where(eq(instruments.id, input.instrumentId))
    : [];
  if (input.instrumentId && !inst)
    throw invalid("That instrument is not in the register.", [
      { field: "instrumentId", message: "Choose an instrument from the register." },
    ]);
  if (inst) {
    const calib = calibrationRefusal(inst, takenAt);
    if (calib) throw invalid(calib, [{ field: "instrumentId", message: calib }]);
  }
  const readsKind = step.derivation === "angle_over_distance" ? "length" : step.quantityKind;
  if (inst && needsInstrument(step.derivation) && inst.quantityKind !== readsKind) {
    const m = `Instrument ${inst.serial} measures ${inst.quantityKind === "angle" ? "angles" : "lengths"}; this step needs one that measures ${readsKind === "angle" ? "angles" : "lengths"}.`;
    throw invalid(m, [{ field: "instrumentId", message: m }]);
  }
  if (inst) {
    const outside = rangeProblem(
      inst,
      derived.instrumentReadings,
      step.derivation === "multi_point" ? step.points : null,
    );
    if (outside)
      throw invalid(outside.message, [
        { field: outside.point ? `points.${outside.point}` : "value", message: outside.message },
      ]);
  }

  return db.transaction(async (tx) => {
    // Lock the job row: a submit for review cannot slip between the check and the insert, and
    // two sends of one clientId are served one after the other.
    const locked = await lockJob(tx, d.job.id);
    const again = await storedByClientId(tx, actor, d.job.id, input);
    if (again) return { ...again, replay: true };
    refuseLockedReadings(actor, locked);
    let old: Reading | undefined;
    if (input.supersedesId || input.supersedesClientId) {
      [old] = await tx
        .select()
        .from(readings)
        .where(
          and(
            eq(readings.jobId, d.job.id),
            input.supersedesId
              ? eq(readings.id, input.supersedesId)
              : eq(readings.clientId, input.supersedesClientId!),
          ),
        )
        .for("update");
      if (!old)
        throw invalid("The reading to correct is not on this job.", [
          { field: "supersedesId", message: "No such reading on this job." },
        ]);
      if (old.supersededById)
        throw new AppError(
          409,
          "conflict",
          "That reading has already been corrected; correct the newest one.",
        );
      if (old.stepId !== step.id || old.phase !== input.phase)
        throw invalid("A correction keeps the step and phase of the reading it corrects.", [
          { field: "supersedesId", message: "Step or phase differs." },
        ]);
    }
    // Other current readings of the same step and phase (another tablet, or a re-measurement):
    // the latest by device time stays current.
    const others = old
      ? []
      : await tx
          .select()
          .from(readings)
          .where(
            and(
              eq(readings.jobId, d.job.id),
              eq(readings.stepId, step.id),
              eq(readings.phase, input.phase),
              isNull(readings.supersededById),
            ),
          )
          .for("update");
    const later = others
      .filter((o) => orderKey(o) > deviceTime.getTime())
      .sort((a, b) => orderKey(b) - orderKey(a))[0];
    const earlier = others.filter((o) => orderKey(o) <= deviceTime.getTime());
    const [row] = await tx
      .insert(readings)
      .values({
        jobId: d.job.id,
        stepId: step.id,
        phase: input.phase,
        value: derived.value,
        enteredValue: derived.enteredValue,
        enteredUnit: derived.enteredUnit,
        inputs: derived.inputs,
        textValue: derived.textValue,
        instrumentId: inst?.id ?? null,
        note: input.note ?? null,
        takenAt,
        recordedById: actor.id,
        clientId: input.clientId ?? null,
        deviceTime,
        supersededById: later?.id ?? null,
      })
      .returning();
    const replaced = old ? [old] : later ? [] : earlier;
    if (replaced.length)
      await tx
        .update(readings)
        .set({ supersededById: row!.id })
        .where(
          inArray(
            readings.id,
            replaced.map((r) => r.id),
          ),
        );
    if (locked!.status === "draft") {
      await tx.update(jobs).set({ status: "measuring" }).where(eq(jobs.id, d.job.id));
      await appendAudit(
        tx,
        actor,
        jobEvent(d.job.id, "job.status_changed", {
          oldValues: { status: "draft" },
          newValues: { status: "measuring", reason: "first reading recorded" },
        }),
      );
    } else {
      await tx.update(jobs).set({ updatedAt: new Date() }).where(eq(jobs.id, d.job.id));
    }
    await appendAudit(tx, actor, {
      action: old ? "reading.corrected" : "reading.recorded",
      entity: { type: "reading", id: row!.id },
      jobId: d.job.id,
      oldValues: old
        ? { id: old.id, value: old.value, enteredValue: old.enteredValue, enteredUnit: old.enteredUnit }
        : null,
      newValues: {
        step: step.position,
        phase: row!.phase,
        value: row!.value,
        unit: readingUnit(step),
        enteredValue: row!.enteredValue,
        enteredUnit: row!.enteredUnit,
        ...(row!.textValue != null ? { textValue: row!.textValue } : {}),
        ...(row!.inputs != null ? { inputs: row!.inputs } : {}),
        instrument: inst?.serial ?? null,
        note: row!.note,
        clientId: row!.clientId,
        deviceTime: deviceTime.toISOString(),
        ...(!old && replaced.length ? { supersedes: replaced.map((r) => r.id) } : {}),
        ...(later ? { supersededBy: later.id } : {}),
      },
    });
    const reading = readingJson(
      {
        ...row!,
        instrumentSerial: inst?.serial ?? null,
        instrumentKind: inst?.kind ?? null,
        instrumentStdU: inst?.standardUncertainty ?? null,
        recordedByName: actor.name,
      },
      step,
    );
    return { ...reading, replay: false };
  });
}

/** The current reading of a step in one phase, as the comparison shows it. */
export interface PhaseReading {
  value: number;
  U: number;
  decision: StepDecision;
  readingId: string;
  instrument: string | null;
  /** The instrument's resolution (canonical unit), which sets the decimals printed. */
  resolution: number | null;
  takenAt: Date;
  /** What shownValue() needs for answers, records, notes and multi-point readings. */
  shown: ShownReading;
}

export interface ComparisonRow {
  stepId: string;
  position: number;
  title: string;
  derivation: TemplateStep["derivation"];
  photoRequired: boolean;
  /** The step as its kind needs it to show a reading (points, derived result, record unit). */
  kindStep: KindStep;
  quantity: string;
  quantityKind: "length" | "angle";
  unit: "mm" | "arcsec";
  lowerLimit: number | null;
  upperLimit: number | null;
  decisionRule: "simple" | "guarded";
  limitSource: string;
  limitSourceNote: string | null;
  pre: PhaseReading | null;
  post: PhaseReading | null;
  change: number | null;
  /** The step's result: the post-adjustment reading if there is one, else the pre reading. */
  status: StepDecision;
}

/** Pre/post side by side: the latest current (not superseded) reading of each step and phase. */
export async function getComparison(actor: Actor, jobId: string) {
  const d = await getJobDetail(actor, jobId);
  if (!d) return null;
  const steps = await listTemplateSteps(d.job.templateId);
  const current = steps.length
    ? await db
        .select({
          r: readings,
          serial: instruments.serial,
          stdU: instruments.standardUncertainty,
          resolution: instruments.resolution,
        })
        .from(readings)
        .leftJoin(instruments, eq(instruments.id, readings.instrumentId))
        .where(
          and(
            eq(readings.jobId, d.job.id),
            isNull(readings.supersededById),
            inArray(
              readings.stepId,
              steps.map((s) => s.id),
            ),
          ),
        )
        .orderBy(desc(readings.takenAt), desc(readings.createdAt))
    : [];
  const rows: ComparisonRow[] = steps.map((s) => {
    const pick = (phase: "pre" | "post") => {
      const hit = current.find((c) => c.r.stepId === s.id && c.r.phase === phase);
      if (!hit) return null;
      const U = expandedUncertainty(s, hit.stdU);
      return {
        value: hit.r.value,
        U,
        decision: judge(s, hit.r.value, U),
        readingId: hit.r.id,
        instrument: hit.serial,
        resolution: hit.resolution,
        takenAt: hit.r.takenAt,
        shown: hit.r,
      };
    };
    const pre = pick("pre");
    const post = pick("post");
    return {
      stepId: s.id,
      position: s.position,
      title: s.title,
      derivation: s.derivation,
      photoRequired: s.photoRequired,
      kindStep: s,
      quantity: s.quantity,
      quantityKind: s.quantityKind,
      unit: CANONICAL_UNIT[s.quantityKind],
      lowerLimit: s.lowerLimit,
      upperLimit: s.upperLimit,
      decisionRule: s.decisionRule,
      limitSource: s.limitSource,
      limitSourceNote: s.limitSourceNote,
      pre,
      post,
      // A change is a difference of lengths or angles: none for answers, records and notes.
      change: pre && post && !TEXT_KINDS.includes(s.derivation) ? post.value - pre.value : null,
      status: (post ?? pre)?.decision ?? "not_measured",
    };
  });
  return { detail: d, rows };
}

export function comparisonJson(c: NonNullable<Awaited<ReturnType<typeof getComparison>>>) {
  return {
    job: { id: c.detail.job.id, reference: c.detail.job.reference, status: c.detail.job.status },
    steps: c.rows.map((r) => ({
      position: r.position,
      title: r.title,
      kind: r.derivation,
      quantity: r.quantity,
      unit: r.unit,
      lowerLimit: r.lowerLimit,
      upperLimit: r.upperLimit,
      decisionRule: r.decisionRule,
      limitSource: r.limitSource,
      pre: r.pre
        ? {
            value: r.pre.value,
            expandedUncertainty: r.pre.U,
            decision: r.pre.decision,
            instrument: r.pre.instrument,
            takenAt: r.pre.takenAt,
          }
        : null,
      post: r.post
        ? {
            value: r.post.value,
            expandedUncertainty: r.post.U,
            decision: r.post.decision,
            instrument: r.post.instrument,
            takenAt: r.post.takenAt,
          }
        : null,
      change: r.change,
      status: r.status,
    })),
  };
}

/**
 * The instruments behind the job's current readings (superseded ones left out), by serial, each
 * with the UTC day it was last used on, to check and print its calibration.
 */
export async function instrumentsInReadings(jobId: string) {
  return db
    .select({
      id: instruments.id,
      kind: instruments.kind,
      serial: instruments.serial,
      certificateRef: instruments.certificateRef,
      calibratedOn: instruments.calibratedOn,
      calibrationDueOn: instruments.calibrationDueOn,
      lastUsedOn: sql<string>`to_char(max(${readings.takenAt}) at time zone 'UTC', 'YYYY-MM-DD')`,
    })
    .from(readings)
    .innerJoin(instruments, eq(instruments.id, readings.instrumentId))
    .where(and(eq(readings.jobId, jobId), isNull(readings.supersededById)))
    .groupBy(instruments.id)
    .orderBy(asc(instruments.serial));
}
