"use client";

import { closedSetOptions } from "@/components/ui/field";
import { useRouter } from "next/navigation";
import { useMemo, useReducer } from "react";
import { Button } from "@/components/ui/button";
import { ColumnMapping } from "./column-mapping";
import { scanCsv } from "./csv-scan";
import { IssueList } from "./issue-list";
import { KIND_HINTS, KIND_LABELS, PHASE_LABELS, type DatasetKindKey } from "./kinds";
import { clientIssues, renamedHeader, type Issue } from "./upload-checks";
import { Bar, Choice, DropZone, KindOptions } from "./upload-controls";
import { initialUploadState, uploadReducer, type UploadState } from "./upload-state";
import { uploadWithProgress } from "./upload-with-progress";

const KINDS = Object.keys(KIND_LABELS) as DatasetKindKey[];

/** The form fields the upload route reads, for the chosen kind. */
function uploadForm(s: UploadState, file: File, header: string | undefined): FormData {
  const form = new FormData();
  form.set("kind", s.kind);
  form.set("phase", s.phase);
  form.set("decimal", s.comma ? "comma" : "point");
  if (s.kind === "sphere_probe" || s.kind === "tcp_check") form.set("units", s.units.units);
  if (s.kind === "tram") {
    form.set("travel_units", s.units.travel);
    form.set("reading_units", s.units.reading);
  }
  if (s.kind === "sweep") {
    form.set("reading_units", s.units.reading);
    form.set("radius_mm", s.radius);
  }
  if (s.kind === "test_part" && s.uncertainty !== "") form.set("uncertainty_mm", s.uncertainty);
  if (s.kind === "rotary_positioning") {
    form.set("axis", s.axis);
    if (s.uncertainty !== "") form.set("uncertainty_arcsec", s.uncertainty);
  }
  if (header) form.set("header", header);
  form.set("file", file, file.name);
  return form;
}

export function UploadPanel({ jobId }: { jobId: string }) {
  const router = useRouter();
  const [state, dispatch] = useReducer(uploadReducer, initialUploadState);
  const { kind, phase, file, scan, scanning, mapping, comma, uploadProgress, serverIssues, message } = state;

  async function pick(f: File | null) {
    dispatch({ type: "pick", file: f });
    if (!f) return;
    try {
      const s = await scanCsv(f, (fraction) => dispatch({ type: "set", patch: { scanProgress: fraction } }));
      dispatch({ type: "scanned", scan: s });
    } catch {
      dispatch({ type: "scanFailed" });
    }
  }

  const issues = useMemo(
    () => (scan ? clientIssues(kind, scan, mapping, comma) : []),
    [kind, scan, mapping, comma],
  );
  const header = useMemo(
    () => (scan ? renamedHeader(kind, scan, mapping) : undefined),
    [scan, mapping, kind],
  );

  const formProblems: string[] = [];
  if (kind === "sweep" && !(Number(state.radius) > 0)) formProblems.push("Enter the sweep radius in mm.");
  if (kind === "test_part" && state.uncertainty !== "" && !(Number(state.uncertainty) >= 0))
    formProblems.push("The expanded uncertainty must be a number ≥ 0 mm.");
  if (kind === "rotary_positioning" && state.uncertainty !== "" && !(Number(state.uncertainty) >= 0))
    formProblems.push("The expanded uncertainty must be a number ≥ 0″.");
  const canSend =
    !!file &&
    !!scan &&
    !scanning &&
    issues.length === 0 &&
    formProblems.length === 0 &&
    uploadProgress === null;

  async function send() {
    if (!file || !canSend) return;
    dispatch({ type: "sending" });
    try {
      const res = await uploadWithProgress<{ id?: string; error?: { message: string; issues?: Issue[] } }>(
        `/api/jobs/${jobId}/datasets`,
        uploadForm(state, file, header),
        (fraction) => dispatch({ type: "progress", fraction }),
      );
      if (res.status === 201 && res.body?.id) {
        dispatch({ type: "progress", fraction: 1 });
        router.push(`/jobs/${jobId}/data/${res.body.id}`);
        router.refresh();
        return;
      }
      dispatch({
        type: "refused",
        message:
          res.body?.error?.message ?? `The server refused the upload (${res.status}); nothing was stored.`,
        issues: res.body?.error?.issues ?? [],
      });
    } catch {
      dispatch({
        type: "refused",
        message:
          "The upload did not reach the server; nothing was stored. Check the connection and try again.",
        issues: [],
      });
    }
  }

  return (
    <section
      aria-labelledby="upload-title"
      className="space-y-5 rounded-card border border-graphite-200 bg-white p-5 shadow-sm"
    >
      <div>
        <h2 id="upload-title" className="text-base font-semibold">
          Add measurement data
        </h2>
        <p className="text-sm text-graphite-600">
          The file is checked here first and again on the server; the original is kept unchanged with its
          SHA-256.
        </p>
      </div>
      <div className="grid gap-4 lg:grid-cols-2">
        <Choice
          legend="What the file holds"
          name="kind"
          value={kind}
          options={closedSetOptions(KINDS, KIND_LABELS)}
          onChange={(k) => dispatch({ type: "kind", kind: k })}
        />
        <Choice
          legend="When it was measured"
          name="phase"
          value={phase}
          options={closedSetOptions(["pre", "post"] as const, PHASE_LABELS)}
          onChange={(p) => dispatch({ type: "set", patch: { phase: p } })}
        />
      </div>
      <p className="text-sm text-graphite-600">{KIND_HINTS[kind]}</p>
      <KindOptions state={state} set={(patch) => dispatch({ type: "set", patch })} />
      <DropZone file={file} onPick={(f) => void pick(f)} />
      {scanning || scan ? (
        <Bar label="Reading the file in the browser" fraction={scanning ? state.scanProgress : 1} />
      ) : null}
      {scan && scan.headers.length > 0 ? (
        <ColumnMapping
          scan={scan}
          kind={kind}
          mapping={mapping}
          header={header}
          open={state.mappingOpen}
          onToggle={(open) => dispatch({ type: "set", patch: { mappingOpen: open } })}
          onMap={(column, index) => dispatch({ type: "map", column, index })}
        />
      ) : null}
      {message ? (
        <p role="alert" className="rounded-lg border border-fail-600/40 bg-fail-50 p-3 text-sm text-fail-700">
          {message}
        </p>
      ) : null}
      <IssueList
        issues={serverIssues.length > 0 ? serverIssues : issues}
        fromServer={serverIssues.length > 0}
      />
      {formProblems.length > 0 && scan ? (
        <p className="text-sm text-fail-700">{formProblems.join(" ")}</p>
      ) : null}
      {uploadProgress !== null ? <Bar label="Sending to the server" fraction={uploadProgress} /> : null}
      <div className="flex items-center gap-3">
        <Button onClick={() => void send()} disabled={!canSend} size="lg">
          Upload and check
        </Button>
        {scan && issues.length === 0 ? (
          <span className="text-sm text-pass-700">✓ No problems found in the browser</span>
        ) : null}
      </div>
    </section>
  );
}
