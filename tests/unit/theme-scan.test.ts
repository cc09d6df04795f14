// Every colour comes from lib/domain/theme.ts, shared by Tailwind, the PDF and the 3D view: this
// scans the app's source for a colour written as a hex literal anywhere else and fails on one. The
// scanner itself is tested on planted colours below.
import { describe, expect, it } from "vitest";
import { expectNothingFound } from "./source-scan";

const SCANNED = ["app", "components", "lib"];
const ALLOWED = [/^lib\/domain\/theme\.ts$/];

/** A quoted CSS hex colour: "#555", '#1f2937', `#1f2937cc`. */
const HEX = /["'`]#(?:[0-9a-fA-F]{3,4}|[0-9a-fA-F]{6}|[0-9a-fA-F]{8})["'`]/;

/** The hex colours in one file's text, as "line: text". */
export function hexColours(text: string): string[] {
  return text.split("\n").flatMap((line, i) => (HEX.test(line) ? [`${i + 1}: ${line.trim()}`] : []));
}

describe("colours come from the theme", () => {
  it("finds no hex colour outside lib/domain/theme.ts", () =>
    expectNothingFound(SCANNED, ALLOWED, hexColours));

  it("catches a planted colour and leaves ids, anchors and hashes alone", () => {
    expect(hexColours(`<Text style={{ color: "#555" }}>`)).toHaveLength(1);
    expect(hexColours(`const ink = '#1f2937';`)).toHaveLength(1);
    expect(hexColours("fill={`#1f2937cc`}")).toHaveLength(1);
    expect(hexColours(`<a href="#sign">Sign</a>`)).toEqual([]);
    expect(hexColours(`const sha = "#${"a".repeat(64)}";`)).toEqual([]);
  });
});
