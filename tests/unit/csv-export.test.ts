// Spreadsheet formula injection (OWASP, "CSV Injection"): cells starting with = + - @, tab or CR
// are prefixed with a single quote; quoting per RFC 4180.
import { describe, expect, it } from "vitest";
import { neutraliseCell, quoteField, toCsv } from "@/lib/csv-export";

describe("neutraliseCell", () => {
  it.each(['=HYPERLINK("http://x")', "+1+2", "-2+3", "@SUM(A1)", "\tcmd", "\rcmd"])(
    "prefixes %j with a quote",
    (s) => {
      expect(neutraliseCell(s)).toBe(`'${s}`);
    },
  );
  it("leaves ordinary text alone", () => {
    expect(neutraliseCell("Collar face TIR")).toBe("Collar face TIR");
    expect(neutraliseCell("a=b")).toBe("a=b");
    expect(neutraliseCell("")).toBe("");
  });
  it("writes numbers as numbers, negative ones too (data, not a formula)", () => {
    expect(neutraliseCell(-0.0127)).toBe("-0.0127");
    expect(neutraliseCell(3.175)).toBe("3.175");
    expect(neutraliseCell(Number.NaN)).toBe("");
  });
  it("null and undefined are empty cells", () => {
    expect(neutraliseCell(null)).toBe("");
    expect(neutraliseCell(undefined)).toBe("");
  });
});

describe("toCsv", () => {
  it("quotes commas, quotes and line breaks (RFC 4180) after neutralising", () => {
    expect(quoteField('say "hi", ok')).toBe('"say ""hi"", ok"');
    const csv = toCsv(
      ["a", "b"],
      [
        ["=1,2", 'x"y'],
        [-1, "line\nbreak"],
      ],
    );
    expect(csv).toBe('a,b\r\n"\'=1,2","x""y"\r\n-1,"line\nbreak"\r\n');
  });
});
