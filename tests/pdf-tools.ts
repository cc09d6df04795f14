// Reading a PDF back with poppler's command-line tools (an independent reader, installed from
// Debian), for the tests that check what a report file says and holds.
import { execFileSync } from "node:child_process";
import { mkdirSync, mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { expect } from "vitest";

/** Writes the bytes to a new file under TMPDIR and returns its path (a path is returned as given). */
export function pdfFile(pdf: Uint8Array | string): string {
  if (typeof pdf === "string") return pdf;
  const file = path.join(mkdtempSync(path.join(process.env.TMPDIR ?? tmpdir(), "trammel-pdf-")), "r.pdf");
  writeFileSync(file, pdf);
  return file;
}

/** The text pdftotext reads from the file, runs of white space as one space when `collapse`. */
export function pdfText(pdf: Uint8Array | string, collapse = false): string {
  const text = execFileSync("pdftotext", [pdfFile(pdf), "-"]).toString("utf8");
  return collapse ? text.replace(/\s+/g, " ") : text;
}

/**
 * Checks that the text holds each phrase, one check a phrase, so a failure names the phrase that
 * is missing. Say beside the list where the phrases come from.
 */
export function expectPhrases(text: string, phrases: readonly string[]): void {
  for (const phrase of phrases) expect(text, `the PDF says "${phrase}"`).toContain(phrase);
}

/** Renders every page of the file as a PNG at this resolution (dpi), as `<prefix>-<page>.png` (its folder made if missing). */
export function pdfPagesToPng(pdf: Uint8Array | string, prefix: string, dpi: number): void {
  mkdirSync(path.dirname(prefix), { recursive: true });
  execFileSync("pdftoppm", ["-png", "-r", String(dpi), pdfFile(pdf), prefix]);
}

/** "width x height" of every image pdfimages lists (its table: page num type width height …). */
export function pdfImageSizes(pdf: Uint8Array | string): string[] {
  return execFileSync("pdfimages", ["-list", pdfFile(pdf)])
    .toString("utf8")
    .split("\n")
    .slice(2)
    .map((l) => l.trim().split(/\s+/))
    .filter((c) => c.length > 4)
    .map((c) => `${c[3]}x${c[4]}`);
}
