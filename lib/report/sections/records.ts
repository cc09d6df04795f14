/**
 * The record details a customer's quality department looks for (ISO/IEC 17025:2017 §7.8.2.1 a–p,
 * §7.8.3, §7.8.6): the issuer with address and contact, the customer's contact and order, the
 * item, the method with the standards and clauses of what the job actually did, the condition as
 * found, the dates of the work and of issue, the environment, the calibration traceability of
 * each instrument, the data file behind each fit with its SHA-256 and the computation version,
 * the software version, the next re-check and the statement that the results relate only to the
 * item tested. Every item is present or says plainly "not recorded". Pure: no database, no clock.
 */
import { formatDate, formatDateTimeUtc } from "@/lib/format";
import { PHASE_WORDS, type Phase } from "@/lib/report/readiness";

export const NOT_RECORDED = "not recorded";

/** §7.8.2.1 k (from memory of the clause's wording). */
export const RELATES_ONLY =
  "The results relate only to the item tested, in the condition and at the time stated in this report.";

export interface ReportRecords {
  issuer: { name: string; address: string; contact: string; accreditation: string; reproduction: string };
  customerContact: string;
  orderReference: string;
  item: string;
  conditionAsFound: string;
  methods: string[];
  /** §7.8.2.1 g: deviations from, additions to or exclusions from the method. */
  methodDeviations: string;
  workDates: string;
  issueDate: string;
  environment: string[];
  units: string;
  relatesOnly: string;
  traceability: Array<{
    instrument: string;
    serial: string;
    certificate: string;
    calibratedOn: string;
    laboratory: string;
    due: string;
  }>;
  fits: Array<{ file: string; sha256: string; phase: string; computation: string }>;
  software: string;
  nextRecheck: string;
}

/** The traceability table as the report page and the PDF both print it: its head, then a row per instrument. */
export const TRACEABILITY_HEAD = ["Instrument", "Serial", "Certificate", "Calibrated", "Laboratory", "Due"];

export function traceabilityRows(r: ReportRecords): string[][] {
  return r.traceability.map((t) => [
    t.instrument,
    t.serial,
    t.certificate,
    t.calibratedOn,
    t.laboratory,
    t.due,
  ]);
}

export interface RecordsInput {
  issuer: {
    name: string;
    address: string;
    contactEmail: string;
    contactPhone: string;
    accreditation: string;
    reproductionStatement: string;
  };
  job: {
    orderReference: string | null;
    customerContactName: string | null;
    customerContactEmail: string | null;
    conditionAsFound: string | null;
    nextRecheckOn: string | null;
  };
  item: { head: string; machine: string };
  /** What the job did, so the method cites only what applies. */
  did: {
    readings: boolean;
    fit: boolean;
    testPart: boolean;
    procedure: string | null;
    decisionRule: "simple" | "guarded" | string;
  };
  /** Results carried as deviations (their justifications are listed in section 8). */
  deviationCount: number;
  /** Times of the first and last current reading or stored dataset. */
  work: { first: Date | null; last: Date | null };
  issuedAt: Date | null;
  environment: ReadonlyArray<{
    phase: Phase;
    airTempC: number | null;
    machineTempC: number | null;
    takenAt: Date;
    note: string | null;
  }>;
  unitSystem: "metric" | "inch";
  instruments: ReadonlyArray<{
    kind: string;
    serial: string;
    certificateRef: string | null;
    calibratedOn: string | null;
    laboratory: string | null;
    dueOn: string;
  }>;
  fits: ReadonlyArray<{ filename: string; sha256: string; phase: Phase; geometryVersion: string }>;
  software: { version: string; commit: string | null };
}

const orNot = (v: string | null | undefined) => (v && v.trim() ? v.trim() : NOT_RECORDED);

/**
 * The standards and clauses of the methods the job used, one sentence each. Clause numbers are
 * from memory of the standards' texts (JCGM 100:2008 §5.1 and §6.2; ISO 1:2016 clause 3): check
 * against the standards before relying on them.
 */
export function methodSentences(did: RecordsInput["did"]): string[] {
  const out: string[] = [];
  if (did.readings)
    out.push(
      `Geometric checks with indicators and levels, step by step as the procedure ${did.procedure ?? "recorded on the job"} sets them, each against its stated limit; terms and error symbols as defined in ISO 230-1:2012, clause 3.`,
    );
  if (did.fit)
    out.push(
      "Location errors of the head's axes of rotation (ISO 230-1:2012 symbols) estimated by a least-squares fit of the kinematic model to sphere-probe data; residuals per pose are shown with the fit.",
    );
  if (did.testPart)
    out.push(
      "A test part cut on the machine and measured; each feature judged against the tolerance stated in its measurement file, in the manner of the ISO 10791-7 test pieces.",
    );
  if (did.fit || did.testPart || did.readings)
    out.push(
      "Expanded uncertainty U = k·u_c with k = 2 (about 95 % coverage), u_c combined by the law of propagation of uncertainty: JCGM 100:2008 (GUM), §5.1 and §6.2.",
    );
  out.push(
    did.decisionRule === "guarded"
      ? "Decision rule: guarded acceptance per ISO 14253-1:2017 (ISO/IEC 17025:2017 §7.8.6.1)."
      : "Decision rule: simple acceptance, the value against the limit with U stated (ISO/IEC 17025:2017 §7.8.6.1).",
  );
  out.push("Lengths refer to the reference temperature of 20 °C (ISO 1:2016, clause 3).");
  return out;
}

const temp = (t: number | null) => (t == null ? NOT_RECORDED : `${t.toFixed(1)} °C`);

export function recordsSection(i: RecordsInput): ReportRecords {
  const contact = [i.issuer.contactEmail, i.issuer.contactPhone].filter((x) => x.trim()).join(", ");
  const custContact = [i.job.customerContactName, i.job.customerContactEmail]
    .filter((x): x is string => Boolean(x && x.trim()))
    .join(", ");
  return {
    issuer: {
      name: orNot(i.issuer.name),
      address: orNot(i.issuer.address),
      contact: orNot(contact),
      accreditation: i.issuer.accreditation.trim() || "The issuer states no accreditation for this work.",
      reproduction: orNot(i.issuer.reproductionStatement),
    },
    customerContact: orNot(custContact),
    orderReference: orNot(i.job.orderReference),
    item: `${i.item.head}, mounted on ${i.item.machine}`,
    conditionAsFound: orNot(i.job.conditionAsFound),
    methods: methodSentences(i.did),
    methodDeviations: i.deviationCount
      ? `The procedure was followed as written; ${i.deviationCount} ${i.deviationCount === 1 ? "result outside its limit is" : "results outside their limits are"} carried as ${i.deviationCount === 1 ? "a deviation" : "deviations"} with the justification listed in section 8.`
      : "None: the procedure was followed as written and no result is carried as a deviation.",
    workDates:
      i.work.first && i.work.last
        ? `${formatDateTimeUtc(i.work.first)} to ${formatDateTimeUtc(i.work.last)} (first and last reading or data file)`
        : `${NOT_RECORDED}: no reading or data file is stored`,
    issueDate: i.issuedAt ? formatDate(i.issuedAt) : "not issued (draft)",
    environment: i.environment.length
      ? i.environment.map(
          (e) =>
            `${formatDateTimeUtc(e.takenAt)}, ${PHASE_WORDS[e.phase]}: air ${temp(e.airTempC)}, machine ${temp(e.machineTempC)}${e.note ? ` (${e.note})` : ""}`,
        )
      : [`${NOT_RECORDED}: no air or machine temperature was entered for this job`],
    units:
      i.unitSystem === "inch"
        ? "Lengths in inch as recorded, with mm beside (1 in = 25.4 mm exactly); angles in arc seconds (″)."
        : "Lengths in mm as recorded; angles in arc seconds (″).",
    relatesOnly: RELATES_ONLY,
    traceability: i.instruments.map((x) => ({
      instrument: x.kind,
      serial: x.serial,
      certificate: orNot(x.certificateRef),
      calibratedOn: orNot(x.calibratedOn),
      laboratory: orNot(x.laboratory),
      due: x.dueOn,
    })),
    fits: i.fits.map((f) => ({
      file: f.filename,
      sha256: f.sha256,
      phase: PHASE_WORDS[f.phase],
      computation: f.geometryVersion,
    })),
    software: `Trammel ${i.software.version}${i.software.commit ? ` (build ${i.software.commit.slice(0, 12)})` : ""}`,
    nextRecheck: i.job.nextRecheckOn ?? NOT_RECORDED,
  };
}
