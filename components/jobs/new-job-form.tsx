"use client";

import { useEffect, useSyncExternalStore } from "react";
import { useRouter } from "next/navigation";
import { useFormContext } from "react-hook-form";
import { openJobAction } from "@/app/(app)/jobs/actions";
import {
  closedSetOptions,
  Field,
  inputClass,
  SelectField,
  TextField,
  type Option,
} from "@/components/ui/field";
import { Form } from "@/components/ui/form";
import { DECISION_RULE_LABELS, DECISION_RULES } from "@/lib/domain/decisions";
import { JOB_KIND_LABELS, JOB_KINDS, type JobKind } from "@/lib/domain/jobs";
import { procedureApplies } from "@/lib/policy/jobs";
import { jobOpenSchema } from "@/lib/validations/jobs";

export interface NewJobChoicesProps {
  customers: { id: string; name: string }[];
  sites: { id: string; name: string; customerId: string }[];
  machines: { id: string; name: string; siteId: string; model: string | null }[];
  heads: {
    id: string;
    serial: string;
    maker: string | null;
    model: string | null;
    machineId: string | null;
  }[];
  procedures: {
    id: string;
    name: string;
    version: number;
    jobKinds: JobKind[] | null;
    headModel: string | null;
  }[];
  installers: { id: string; name: string }[];
}

const RULES = closedSetOptions(DECISION_RULES, DECISION_RULE_LABELS);
const KINDS: Option[] = closedSetOptions(JOB_KINDS, JOB_KIND_LABELS);

const noChange = () => () => {};
const browserZone = () => Intl.DateTimeFormat().resolvedOptions().timeZone || "UTC";
const zoneList = (): string[] => {
  try {
    return Intl.supportedValuesOf("timeZone");
  } catch {
    return [];
  }
};

/** Customer → site → machine → head, each list narrowed by the choice before it; then the procedures that fit. */
function Pickers({ c }: { c: NewJobChoicesProps }) {
  const form = useFormContext();
  const [customerId, siteId, machineId, headId, kind] = form.watch([
    "customerId",
    "siteId",
    "machineId",
    "headId",
    "kind",
  ]) as (string | undefined)[];
  const sites = c.sites.filter((s) => s.customerId === customerId);
  const machines = c.machines.filter((m) => m.siteId === siteId);
  // Heads mounted on the chosen machine first, then heads not mounted anywhere.
  const heads = c.heads.filter((h) => h.machineId === machineId || (machineId && h.machineId === null));
  const head = c.heads.find((h) => h.id === headId);
  const procedures = c.procedures.filter((t) =>
    procedureApplies(
      { ...t, isCurrent: true, retiredAt: null },
      (kind as JobKind | undefined) ?? "installation",
      head?.model ?? null,
    ),
  );
  return (
    <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
      <SelectField
        name="customerId"
        label="Customer"
        placeholder="Choose…"
        options={c.customers.map((x) => ({ value: x.id, label: x.name }))}
      />
      <SelectField
        name="siteId"
        label="Site"
        placeholder={customerId ? "Choose…" : "Choose the customer first"}
        options={sites.map((x) => ({ value: x.id, label: x.name }))}
      />
      <SelectField
        name="machineId"
        label="Host machine"
        placeholder={siteId ? "Choose…" : "Choose the site first"}
        options={machines.map((x) => ({ value: x.id, label: x.model ? `${x.name} (${x.model})` : x.name }))}
      />
      <SelectField
        name="headId"
        label="Head"
        placeholder={machineId ? "Choose…" : "Choose the machine first"}
        hint="Heads on this machine, then heads not mounted."
        options={heads.map((h) => ({
          value: h.id,
          label: `${h.serial}${h.model ? ` · ${[h.maker, h.model].filter(Boolean).join(" ")}` : ""}${h.machineId ? "" : " (not mounted)"}`,
        }))}
      />
      <SelectField name="kind" label="Kind of job" options={KINDS} defaultValue="installation" />
      <TextField name="title" label="Title" placeholder="Head installation on …" className="sm:col-span-1" />
      <SelectField
        name="templateId"
        label="Procedure"
        placeholder={procedures.length ? "Choose…" : "No current procedure fits this kind and head"}
        hint="Current procedures for this kind of job and head model."
        options={procedures.map((t) => ({ value: t.id, label: `${t.name} v${t.version}` }))}
      />
      <SelectField name="decisionRule" label="Decision rule" options={RULES} defaultValue="simple" />
    </div>
  );
}

function Schedule({ installers }: { installers: NewJobChoicesProps["installers"] }) {
  const form = useFormContext();
  const zone = useSyncExternalStore(noChange, browserZone, () => "");
  useEffect(() => {
    if (zone && !form.getValues("timeZone")) form.setValue("timeZone", zone);
  }, [zone, form]);
  return (
    <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
      <TextField name="scheduledDate" label="Date" type="date" />
      <TextField name="scheduledTime" label="Time (24 h)" type="time" step={300} />
      <Field name="timeZone" label="Time zone" hint="Where the machine stands, e.g. Europe/Berlin.">
        <input className={inputClass} list="time-zones" autoComplete="off" spellCheck={false} />
      </Field>
      {/* Browser-only: the server's list of zones may differ from the browser's. */}
      {zone ? (
        <datalist id="time-zones">
          {zoneList().map((z) => (
            <option key={z} value={z} />
          ))}
        </datalist>
      ) : null}
      <SelectField
        name="assignedInstallerId"
        label="Installer"
        placeholder="Not assigned yet"
        hint="They are e-mailed the job."
        options={installers.map((i) => ({ value: i.id, label: i.name }))}
      />
    </div>
  );
}

/** "New job": where, what, for whom and when; opens a draft and goes to it. */
export function NewJobForm({ choices }: { choices: NewJobChoicesProps }) {
  const router = useRouter();
  return (
    <Form
      action={openJobAction}
      schema={jobOpenSchema}
      submitLabel="Open the job"
      successMessage="Job opened as a draft."
      resetOnSuccess={false}
      onSuccess={(d) => router.push(`/jobs/${d.id}`)}
      aria-label="New job"
      className="space-y-6"
    >
      <fieldset className="space-y-3">
        <legend className="text-base font-semibold text-graphite-900">Machine and head</legend>
        <Pickers c={choices} />
      </fieldset>
      <fieldset className="space-y-3">
        <legend className="text-base font-semibold text-graphite-900">Customer&apos;s order</legend>
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
          <TextField name="orderReference" label="Order reference" placeholder="PO number" numeric />
          <TextField name="customerContactName" label="Contact name" autoComplete="off" />
          <TextField name="customerContactEmail" label="Contact e-mail" type="email" autoComplete="off" />
        </div>
      </fieldset>
      <fieldset className="space-y-3">
        <legend className="text-base font-semibold text-graphite-900">Schedule and installer</legend>
        <Schedule installers={choices.installers} />
      </fieldset>
      <Field name="notes" label="Notes for the installer" hint="Access, crane booking, contact on site…">
        <textarea className={`${inputClass} min-h-24 py-2`} rows={3} />
      </Field>
    </Form>
  );
}
