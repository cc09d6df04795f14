"use client";

import { Card } from "@/components/ui/card";
import { optionsOf, SelectField } from "@/components/ui/field";
import { Form } from "@/components/ui/form";
import { HiddenFields } from "@/components/ui/form-fields";
import type { ActionResult } from "@/lib/actions";
import { DATA_INSTRUMENT_USE_LABELS, DATA_INSTRUMENT_USES } from "@/lib/domain/instruments";

/**
 * The instruments behind the job's measurement data — touch probe, reference sphere (with its
 * calibrated diameter), CMM — listed, and added from the register by the people who measured.
 * The report prints each with its calibration.
 */
export function DataInstruments({
  jobId,
  recorded,
  register,
  run,
}: {
  jobId: string;
  recorded: ReadonlyArray<{ id: string; use: string; serial: string; kind: string; size: string | null }>;
  /** Instruments that may be added; null when the actor may not add. */
  register: ReadonlyArray<{ id: string; label: string }> | null;
  run: (raw: unknown) => Promise<ActionResult<unknown>>;
}) {
  const label = (u: string) => DATA_INSTRUMENT_USE_LABELS[u as keyof typeof DATA_INSTRUMENT_USE_LABELS] ?? u;
  return (
    <Card title="Instruments behind the data">
      {recorded.length ? (
        <ul className="mb-3 space-y-1 text-sm">
          {recorded.map((r) => (
            <li key={r.id}>
              <span className="font-medium">{label(r.use)}:</span> {r.kind}{" "}
              <span className="num">{r.serial}</span>
              {r.size ? ` (calibrated diameter ${r.size})` : ""}
            </li>
          ))}
        </ul>
      ) : (
        <p className="mb-3 text-sm text-graphite-600">
          None recorded yet. Add the touch probe, the reference sphere and any CMM used for the data, so the
          report traces their calibration.
        </p>
      )}
      {register ? (
        <Form
          action={run}
          submitLabel="Add instrument"
          successMessage="Recorded."
          variant="dark"
          className="space-y-2"
          aria-label="Add an instrument used for the data"
        >
          <HiddenFields values={{ jobId }} />
          <SelectField
            name="use"
            label="Used as"
            options={DATA_INSTRUMENT_USES.map((u) => ({ value: u, label: label(u) }))}
          />
          <SelectField name="instrumentId" label="Instrument" options={optionsOf(register)} />
        </Form>
      ) : null}
    </Card>
  );
}
