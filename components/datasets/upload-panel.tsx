"use client";

import { ScrollRegion } from "@/components/ui/scroll-region";
import { useRouter } from "next/navigation";
import { useMemo, useRef, useState } from "react";
import { scanCsv, MAX_LISTED, type CsvScan } from "./csv-scan";
import { COLUMNS, guessMapping, KIND_HINTS, KIND_LABELS, PHASE_LABELS, type DatasetKindKey } from "./kinds";

type Issue = { row?: number; column?: string; field?: string; message: string };
type Units = { units: "mm" | "in"; travel: "mm" | "in"; reading: "um" | "mm" | "in" };

const KINDS = Object.keys(KIND_LABELS) as DatasetKindKey[];

function Choice<T extends string>({
  legend,
  name,
  value,
  options,
  onChange,
}: {
  legend: string;
  name: string;
  value: T;
  options: ReadonlyArray<{ value: T; label: string }>;
  onChange: (v: T) => void;
}) {
  return (
    <fieldset>
      <legend className="mb-1 text-sm font-medium text-graphite-800">{legend}</legend>
      <div className="inline-flex flex-wrap gap-1 rounded-lg border border-graphite-300 bg-graphite-50 p-1">
        {options.map((o) => (
          <label
            key={o.value}
            className={`flex min-h-touch cursor-pointer items-center rounded-md px-3 text-sm ${value === o.value ? "bg-white font-semibold text-graphite-900 shadow-sm ring-1 ring-graphite-300" : "text-graphite-600 hover:text-graphite-900"}`}
          >
            <input
              type="radio"
              className="sr-only"
              name={name}
              value={o.value}
              checked={value === o.value}
              onChange={() => onChange(o.value)}
            />
            {o.label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

function Bar({ label, fraction }: { label: string; fraction: number }) {
  const pct = Math.round(fraction * 100);
  return (
    <div className="space-y-1">
      <div className="flex justify-between text-sm text-graphite-700">
        <span>{label}</span>
        <span className="num">{pct} %</span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={pct}
        className="h-2.5 overflow-hidden rounded-full bg-graphite-200"
      >
        <div className="h-full rounded-full bg-accent-500 transition-[width]" style={{ width: `${pct}%` }} />
      </div>
    </div>
  );
}

/** Row-level checks of the scan under the chosen mapping and decimal separator (a preview of the server's). */
function clientIssues(
  kind: DatasetKindKey,
  scan: CsvScan,
  mapping: Record<string, number>,
  comma: boolean,
): Issue[] {
  const out: Issue[] = [];
  if (scan.headers.length === 0) return [{ row: 1, message: "the file is empty; a header row is required" }];
  const used = new Map<number, string>();
  for (const c of COLUMNS[kind]) {
    const i = mapping[c.name] ?? -1;
    if (i < 0) {
      if (c.required)
        out.push({
          row: 1,
          column: c.name,
          message: `the required column '${c.name}' is not mapped to a column of the file`,
        });
      continue;
    }
    if (used.has(i))
      out.push({
        row: 1,
        column: scan.headers[i],
        message: `mapped to both '${used.get(i)}' and '${c.name}'`,
      });
    used.set(i, c.name);
  }
  if (scan.rows === 0) out.push({ row: 1, message: "the file has a header row but no data rows" });
  for (const s of scan.structural) out.push(s);
  for (const r of scan.ragged)
    out.push({
      row: r.row,
      message: `has ${r.fields} field${r.fields === 1 ? "" : "s"}, the header has ${scan.headers.length}`,
    });
  for (const c of COLUMNS[kind]) {
    const i = mapping[c.name] ?? -1;
    if (i < 0) continue;
    const col = scan.columns[i]!;
    const shown = scan.headers[i]!;
    if (c.numeric) {
      for (const b of comma ? col.badComma : col.badPoint)
        out.push({ row: b.row, column: shown, message: `'${b.value.slice(0, 40)}' is not a number` });
      if (!c.allowEmpty)
        for (const r of col.empty)
          out.push({ row: r, column: shown, message: "empty; a number is required" });
    } else if (c.required) {
      for (const r of col.empty) out.push({ row: r, column: shown, message: `empty; name the ${c.name}` });
    }
  }
  return out.sort((a, b) => (a.row ?? 0) - (b.row ?? 0)).slice(0, MAX_LISTED);
}

export function UploadPanel({ jobId }: { jobId: string }) {
  const router = useRouter();
  const inputRef = useRef<HTMLInputElement>(null);
  const [kind, setKind] = useState<DatasetKindKey>("test_part");
  const [phase, setPhase] = useState<"pre" | "post">("post");
  const [units, setUnits] = useState<Units>({ units: "mm", travel: "mm", reading: "um" });
  const [radius, setRadius] = useState("");
  const [uncertainty, setUncertainty] = useState("");
  const [comma, setComma] = useState(false);
  const [file, setFile] = useState<File | null>(null);
  const [scan, setScan] = useState<CsvScan | null>(null);
  const [scanProgress, setScanProgress] = useState(0);
  const [scanning, setScanning] = useState(false);
  const [mapping, setMapping] = useState<Record<string, number>>({});
  const [uploadProgress, setUploadProgress] = useState<number | null>(null);
  const [serverIssues, setServerIssues] = useState<Issue[]>([]);
  const [message, setMessage] = useState<string | null>(null);
  const [dragging, setDragging] = useState(false);
  const [mappingOpen, setMappingOpen] = useState(false);

  async function pick(f: File | null, k: DatasetKindKey = kind) {
    setFile(f);
    setScan(null);
    setServerIssues([]);
    setMessage(null);
    setUploadProgress(null);
    if (!f) return;
    setScanning(true);
    setScanProgress(0);
    try {
      const s = await scanCsv(f, setScanProgress);
      setScan(s);
      const m = guessMapping(k, s.headers);
      setMapping(m);
      setMappingOpen(COLUMNS[k].some((c) => c.required && (m[c.name] ?? -1) < 0));
      setComma(s.looksDecimalComma);
    } catch {
      setMessage("The file could not be read in the browser. Is it a CSV text file?");
    } finally {
      setScanning(false);
    }
  }

  function changeKind(k: DatasetKindKey) {
    setKind(k);
    setServerIssues([]);
    if (scan) {
      const m = guessMapping(k, scan.headers);
      setMapping(m);
      if (COLUMNS[k].some((c) => c.required && (m[c.name] ?? -1) < 0)) setMappingOpen(true);
    }
  }

  const issues = useMemo(
    () => (scan ? clientIssues(kind, scan, mapping, comma) : []),
    [kind, scan, mapping, comma],
  );

  /** The replacement header line when the mapping renames anything; undefined when the file's own names serve. */
  const header = useMemo(() => {
    if (!scan) return undefined;
    const names = scan.headers.map((_, i) => `unused_${i + 1}`);
    let renamed = false;
    for (const c of COLUMNS[kind]) {
      const i = mapping[c.name] ?? -1;
      if (i < 0) continue;
      names[i] = c.name;
      if (scan.headers[i]!.trim().toLowerCase() !== c.name) renamed = true;
    }
    // A file column that carries a canonical name but is mapped elsewhere must be renamed too.
    scan.headers.forEach((h, i) => {
      if (names[i]!.startsWith("unused_") && COLUMNS[kind].some((c) => c.name === h.trim().toLowerCase()))
        renamed = true;
    });
    if (!renamed) return undefined;
    scan.headers.forEach((h, i) => {
      if (
        names[i]!.startsWith("unused_") &&
        /^[A-Za-z0-9_ ]+$/.test(h) &&
        !COLUMNS[kind].some((c) => c.name === h.trim().toLowerCase())
      )
        names[i] = h;
    });
    return names.join(scan.delimiter === ";" ? ";" : ",");
  }, [scan, mapping, kind]);

  const formProblems: string[] = [];
  if (kind === "sweep" && !(Number(radius) > 0)) formProblems.push("Enter the sweep radius in mm.");
  if (kind === "test_part" && uncertainty !== "" && !(Number(uncertainty) >= 0))
    formProblems.push("The expanded uncertainty must be a number ≥ 0 mm.");
  const canSend =
    !!file &&
    !!scan &&
    !scanning &&
    issues.length === 0 &&
    formProblems.length === 0 &&
    uploadProgress === null;

  function send() {
    if (!file || !canSend) return;
    const form = new FormData();
    form.set("kind", kind);
    form.set("phase", phase);
    form.set("decimal", comma ? "comma" : "point");
    if (kind === "sphere_probe") form.set("units", units.units);
    if (kind === "tram") {
      form.set("travel_units", units.travel);
      form.set("reading_units", units.reading);
    }
    if (kind === "sweep") {
      form.set("reading_units", units.reading);
      form.set("radius_mm", radius);
    }
    if (kind === "test_part" && uncertainty !== "") form.set("uncertainty_mm", uncertainty);
    if (header) form.set("header", header);
    form.set("file", file, file.name);
    const xhr = new XMLHttpRequest();
    xhr.open("POST", `/api/jobs/${jobId}/datasets`);
    xhr.responseType = "json";
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) setUploadProgress(e.loaded / e.total);
    };
    xhr.onerror = () => {
      setUploadProgress(null);
      setMessage(
        "The upload did not reach the server; nothing was stored. Check the connection and try again.",
      );
    };
    xhr.onload = () => {
      const body = xhr.response as { id?: string; error?: { message: string; issues?: Issue[] } } | null;
      if (xhr.status === 201 && body?.id) {
        setUploadProgress(1);
        router.push(`/jobs/${jobId}/data/${body.id}`);
        router.refresh();
        return;
      }
      setUploadProgress(null);
      setMessage(
        body?.error?.message ?? `The server refused the upload (${xhr.status}); nothing was stored.`,
      );
      setServerIssues(body?.error?.issues ?? []);
    };
    setUploadProgress(0);
    setMessage(null);
    setServerIssues([]);
    xhr.send(form);
  }

  const listed = serverIssues.length > 0 ? serverIssues : issues;

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
          options={KINDS.map((k) => ({ value: k, label: KIND_LABELS[k] }))}
          onChange={changeKind}
        />
        <Choice
          legend="When it was measured"
          name="phase"
          value={phase}
          options={(["pre", "post"] as const).map((p) => ({ value: p, label: PHASE_LABELS[p] }))}
          onChange={setPhase}
        />
      </div>
      <p className="text-sm text-graphite-600">{KIND_HINTS[kind]}</p>

      <div className="flex flex-wrap gap-4">
        {kind === "sphere_probe" ? (
          <Choice
            legend="Unit of x, y, z"
            name="units"
            value={units.units}
            options={[
              { value: "mm", label: "mm" },
              { value: "in", label: "inch" },
            ]}
            onChange={(v) => setUnits({ ...units, units: v })}
          />
        ) : null}
        {kind === "tram" ? (
          <Choice
            legend="Unit of the travel"
            name="travel_units"
            value={units.travel}
            options={[
              { value: "mm", label: "mm" },
              { value: "in", label: "inch" },
            ]}
            onChange={(v) => setUnits({ ...units, travel: v })}
          />
        ) : null}
        {kind === "tram" || kind === "sweep" ? (
          <Choice
            legend="Unit of the readings"
            name="reading_units"
            value={units.reading}
            options={[
              { value: "um", label: "µm" },
              { value: "mm", label: "mm" },
              { value: "in", label: "inch" },
            ]}
            onChange={(v) => setUnits({ ...units, reading: v })}
          />
        ) : null}
        {kind === "sweep" ? (
          <label className="block space-y-1">
            <span className="text-sm font-medium text-graphite-800">Sweep radius (mm)</span>
            <input
              inputMode="decimal"
              value={radius}
              onChange={(e) => setRadius(e.target.value)}
              className="num block min-h-touch w-40 rounded-lg border border-graphite-300 px-3 text-right"
            />
          </label>
        ) : null}
        {kind === "test_part" ? (
          <label className="block max-w-md space-y-1">
            <span className="text-sm font-medium text-graphite-800">
              Expanded uncertainty U (k = 2) of the part measurement, mm
            </span>
            <input
              inputMode="decimal"
              value={uncertainty}
              placeholder="e.g. 0.002"
              onChange={(e) => setUncertainty(e.target.value)}
              className="num block min-h-touch w-40 rounded-lg border border-graphite-300 px-3 text-right"
            />
            <span className="block text-xs text-graphite-600">
              From the measuring machine&apos;s calibration; converted for rows in inch or µm. Empty counts as
              0.
            </span>
          </label>
        ) : null}
        {scan?.delimiter === ";" ? (
          <Choice
            legend="Decimal separator"
            name="decimal"
            value={comma ? "comma" : "point"}
            options={[
              { value: "point", label: "point 1.5" },
              { value: "comma", label: "comma 1,5" },
            ]}
            onChange={(v) => setComma(v === "comma")}
          />
        ) : null}
      </div>

      <div
        onDragOver={(e) => {
          e.preventDefault();
          setDragging(true);
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={(e) => {
          e.preventDefault();
          setDragging(false);
          void pick(e.dataTransfer.files[0] ?? null);
        }}
        className={`flex flex-col items-center gap-2 rounded-card border-2 border-dashed p-6 text-center ${dragging ? "border-accent-500 bg-accent-50" : "border-graphite-300 bg-graphite-50"}`}
      >
        <svg viewBox="0 0 24 24" className="h-8 w-8 text-graphite-500" aria-hidden="true">
          <path
            d="M12 16V4m0 0-4 4m4-4 4 4M4 16v3a1 1 0 0 0 1 1h14a1 1 0 0 0 1-1v-3"
            fill="none"
            stroke="currentColor"
            strokeWidth="1.8"
            strokeLinecap="round"
            strokeLinejoin="round"
          />
        </svg>
        <p className="text-sm text-graphite-700">Drop a CSV file here, or</p>
        <button
          type="button"
          onClick={() => inputRef.current?.click()}
          className="min-h-touch rounded-lg border border-graphite-300 bg-white px-4 text-sm font-semibold hover:bg-graphite-100"
        >
          Choose a file
        </button>
        <input
          ref={inputRef}
          type="file"
          accept=".csv,text/csv,text/plain"
          aria-label="CSV file"
          className="sr-only"
          onChange={(e) => {
            void pick(e.target.files?.[0] ?? null);
            e.target.value = "";
          }}
        />
        {file ? (
          <p className="text-sm" data-testid="chosen-file">
            <span className="font-medium">{file.name}</span> ·{" "}
            <span className="num">{(file.size / 1024).toFixed(1)} KiB</span>
          </p>
        ) : null}
      </div>

      {scanning || scan ? (
        <Bar label="Reading the file in the browser" fraction={scanning ? scanProgress : 1} />
      ) : null}

      {scan && scan.headers.length > 0 ? (
        <div className="space-y-3">
          <h3 className="text-sm font-semibold">
            Preview{" "}
            <span className="font-normal text-graphite-600">
              — <span className="num">{scan.rows.toLocaleString("en-GB")}</span> data rows, separated by “
              {scan.delimiter}”
            </span>
          </h3>
          <ScrollRegion
            label="Preview of the first rows, table"
            className="rounded-lg border border-graphite-200"
          >
            <table className="w-full text-sm" aria-label="Preview of the first rows">
              <thead className="bg-graphite-50 text-left">
                <tr>
                  <th scope="col" className="px-3 py-2 text-right font-medium text-graphite-600">
                    Row
                  </th>
                  {scan.headers.map((h, i) => (
                    <th key={i} scope="col" className="px-3 py-2 align-top font-medium">
                      <div>{h || <em className="text-graphite-500">no name</em>}</div>
                      <div className="text-xs font-normal text-graphite-600">
                        {COLUMNS[kind].find((c) => mapping[c.name] === i)?.label ?? "not used"}
                      </div>
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody className="divide-y divide-graphite-100">
                {scan.preview.map((r, k) => (
                  <tr key={k}>
                    <td className="num px-3 py-1.5 text-right text-graphite-500">{k + 2}</td>
                    {scan.headers.map((_, i) => (
                      <td key={i} className="num px-3 py-1.5">
                        {r[i] ?? ""}
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </ScrollRegion>
          <details
            className="rounded-lg border border-graphite-200 p-3"
            open={mappingOpen}
            onToggle={(e) => setMappingOpen(e.currentTarget.open)}
          >
            <summary className="cursor-pointer text-sm font-medium">
              Columns: matched from the header names — change a match here
            </summary>
            <div className="mt-3 grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
              {COLUMNS[kind].map((c) => (
                <label key={c.name} className="block space-y-1">
                  <span className="text-sm">
                    {c.label} <span className="num text-xs text-graphite-600">{c.name}</span>
                    {c.required ? <span className="text-xs text-graphite-600"> · required</span> : null}
                  </span>
                  <select
                    aria-label={`File column for ${c.name}`}
                    value={mapping[c.name] ?? -1}
                    onChange={(e) => setMapping({ ...mapping, [c.name]: Number(e.target.value) })}
                    className="block min-h-touch w-full rounded-lg border border-graphite-300 bg-white px-2 text-sm"
                  >
                    <option value={-1}>— not in the file —</option>
                    {scan.headers.map((h, i) => (
                      <option key={i} value={i}>
                        {h || `column ${i + 1}`}
                      </option>
                    ))}
                  </select>
                </label>
              ))}
            </div>
            {header ? (
              <p className="mt-2 text-xs text-graphite-600">
                The server reads the file with the header line <code className="num">{header}</code>; the
                stored original keeps yours.
              </p>
            ) : null}
          </details>
        </div>
      ) : null}

      {message ? (
        <p role="alert" className="rounded-lg border border-fail-600/40 bg-fail-50 p-3 text-sm text-fail-700">
          {message}
        </p>
      ) : null}

      {listed.length > 0 ? (
        <div className="rounded-lg border-2 border-fail-600/50 bg-fail-50 p-4" data-testid="row-errors">
          <p className="mb-2 flex items-center gap-2 text-sm font-semibold text-fail-700">
            <svg viewBox="0 0 12 12" className="h-3.5 w-3.5" aria-hidden="true">
              <path d="M2.5 2.5l7 7M9.5 2.5l-7 7" stroke="currentColor" strokeWidth="2" />
            </svg>
            {serverIssues.length > 0
              ? "The server found problems; nothing was stored:"
              : `${listed.length}${listed.length >= MAX_LISTED ? "+" : ""} problem${listed.length === 1 ? "" : "s"} to fix before this file can be sent:`}
          </p>
          <table className="w-full text-sm">
            <thead className="text-left text-fail-700">
              <tr>
                <th scope="col" className="w-16 py-1 pr-3 text-right font-medium">
                  Row
                </th>
                <th scope="col" className="w-40 py-1 pr-3 font-medium">
                  Column
                </th>
                <th scope="col" className="py-1 font-medium">
                  Problem
                </th>
              </tr>
            </thead>
            <tbody className="text-graphite-900">
              {listed.map((i, k) => (
                <tr key={k} className="border-t border-fail-600/20">
                  <td className="num py-1 pr-3 text-right">{i.row ?? "—"}</td>
                  <td className="num py-1 pr-3">{i.column ?? i.field ?? "—"}</td>
                  <td className="py-1">{i.message}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
      {formProblems.length > 0 && scan ? (
        <p className="text-sm text-fail-700">{formProblems.join(" ")}</p>
      ) : null}

      {uploadProgress !== null ? <Bar label="Sending to the server" fraction={uploadProgress} /> : null}

      <div className="flex items-center gap-3">
        <button
          type="button"
          onClick={send}
          disabled={!canSend}
          className="min-h-touch rounded-lg bg-accent-600 px-5 font-semibold text-white hover:bg-accent-700 disabled:cursor-not-allowed disabled:opacity-50"
        >
          Upload and check
        </button>
        {scan && issues.length === 0 ? (
          <span className="text-sm text-pass-700">✓ No problems found in the browser</span>
        ) : null}
      </div>
    </section>
  );
}
