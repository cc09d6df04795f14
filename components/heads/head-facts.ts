/** A head's configuration as label/value rows, the same on the job page and in the heads register. */
export interface HeadConfiguration {
  maker: string | null;
  model: string | null;
  primaryAxis: string;
  secondaryAxis: string;
  nominalPivotLengthMm: number;
  toolAxisOffsetMm: number;
  toolDirection: readonly number[];
  massKg: number | string | null;
}

export function headFacts(
  head: HeadConfiguration,
): Array<{ label: string; value: string | null; mono?: boolean }> {
  return [
    { label: "Maker and model", value: [head.maker, head.model].filter(Boolean).join(" ") || null },
    { label: "Axes", value: `${head.primaryAxis} primary (rotary) / ${head.secondaryAxis} secondary (tilt)` },
    { label: "Nominal pivot length", value: `${head.nominalPivotLengthMm.toFixed(3)} mm`, mono: true },
    { label: "Tool-axis offset", value: `${head.toolAxisOffsetMm.toFixed(3)} mm`, mono: true },
    { label: "Tool direction at zero", value: `(${head.toolDirection.join(", ")})`, mono: true },
    { label: "Mass", value: head.massKg ? `${head.massKg} kg` : null, mono: true },
  ];
}
