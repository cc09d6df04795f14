/** The fit's residual per pose as the online report draws it: bars against the 3 s line. */
import { drawing, palette } from "@/lib/domain/theme";
import { YGrid } from "@/components/charts/axis";
import { RESIDUALS_BOX, residualsLayout } from "@/lib/report/residuals-layout";
import type { ReportData } from "@/lib/report/types";

export function Residuals({ r }: { r: NonNullable<NonNullable<ReportData["charts"]>["residuals"]> }) {
  const c = residualsLayout(r, RESIDUALS_BOX.page);
  return (
    <div>
      <svg
        viewBox={`0 0 ${c.width} ${c.height}`}
        className="h-auto w-full"
        role="img"
        aria-label={`Largest residual component per pose, ${r.totalPoses} poses; ${c.over} beyond 3 s = ${c.limit.toFixed(2)} µm`}
      >
        <YGrid ticks={c.ticks} y={c.y} left={c.left} right={c.right} />
        {c.bars.map((b, i) => (
          <rect
            key={i}
            x={b.x}
            y={b.y}
            width={b.width}
            height={b.height}
            fill={b.over ? palette.fail[700] : palette.nominal[500]}
          />
        ))}
        <line {...c.limitLine} stroke={drawing.accentLine} strokeWidth={1.5} strokeDasharray="6 4" />
        <text x={c.right} y={c.limitY - 4} textAnchor="end" fontSize="11" fill={drawing.accentText}>
          3 s = {c.limit.toFixed(2)} µm
        </text>
      </svg>
      <p className="text-xs text-graphite-600">{c.caption}</p>
    </div>
  );
}
