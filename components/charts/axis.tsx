import { drawing } from "@/lib/domain/theme";

/**
 * The value axis of a web chart: a grid line across the plot at each tick, its value at the left
 * end. `label` writes a tick (default: the number as is); `numeric` sets it in tabular figures.
 */
export function YGrid({
  ticks,
  y,
  left,
  right,
  label = String,
  numeric = false,
}: {
  ticks: readonly number[];
  y: (v: number) => number;
  left: number;
  right: number;
  label?: (t: number) => string;
  numeric?: boolean;
}) {
  return (
    <>
      {ticks.map((t) => (
        <g key={t}>
          <line x1={left} x2={right} y1={y(t)} y2={y(t)} stroke={drawing.grid} />
          <text
            x={left - 6}
            y={y(t) + 4}
            textAnchor="end"
            fontSize="11"
            fill={drawing.axisText}
            className={numeric ? "num" : undefined}
          >
            {label(t)}
          </text>
        </g>
      ))}
    </>
  );
}
