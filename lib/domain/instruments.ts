/**
 * What an instrument was used for on a job beyond a checklist reading: the equipment behind the
 * measurement data, printed with its calibration on the report (ISO/IEC 17025:2017 §7.8.4.1 and
 * §6.5: metrological traceability of the equipment that produced the results).
 */
import { closedSet } from "./closed-set";

export const { values: DATA_INSTRUMENT_USES, labels: DATA_INSTRUMENT_USE_LABELS } = closedSet({
  probe: "Touch probe for the sphere probing",
  reference_sphere: "Reference sphere",
  cmm: "Coordinate measuring machine for the test part",
});
export type DataInstrumentUse = (typeof DATA_INSTRUMENT_USES)[number];

/** What the instrument served, as the report's traceability table says it after the instrument's kind. */
export const DATA_INSTRUMENT_PURPOSE: Record<DataInstrumentUse, string> = {
  probe: "sphere probing",
  reference_sphere: "reference for the sphere probing",
  cmm: "test part measurement",
};

export function isDataInstrumentUse(v: unknown): v is DataInstrumentUse {
  return typeof v === "string" && (DATA_INSTRUMENT_USES as readonly string[]).includes(v);
}
