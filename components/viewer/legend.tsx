/** The 3D view's legend (colour scale of the residuals, line meanings) and its no-WebGL notice. */
import { residualColour } from "@/geometry/head-scene";
import { FITTED, NOMINAL, OTHER, type ViewerFitLabel } from "./palette";

export function NoWebGl() {
  return (
    <div
      role="status"
      className="flex h-full items-center justify-center p-6 text-center text-sm text-graphite-700"
    >
      <p>
        The 3D view needs WebGL, which this browser has turned off or does not offer. The parameters,
        residuals and control values below are complete without it.
      </p>
    </div>
  );
}

export function Legend({
  maxRes,
  shown,
  other,
}: {
  maxRes: number;
  shown?: ViewerFitLabel;
  other: ViewerFitLabel | null;
}) {
  const stops = [0, 0.25, 0.5, 0.75, 1].map((f) => {
    const [r, g, b] = residualColour(f * maxRes, maxRes);
    return `rgb(${Math.round(r * 255)} ${Math.round(g * 255)} ${Math.round(b * 255)}) ${f * 100}%`;
  });
  // On a tablet or phone the legend sits under the picture instead of covering part of it.
  return (
    <div
      className={`m-3 space-y-2 rounded bg-white/95 p-3 text-xs text-graphite-800 shadow-sm lg:absolute lg:bottom-3 lg:right-3 lg:m-0 ${other ? "lg:w-80" : "lg:w-64"}`}
      aria-label="Legend"
    >
      <p className="font-semibold">Measured points: residual |r|</p>
      <div
        className="h-3 rounded"
        style={{ background: `linear-gradient(to right, ${stops.join(", ")})` }}
        aria-hidden="true"
      />
      <div className="num flex justify-between">
        <span>0</span>
        <span>{(maxRes / 2).toFixed(2)}</span>
        <span>{maxRes.toFixed(2)} µm</span>
      </div>
      <ul className="space-y-1 pt-1">
        <li className="flex items-center gap-2">
          <span className="inline-block h-0.5 w-6" style={{ background: NOMINAL }} aria-hidden="true" />{" "}
          Nominal axes and tip path (dashed axes)
        </li>
        <li className="flex items-center gap-2">
          <span className="inline-block h-1 w-6 shrink-0" style={{ background: FITTED }} aria-hidden="true" />
          <span>
            Fitted axes and actual tip path
            {other && shown ? (
              <>
                , {shown.phaseText} <span className="text-graphite-600">({shown.dataset})</span>
              </>
            ) : null}
          </span>
        </li>
        {other ? (
          <li className="flex items-center gap-2" data-testid="legend-other">
            <span
              className="inline-block h-1 w-6 shrink-0"
              style={{
                backgroundImage: `repeating-linear-gradient(to right, ${OTHER} 0 4px, transparent 4px 7px)`,
              }}
              aria-hidden="true"
            />
            <span>
              Dashed: fitted axes and tip path {other.phaseText}{" "}
              <span className="text-graphite-600">({other.dataset})</span>
            </span>
          </li>
        ) : null}
      </ul>
    </div>
  );
}
