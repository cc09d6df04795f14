// The PDF renderer: every glyph the trade needs comes out as text (checked with poppler's
// pdftotext, an independent reader), pages are numbered "x of y", signatures carry name,
// meaning and a time with its zone, and the QR code decodes (jsQR) to the verify URL.
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import jsQR from "jsqr";
import { PNG } from "pngjs";
import { beforeAll, describe, expect, it } from "vitest";
import { renderReportPdf } from "@/lib/report/render";
import { samplePng, samplePngSha256, sampleReport } from "../fixtures/report/sample-report";
import { pdfImageSizes, pdfText } from "../pdf-tools";

let pdf: Buffer;
let text: string;
const dir = mkdtempSync(path.join(process.env.TMPDIR ?? tmpdir(), "trammel-pdf-"));

beforeAll(async () => {
  pdf = await renderReportPdf(sampleReport, undefined, new Map([[samplePngSha256, samplePng]]));
  writeFileSync(path.join(dir, "r.pdf"), pdf);
  text = pdfText(path.join(dir, "r.pdf"));
}, 30_000);

describe("report PDF", () => {
  it("is a PDF with its title and identification", () => {
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    expect(text).toContain("Acceptance report — two-axis head");
    expect(text).toContain("TR-2026-0041");
    expect(text).toContain("0b6f3c2a-5d1e-4c9b-9a7e-2f3d4c5b6a71");
  });

  it("extracts µ ° ± ″ Ø and the minus sign as text (the fonts cover them)", () => {
    for (const g of ["µm", "20.6 °C", "± 10″", "Ø40", "−14.0 µm", "≤ 12.7 µm"]) expect(text).toContain(g);
  });

  it("numbers its pages as page x of y", () => {
    const pages = Number(
      execFileSync("pdfinfo", [path.join(dir, "r.pdf")])
        .toString()
        .match(/Pages:\s+(\d+)/)![1],
    );
    expect(text).toContain(`Page 1 of ${pages}`);
    expect(text).toContain(`Page ${pages} of ${pages}`);
  });

  it("shows each signature's name, role, meaning and time with zone", () => {
    for (const g of sampleReport.signatures) {
      expect(text).toContain(g.meaning);
      expect(text).toContain(`${g.name} — ${g.role}`);
      expect(text).toContain(g.signedAtUtc);
    }
    expect(text).toMatch(/\d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC/);
  });

  it("prints the decision rule and limit source beside each judged row (ISO/IEC 17025:2017 §7.8.6.1)", () => {
    const flat = text.replace(/\s+/g, " ");
    const judged = [...sampleReport.readings, ...sampleReport.parameters, ...sampleReport.testPart].filter(
      (r) => r.basis,
    );
    expect(judged.length).toBeGreaterThanOrEqual(4);
    for (const r of judged) expect(flat).toContain(r.basis!.replace(/\s+/g, " "));
  });

  it("ends with a clear end-of-report mark", () => {
    expect(text).toContain("END OF REPORT");
  });

  it("carries a QR code that decodes to the verify URL", () => {
    const pages = Number(
      execFileSync("pdfinfo", [path.join(dir, "r.pdf")])
        .toString()
        .match(/Pages:\s+(\d+)/)![1],
    );
    execFileSync("pdftoppm", [
      "-png",
      "-r",
      "150",
      "-f",
      String(pages),
      "-l",
      String(pages),
      "-singlefile",
      path.join(dir, "r.pdf"),
      path.join(dir, "last"),
    ]);
    const png = PNG.sync.read(readFileSync(path.join(dir, "last.png")));
    const code = jsQR(new Uint8ClampedArray(png.data), png.width, png.height);
    expect(code?.data).toBe(sampleReport.verifyUrl);
  });

  it("embeds the saved picture of the 3D view at its own size, with its caption (pdfimages lists it)", () => {
    // The QR code is the other image.
    expect(pdfImageSizes(path.join(dir, "r.pdf"))).toContain("320x200");
    expect(text).toContain("The 3D view as saved by the engineer, errors × 300");
    expect(text).toContain(`SHA-256 ${samplePngSha256.slice(0, 16)}`);
  });

  it("draws the readings, parameter and residual charts with their captions and values", () => {
    const flat = text.replace(/\s+/g, " ");
    expect(text).toContain("Checklist readings before and after adjustment against their limits.");
    expect(flat).toContain("before +21.6 µm → after +7.6 µm; limits ≤ +12.7 µm");
    expect(text).toContain("Fitted head parameters against the procedure's limits.");
    expect(flat).toContain("+18.4 ± 1.1 µm; limits −25.0 … +25.0 µm; pass");
    // 3 s = 3.15 µm: one of the eight bars (3.6) is beyond it.
    expect(text).toContain("3 s = 3.15");
    expect(flat).toMatch(/1 bar beyond it/);
  });

  it("refuses a picture whose bytes do not hash to the name the report gives it", async () => {
    const other = Buffer.from(samplePng);
    other.writeUInt8(other.readUInt8(other.length - 20) ^ 0xff, other.length - 20);
    await expect(
      renderReportPdf(sampleReport, undefined, new Map([[samplePngSha256, other]])),
    ).rejects.toThrow(/other bytes/);
  });
});
