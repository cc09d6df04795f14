import { drawing, palette } from "@/lib/domain/theme";
import { YGrid } from "@/components/charts/axis";
import type { NextVisitPlan } from "@/lib/pose-coverage";
import { PRIMARY_SECTOR_DEG, TILT_REFERENCE_DEG } from "@/lib/pose-coverage";

/**
 * The probed poses against the axes' range: primary angle (full turn) across, tilt angle up,
 * one mark per distinct pose and tool length (shape by tool length, so colour is not the only
 * signal), unprobed 30° sectors of the turn hatched; then the advice for the next visit.
 */
export function PoseCoverage({
  visit,
  poses,
}: {
  visit: NextVisitPlan;
  poses: ReadonlyArray<{ primaryDeg: number; secondaryDeg: number; toolMm?: number | undefined }>;
}) {
  const c = visit.coverage;
  const W = 720;
  const H = 210;
  const m = { l: 46, r: 12, t: 12, b: 34 };
  const tiltLo = Math.min(-TILT_REFERENCE_DEG, c.secondaryMinDeg);
  const tiltHi = Math.max(TILT_REFERENCE_DEG, c.secondaryMaxDeg);
  const x = (p: number) => m.l + (p / 360) * (W - m.l - m.r);
  const y = (s: number) => H - m.b - ((s - tiltLo) / (tiltHi - tiltLo)) * (H - m.t - m.b);
  const seen = new Set<string>();
  const marks = poses.filter((p) => {
    const k = `${((p.primaryDeg % 360) + 360) % 360}|${p.secondaryDeg}|${p.toolMm ?? 0}`;
    if (seen.has(k)) return false;
    seen.add(k);
    return true;
  });
  const toolIndex = (t: number) => Math.max(0, c.toolLengthsMm.indexOf(Math.round(t * 1000) / 1000));
  const SHAPES = ["circle", "square", "triangle", "diamond"] as const;
  const COLOURS = [palette.nominal[500], drawing.accentLine, palette.graphite[900], palette.pass[700]];
  const primaryTicks = [0, 60, 120, 180, 240, 300, 360];
  const tiltTicks = [tiltLo, tiltLo / 2, 0, tiltHi / 2, tiltHi].map((v) => Math.round(v));
  const missing = c.primarySectors.filter((s) => !s).length;
  return (
    <div className="space-y-4">
      <figure>
        <svg
          viewBox={`0 0 ${W} ${H}`}
          className="h-auto w-full max-w-4xl"
          role="img"
          aria-label={`${c.poses} probed poses: primary at ${c.primaryAnglesDeg.length} angles, ${c.primarySectors.length - missing} of ${c.primarySectors.length} sectors of the turn; tilt from ${c.secondaryMinDeg}° to ${c.secondaryMaxDeg}°; ${c.toolLengthsMm.length} tool length(s)`}
        >
          <defs>
            <pattern
              id="unprobed"
              width="6"
              height="6"
              patternUnits="userSpaceOnUse"
              patternTransform="rotate(45)"
            >
              <line x1="0" y1="0" x2="0" y2="6" stroke={palette.graphite[200]} strokeWidth="2" />
            </pattern>
          </defs>
          {c.primarySectors.map((hit, k) =>
            hit ? null : (
              <rect
                key={k}
                x={x(k * PRIMARY_SECTOR_DEG)}
                y={m.t}
                width={x((k + 1) * PRIMARY_SECTOR_DEG) - x(k * PRIMARY_SECTOR_DEG)}
                height={H - m.t - m.b}
                fill="url(#unprobed)"
              />
            ),
          )}
          <rect
            x={m.l}
            y={y(c.secondaryMaxDeg)}
            width={W - m.l - m.r}
            height={Math.max(1, y(c.secondaryMinDeg) - y(c.secondaryMaxDeg))}
            fill={drawing.limitBand}
            opacity={0.6}
          />
          <YGrid ticks={tiltTicks} y={y} left={m.l} right={W - m.r} label={(t) => `${t}°`} />
          {primaryTicks.map((p) => (
            <g key={`p${p}`}>
              <line x1={x(p)} x2={x(p)} y1={m.t} y2={H - m.b} stroke={drawing.grid} />
              <text x={x(p)} y={H - m.b + 14} textAnchor="middle" fontSize="11" fill={drawing.axisText}>
                {p}°
              </text>
            </g>
          ))}
          <text x={(m.l + W - m.r) / 2} y={H - 4} textAnchor="middle" fontSize="11" fill={drawing.axisText}>
            primary axis angle (full turn)
          </text>
          <text
            x={12}
            y={(m.t + H - m.b) / 2}
            fontSize="11"
            fill={drawing.axisText}
            textAnchor="middle"
            transform={`rotate(-90 12 ${(m.t + H - m.b) / 2})`}
          >
            tilt angle
          </text>
          {marks.map((p, i) => {
            const k = toolIndex(p.toolMm ?? 0) % SHAPES.length;
            // Tool lengths side by side at the same angles, so one does not hide the other.
            const cx =
              x(((p.primaryDeg % 360) + 360) % 360) +
              (toolIndex(p.toolMm ?? 0) - (c.toolLengthsMm.length - 1) / 2) * 7;
            const cy = y(p.secondaryDeg);
            const fill = COLOURS[k];
            switch (SHAPES[k]) {
              case "square":
                return <rect key={i} x={cx - 3.5} y={cy - 3.5} width={7} height={7} fill={fill} />;
              case "triangle":
                return (
                  <path
                    key={i}
                    d={`M${cx} ${cy - 4.5}L${cx + 4.2} ${cy + 3}L${cx - 4.2} ${cy + 3}Z`}
                    fill={fill}
                  />
                );
              case "diamond":
                return (
                  <path
                    key={i}
                    d={`M${cx} ${cy - 4.5}L${cx + 4.5} ${cy}L${cx} ${cy + 4.5}L${cx - 4.5} ${cy}Z`}
                    fill={fill}
                  />
                );
              default:
                return <circle key={i} cx={cx} cy={cy} r={3.6} fill={fill} />;
            }
          })}
        </svg>
        <figcaption className="mt-1 flex flex-wrap gap-x-4 gap-y-1 text-xs text-graphite-600">
          {c.toolLengthsMm.map((t, k) => (
            <span key={t} className="inline-flex items-center gap-1">
              <svg viewBox="0 0 10 10" className="h-2.5 w-2.5" aria-hidden="true">
                {SHAPES[k % 4] === "circle" ? (
                  <circle cx={5} cy={5} r={4} fill={COLOURS[k % 4]} />
                ) : SHAPES[k % 4] === "square" ? (
                  <rect x={1} y={1} width={8} height={8} fill={COLOURS[k % 4]} />
                ) : (
                  <path d="M5 0.5L9.5 9H0.5Z" fill={COLOURS[k % 4]} />
                )}
              </svg>
              tool {t} mm
            </span>
          ))}
          <span>hatched: {PRIMARY_SECTOR_DEG}° sectors of the turn not probed</span>
          <span>shaded: the tilt span probed; the chart runs to ±{TILT_REFERENCE_DEG}° for reference</span>
        </figcaption>
      </figure>
      <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[auto_1fr]" data-testid="pose-coverage">
        <dt className="text-graphite-600">Primary axis</dt>
        <dd>
          <span className="num">{c.primaryAnglesDeg.length}</span> angles,{" "}
          <span className="num">{c.primarySectors.length - missing}</span> of {c.primarySectors.length}{" "}
          sectors of the turn, largest gap <span className="num">{c.largestPrimaryGapDeg.toFixed(0)}°</span>
        </dd>
        <dt className="text-graphite-600">Tilt axis</dt>
        <dd>
          <span className="num">{c.secondaryAnglesDeg.length}</span> angles from{" "}
          <span className="num">{c.secondaryMinDeg}°</span> to{" "}
          <span className="num">{c.secondaryMaxDeg}°</span>
        </dd>
        <dt className="text-graphite-600">Tool lengths</dt>
        <dd className="num">{c.toolLengthsMm.map((t) => `${t} mm`).join(", ")}</dd>
      </dl>
      <div>
        <h3 className="text-sm font-semibold">For the next visit</h3>
        <ul
          className="mt-1 list-disc space-y-1 pl-5 text-sm text-graphite-800"
          aria-label="Advice for the next visit"
        >
          {visit.advice.map((a) => (
            <li key={a}>{a}</li>
          ))}
        </ul>
        {visit.plan ? (
          <p className="mt-2 text-xs text-graphite-600">
            Forecast from these poses (geometry&apos;s pose planner): with 1 µm probing repeatability the
            fitted parameters would have standard uncertainties of{" "}
            {visit.plan.parameters
              .filter((p) => p.u_per_um_noise !== null)
              .map((p) => `${p.iso} ${p.u_per_um_noise!.toFixed(2)}${p.unit === "um" ? " µm" : "″"}`)
              .join(", ")}
            ; scale by the probe&apos;s repeatability in µm, and double for U.
          </p>
        ) : null}
      </div>
    </div>
  );
}
