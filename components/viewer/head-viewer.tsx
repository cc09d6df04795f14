"use client";

/**
 * The 3D view of a head fit: a simplified head from primitives at zero, nominal (blue-grey) and
 * fitted (amber) axis lines, nominal and actual tool-tip paths over the probed poses, and the
 * measured tips as instanced spheres coloured by residual. Every error is drawn × k (slider, log
 * scale ×1 … ×10 000) and k is always printed on the picture. When the job has a fit of the
 * other phase (before / after adjustment), a checkbox overlays that fit's axes and tip path, dashed
 * in a second colour, at the same k. "Save view for the report" sends the picture (with k and the
 * legend printed into it) to POST /api/analyses/{id}/views. All geometry comes from
 * geometry/head-scene.ts. This file holds the view's state and controls; the drawing is in
 * scene.tsx, the legend in legend.tsx, the saved picture in picture.ts and its form in
 * save-view.tsx. Z up (ISO 841 machine frame), lengths in mm.
 */
import { Canvas } from "@react-three/fiber";
import { useMemo, useRef, useState, useSyncExternalStore } from "react";
import type { OrbitControls as OrbitControlsImpl } from "three-stdlib";
import { headOverlayScene, headScene, tipChangeUm } from "@/geometry/head-scene";
import type { HeadConfig, HeadErrors, HeadPose, HeadVec3 } from "@/geometry";
import { factorFromSlider, formatFactor } from "./factor";
import { Legend, NoWebGl } from "./legend";
import { drawing } from "@/lib/domain/theme";
import { BACKGROUND, type ViewerFitLabel } from "./palette";
import { renderForPrint } from "./picture";
import { SaveView } from "./save-view";
import { HeadScene } from "./scene";

export type { ViewerFitLabel };

export interface HeadViewerProps {
  config: HeadConfig;
  errors: HeadErrors;
  poses: HeadPose[];
  residualsUm: HeadVec3[];
  /** Initial exaggeration factor. */
  initialFactor?: number;
  /** The fit drawn (for the legend and for saving). */
  shown?: ViewerFitLabel;
  /** The fit of the other phase, if the job has one: its errors, drawn over the same poses. */
  overlay?: (ViewerFitLabel & { errors: HeadErrors }) | null;
  /** Whether this user may save the view for the report (application engineers). */
  maySave?: boolean;
}

let webglCached: boolean | undefined;

/** Whether this browser can draw WebGL, probed once per page load (it does not change). */
function webglAvailable(): boolean {
  if (webglCached === undefined) {
    try {
      const c = document.createElement("canvas");
      webglCached = Boolean(c.getContext("webgl2") ?? c.getContext("webgl"));
    } catch {
      webglCached = false;
    }
  }
  return webglCached;
}
const noSubscription = () => () => {};
/** On the server and during hydration it is not known yet (null), so both renders agree. */
const webglUnknown = () => null;

export function HeadViewer({
  config,
  errors,
  poses,
  residualsUm,
  initialFactor = 300,
  shown,
  overlay = null,
  maySave = false,
}: HeadViewerProps) {
  const [slider, setSlider] = useState(Math.log10(initialFactor));
  const [ready, setReady] = useState(false);
  const webgl = useSyncExternalStore<boolean | null>(noSubscription, webglAvailable, webglUnknown);
  const [showOverlay, setShowOverlay] = useState(false);
  const controls = useRef<OrbitControlsImpl | null>(null);
  const captureRef = useRef<(() => HTMLCanvasElement) | null>(null);
  const k = factorFromSlider(slider);
  const scene = useMemo(
    () => headScene(config, errors, poses, k, residualsUm),
    [config, errors, poses, k, residualsUm],
  );
  const overlayErrors = overlay?.errors;
  const other = useMemo(
    () => (overlayErrors ? headOverlayScene(config, overlayErrors, poses, k) : null),
    [config, overlayErrors, poses, k],
  );
  const change = useMemo(
    () => (overlayErrors ? tipChangeUm(config, overlayErrors, errors, poses) : null),
    [config, overlayErrors, errors, poses],
  );
  const drawOther = Boolean(overlay && showOverlay && other);
  const maxRes = useMemo(() => Math.max(1e-9, ...Array.from(scene.residualUm)), [scene.residualUm]);
  const L = config.pivotLengthMm;
  const maxTool = Math.max(0, ...poses.map((p) => p.toolMm ?? 0));

  return (
    <div className="space-y-3">
      <div
        className="relative overflow-hidden rounded-card border border-graphite-200"
        style={{ background: BACKGROUND }}
      >
        <div
          data-testid="head-viewer"
          data-ready={ready ? "true" : "false"}
          data-factor={k}
          className="h-[30rem] w-full"
        >
          {webgl === false ? (
            <NoWebGl />
          ) : webgl ? (
            <Canvas
              gl={{ preserveDrawingBuffer: true, antialias: true }}
              dpr={[1, 2]}
              frameloop="demand"
              camera={{
                position: [2.6 * (L + maxTool), -3.1 * (L + maxTool), 1.3 * (L + maxTool)],
                up: [0, 0, 1],
                fov: 36,
                near: 1,
                far: 20000,
              }}
              onCreated={({ gl, get }) => {
                gl.setClearColor(BACKGROUND);
                captureRef.current = () => {
                  const { scene, camera } = get();
                  return renderForPrint(gl, scene, camera);
                };
                setReady(true);
              }}
              fallback={<NoWebGl />}
            >
              <HeadScene
                scene={scene}
                other={drawOther ? other : null}
                config={config}
                maxRes={maxRes}
                maxTool={maxTool}
                controls={controls}
              />
            </Canvas>
          ) : (
            <p className="p-6 text-sm text-graphite-600">Starting the 3D view…</p>
          )}
        </div>
        {webgl ? (
          <>
            <p
              className="pointer-events-none absolute left-3 top-3 rounded bg-white/90 px-3 py-1.5 text-sm font-semibold text-graphite-900 shadow-sm"
              data-testid="factor-label"
            >
              Errors drawn <span className="num">×{formatFactor(k)}</span>
              {drawOther ? " for both fits" : ""} — not to scale
            </p>
            <Legend maxRes={maxRes} shown={shown} other={drawOther ? overlay : null} />
          </>
        ) : null}
      </div>
      <div className="flex flex-wrap items-center gap-4">
        <label className="flex flex-1 items-center gap-3 text-sm font-medium text-graphite-800">
          <span className="whitespace-nowrap">Exaggeration</span>
          <input
            type="range"
            min={0}
            max={4}
            step={0.05}
            value={slider}
            onChange={(e) => setSlider(Number(e.target.value))}
            aria-label="Exaggeration factor"
            aria-valuetext={`×${formatFactor(k)}`}
            className="h-11 flex-1 accent-accent-500"
          />
          <span className="num w-20 text-right">×{formatFactor(k)}</span>
        </label>
        <button
          type="button"
          onClick={() => controls.current?.reset()}
          className="min-h-touch rounded-md border border-graphite-300 bg-white px-4 text-sm font-semibold hover:bg-graphite-50"
        >
          Reset view
        </button>
      </div>
      {overlay ? (
        <div className="flex flex-wrap items-center gap-x-4 gap-y-1 rounded-md border border-graphite-200 bg-graphite-50 px-3 py-2">
          <label className="flex min-h-touch cursor-pointer items-center gap-3 text-sm font-medium text-graphite-800">
            <input
              type="checkbox"
              checked={showOverlay}
              onChange={(e) => setShowOverlay(e.target.checked)}
              className="h-5 w-5"
              style={{ accentColor: drawing.overlay }}
            />
            Also draw the fit {overlay.phaseText}{" "}
            <span className="font-normal text-graphite-600">({overlay.dataset})</span>
          </label>
          {change ? (
            <p className="text-xs text-graphite-600" data-testid="tip-change">
              Between the two fits the modelled tip moves by up to{" "}
              <span className="num">{change.maxUm.toFixed(1)} µm</span> (RMS{" "}
              <span className="num">{change.rmsUm.toFixed(1)} µm</span>) over these poses, real size.
            </p>
          ) : null}
        </div>
      ) : null}
      {maySave && shown && webgl ? (
        <SaveView captureRef={captureRef} k={k} shown={shown} other={drawOther ? overlay : null} />
      ) : null}
      <p className="text-xs text-graphite-600">
        Drag to turn, scroll or pinch to zoom, right-drag to move. Z is up; the head is drawn at zero on both
        axes.
      </p>
    </div>
  );
}
