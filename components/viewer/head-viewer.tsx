"use client";

/**
 * The 3D view of a head fit: a simplified head from primitives at zero, nominal (blue-grey) and
 * fitted (amber) axis lines, nominal and actual tool-tip paths over the probed poses, and the
 * measured tips as instanced spheres coloured by residual. Every error is drawn × k (slider, log
 * scale ×1 … ×10 000) and k is always printed on the picture. When the job has a fit of the
 * other phase (before / after adjustment), a checkbox overlays that fit's axes and tip path, dashed
 * in a second colour, at the same k. "Save view for the report" sends the picture (with k and the
 * legend printed into it) to POST /api/analyses/{id}/views. All geometry comes from
 * geometry/head-scene.ts; this file only draws. Z up (ISO 841 machine frame), lengths in mm.
 */
import { drawing, palette } from "@/lib/domain/theme";
import { Html, Line, OrbitControls } from "@react-three/drei";
import { Canvas, useThree } from "@react-three/fiber";
import { useRouter } from "next/navigation";
import { useEffect, useLayoutEffect, useMemo, useRef, useState, useSyncExternalStore } from "react";
import * as THREE from "three";
import type { OrbitControls as OrbitControlsImpl } from "three-stdlib";
import {
  headOverlayScene,
  headScene,
  residualColour,
  tipChangeUm,
  type HeadOverlayData,
  type HeadSceneData,
  type SceneLine,
} from "@/geometry/head-scene";
import type { HeadConfig, HeadErrors, HeadPose, HeadVec3 } from "@/geometry";
import { factorFromSlider, formatFactor } from "./factor";

const NOMINAL = palette.nominal[500];
const FITTED = palette.accent[500];
/** The other fit of a pre/post pair: a deep teal, dashed, so it differs from nominal by hue and pattern. */
const OTHER = drawing.overlay;
const BACKGROUND = drawing.sceneBackground;

/** One fit as the legend names it: its phase in words and the dataset it was fitted from. */
export interface ViewerFitLabel {
  analysisId: string;
  /** "before adjustment" or "after adjustment". */
  phaseText: string;
  dataset: string;
}

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

export { factorFromSlider, formatFactor };

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
              <ambientLight intensity={0.8} />
              <directionalLight position={[400, -300, 800]} intensity={1.6} />
              <directionalLight position={[-500, 400, 200]} intensity={0.5} />
              <HeadModel L={L} />
              <Axes scene={scene} L={L} config={config} />
              <Paths scene={scene} />
              {drawOther && other ? <OtherFit other={other} L={L} /> : null}
              <MeasuredPoints scene={scene} maxRes={maxRes} radius={Math.max(1, 0.017 * L)} />
              <OrbitControls
                ref={controls}
                makeDefault
                target={[0, 0, -0.05 * (L + maxTool)]}
                enableDamping={false}
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

function NoWebGl() {
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

function Legend({
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

/** A simplified head at zero: collar, body, tilt-axis housing, spindle and tool (translucent, so the axes show). */
function HeadModel({ L }: { L: number }) {
  const body = {
    color: drawing.faint,
    transparent: true,
    opacity: 0.28,
    roughness: 0.7,
    metalness: 0.1,
    depthWrite: false,
  };
  return (
    <group>
      {/* Cylinders are along +Y by default; rotate to Z (primary) or X (tilt axis). */}
      <mesh position={[0, 0, 1.26 * L]} rotation={[Math.PI / 2, 0, 0]}>
        <cylinderGeometry args={[0.6 * L, 0.6 * L, 0.12 * L, 48]} />
        <meshStandardMaterial {...body} color={drawing.zeroLine} opacity={0.35} />
      </mesh>
      <mesh position={[0, 0, 0.78 * L]} rotation={[Math.PI / 2, 0, 0]}>
        <cylinderGeometry args={[0.42 * L, 0.46 * L, 0.84 * L, 48]} />
        <meshStandardMaterial {...body} />
      </mesh>
      <mesh rotation={[0, 0, Math.PI / 2]}>
        <cylinderGeometry args={[0.3 * L, 0.3 * L, 0.84 * L, 40]} />
        <meshStandardMaterial {...body} />
      </mesh>
      <mesh position={[0, 0, -0.36 * L]} rotation={[Math.PI / 2, 0, 0]}>
        <cylinderGeometry args={[0.16 * L, 0.19 * L, 0.72 * L, 32]} />
        <meshStandardMaterial {...body} opacity={0.4} />
      </mesh>
      <mesh position={[0, 0, -0.86 * L]} rotation={[Math.PI / 2, 0, 0]}>
        <cylinderGeometry args={[0.045 * L, 0.045 * L, 0.28 * L, 20]} />
        <meshStandardMaterial color={drawing.axisText} roughness={0.4} metalness={0.5} />
      </mesh>
      <mesh position={[0, 0, -L]}>
        <sphereGeometry args={[0.035 * L, 20, 14]} />
        <meshStandardMaterial color={drawing.labelText} />
      </mesh>
    </group>
  );
}

function lineEnds(l: SceneLine, from: number, to: number): [number, number, number][] {
  const p = l.pointMm;
  const d = l.direction;
  return [
    [p[0] + from * d[0], p[1] + from * d[1], p[2] + from * d[2]],
    [p[0] + to * d[0], p[1] + to * d[1], p[2] + to * d[2]],
  ];
}

function Axes({ scene, L, config }: { scene: HeadSceneData; L: number; config: HeadConfig }) {
  const a = scene.axes;
  const pEnd = lineEnds(a.fittedPrimary, -0.5 * L, 1.55 * L)[1]!;
  const sEnd = lineEnds(a.fittedSecondary, -0.95 * L, 0.95 * L)[1]!;
  return (
    <group>
      <Line
        points={lineEnds(a.nominalPrimary, -0.5 * L, 1.55 * L)}
        color={NOMINAL}
        lineWidth={2}
        dashed
        dashSize={0.06 * L}
        gapSize={0.04 * L}
      />
      <Line points={lineEnds(a.fittedPrimary, -0.5 * L, 1.55 * L)} color={FITTED} lineWidth={3} />
      <Line
        points={lineEnds(a.nominalSecondary, -0.95 * L, 0.95 * L)}
        color={NOMINAL}
        lineWidth={2}
        dashed
        dashSize={0.06 * L}
        gapSize={0.04 * L}
      />
      <Line points={lineEnds(a.fittedSecondary, -0.95 * L, 0.95 * L)} color={FITTED} lineWidth={3} />
      <Html position={pEnd} center zIndexRange={[10, 0]}>
        <span className="whitespace-nowrap rounded bg-white/90 px-1.5 py-0.5 text-xs font-semibold text-graphite-800">
          {config.primary} axis
        </span>
      </Html>
      <Html position={sEnd} center zIndexRange={[10, 0]}>
        <span className="whitespace-nowrap rounded bg-white/90 px-1.5 py-0.5 text-xs font-semibold text-graphite-800">
          {config.secondary} axis
        </span>
      </Html>
    </group>
  );
}

function Segments({
  positions,
  color,
  opacity,
}: {
  positions: Float32Array;
  color: string;
  opacity: number;
}) {
  const geometry = useMemo(() => {
    const g = new THREE.BufferGeometry();
    g.setAttribute("position", new THREE.BufferAttribute(positions, 3));
    return g;
  }, [positions]);
  useEffect(() => () => geometry.dispose(), [geometry]);
  return (
    <lineSegments geometry={geometry}>
      <lineBasicMaterial color={color} transparent opacity={opacity} />
    </lineSegments>
  );
}

function Paths({ scene }: { scene: HeadSceneData }) {
  return (
    <group>
      <Segments positions={scene.nominalPathMm} color={NOMINAL} opacity={0.7} />
      <Segments positions={scene.actualPathMm} color={FITTED} opacity={0.95} />
    </group>
  );
}

/** One instanced mesh for every measured tip (smooth at 10 000 points), coloured by |residual|. */
function MeasuredPoints({ scene, maxRes, radius }: { scene: HeadSceneData; maxRes: number; radius: number }) {
  const ref = useRef<THREE.InstancedMesh>(null);
  const n = scene.residualUm.length;
  const invalidate = useThree((s) => s.invalidate);
  useLayoutEffect(() => {
    const mesh = ref.current;
    if (!mesh) return;
    const m = new THREE.Matrix4();
    const c = new THREE.Color();
    for (let i = 0; i < n; i++) {
      m.makeTranslation(
        scene.measuredTipsMm[3 * i]!,
        scene.measuredTipsMm[3 * i + 1]!,
        scene.measuredTipsMm[3 * i + 2]!,
      );
      mesh.setMatrixAt(i, m);
      const [r, g, b] = residualColour(scene.residualUm[i]!, maxRes);
      mesh.setColorAt(i, c.setRGB(r, g, b, THREE.SRGBColorSpace));
    }
    mesh.instanceMatrix.needsUpdate = true;
    if (mesh.instanceColor) mesh.instanceColor.needsUpdate = true;
    mesh.computeBoundingSphere();
    invalidate();
  }, [scene, maxRes, n, invalidate]);
  return (
    <instancedMesh key={n} ref={ref} args={[undefined, undefined, n]}>
      <sphereGeometry args={[radius, 10, 8]} />
      <meshStandardMaterial roughness={0.6} />
    </instancedMesh>
  );
}

/** The other fit of the pre/post pair: dashed axis lines and tip path in the second colour. */
function OtherFit({ other, L }: { other: HeadOverlayData; L: number }) {
  const path = useMemo(() => {
    const out: [number, number, number][] = [];
    const a = other.actualPathMm;
    for (let i = 0; i + 2 < a.length; i += 3) out.push([a[i]!, a[i + 1]!, a[i + 2]!]);
    return out;
  }, [other.actualPathMm]);
  return (
    <group>
      <Line
        points={lineEnds(other.axes.primary, -0.5 * L, 1.55 * L)}
        color={OTHER}
        lineWidth={2.5}
        dashed
        dashSize={0.035 * L}
        gapSize={0.025 * L}
      />
      <Line
        points={lineEnds(other.axes.secondary, -0.95 * L, 0.95 * L)}
        color={OTHER}
        lineWidth={2.5}
        dashed
        dashSize={0.035 * L}
        gapSize={0.025 * L}
      />
      {path.length >= 2 ? (
        <Line
          points={path}
          segments
          color={OTHER}
          lineWidth={1.5}
          dashed
          dashSize={0.02 * L}
          gapSize={0.015 * L}
        />
      ) : null}
    </group>
  );
}

/** Pixels per CSS pixel of a saved picture: twice the screen's at least, so it stays sharp in print (~250 dpi across an A4 page). */
const PRINT_PIXEL_RATIO = 2;

/**
 * The scene drawn once more at PRINT_PIXEL_RATIO into a copy, then the screen's own resolution
 * restored. Fat lines keep their look: their width is set against the CSS size, which does not
 * change.
 */
function renderForPrint(
  gl: THREE.WebGLRenderer,
  scene: THREE.Scene,
  camera: THREE.Camera,
): HTMLCanvasElement {
  const screenRatio = gl.getPixelRatio();
  const out = document.createElement("canvas");
  try {
    gl.setPixelRatio(Math.max(PRINT_PIXEL_RATIO, screenRatio));
    gl.render(scene, camera);
    out.width = gl.domElement.width;
    out.height = gl.domElement.height;
    out.getContext("2d")?.drawImage(gl.domElement, 0, 0);
  } finally {
    gl.setPixelRatio(screenRatio);
    gl.render(scene, camera);
  }
  return out;
}

/**
 * The picture as saved: the canvas, with the factor and the legend's words printed into it so the
 * saved PNG cannot be mistaken for real size, whatever page it ends up on.
 */
async function viewPicture(
  canvas: HTMLCanvasElement,
  k: number,
  shown: ViewerFitLabel,
  other: ViewerFitLabel | null,
): Promise<Blob> {
  const px = Math.max(12, Math.round(canvas.width / 70));
  // Two or three legend lines, 1.4 text heights apart, with a margin below the last.
  const band = Math.round(px * (other ? 5.2 : 3.8));
  const out = document.createElement("canvas");
  out.width = canvas.width;
  out.height = canvas.height + band;
  const g = out.getContext("2d");
  if (!g) throw new Error("This browser cannot make the picture (no 2D canvas).");
  g.fillStyle = BACKGROUND;
  g.fillRect(0, 0, out.width, out.height);
  g.drawImage(canvas, 0, 0);
  g.font = `600 ${px}px sans-serif`;
  const label = `Errors drawn ×${formatFactor(k)}${other ? " for both fits" : ""} — not to scale`;
  const w = g.measureText(label).width;
  g.fillStyle = "rgba(255,255,255,0.92)";
  g.fillRect(px * 0.6, px * 0.6, w + px * 1.2, px * 1.9);
  g.fillStyle = palette.graphite[900];
  g.fillText(label, px * 1.2, px * 1.95);
  g.fillStyle = palette.white;
  g.fillRect(0, canvas.height, out.width, band);
  g.font = `${Math.round(px * 0.85)}px sans-serif`;
  const line = (y: number, colour: string, dashed: boolean, text: string) => {
    g.strokeStyle = colour;
    g.lineWidth = Math.max(2, px / 5);
    g.setLineDash(dashed ? [px * 0.5, px * 0.35] : []);
    g.beginPath();
    g.moveTo(px, y);
    g.lineTo(px * 3, y);
    g.stroke();
    g.fillStyle = palette.graphite[800];
    g.fillText(text, px * 3.6, y + px * 0.3);
  };
  const y0 = canvas.height + px * 1.2;
  line(y0, NOMINAL, true, "Nominal axes and tip path");
  line(
    y0 + px * 1.4,
    FITTED,
    false,
    `Fitted axes and actual tip path, ${shown.phaseText} (${shown.dataset})`,
  );
  if (other)
    line(y0 + px * 2.8, OTHER, true, `Fitted axes and tip path ${other.phaseText} (${other.dataset})`);
  return new Promise((resolve, reject) =>
    out.toBlob((b) => (b ? resolve(b) : reject(new Error("The picture could not be made."))), "image/png"),
  );
}

function SaveView({
  captureRef,
  k,
  shown,
  other,
}: {
  captureRef: React.RefObject<(() => HTMLCanvasElement) | null>;
  k: number;
  shown: ViewerFitLabel;
  other: (ViewerFitLabel & { errors: HeadErrors }) | null;
}) {
  const router = useRouter();
  const [caption, setCaption] = useState("");
  const [state, setState] = useState<{ kind: "idle" | "saving" | "saved" | "error"; message?: string }>({
    kind: "idle",
  });
  async function save() {
    const capture = captureRef.current;
    if (!capture) return;
    setState({ kind: "saving" });
    try {
      const blob = await viewPicture(capture(), k, shown, other);
      const form = new FormData();
      form.set("factor", String(k));
      if (other) form.set("overlayAnalysisId", other.analysisId);
      if (caption.trim()) form.set("caption", caption.trim());
      form.set("file", blob, "view.png");
      const res = await fetch(`/api/analyses/${shown.analysisId}/views`, { method: "POST", body: form });
      const body = await res.json().catch(() => null);
      if (!res.ok) throw new Error(body?.error?.message ?? `The server answered ${res.status}.`);
      setState({
        kind: "saved",
        message: `Saved at ×${formatFactor(k)}. It is listed under "Saved views" below.`,
      });
      setCaption("");
      router.refresh();
    } catch (e) {
      setState({ kind: "error", message: e instanceof Error ? e.message : "The view could not be saved." });
    }
  }
  return (
    <div className="flex flex-wrap items-end gap-3 border-t border-graphite-100 pt-3">
      <label className="flex min-w-[16rem] flex-1 flex-col gap-1 text-sm font-medium text-graphite-800">
        Caption (optional)
        <input
          type="text"
          value={caption}
          maxLength={200}
          onChange={(e) => setCaption(e.target.value)}
          placeholder="e.g. Tilt axis squareness before and after shimming"
          className="min-h-touch rounded-md border border-graphite-300 px-3 font-normal"
        />
      </label>
      <button
        type="button"
        onClick={save}
        disabled={state.kind === "saving"}
        className="min-h-touch rounded-md bg-accent-600 px-4 text-sm font-semibold text-white hover:bg-accent-700 disabled:opacity-60"
      >
        {state.kind === "saving" ? "Saving…" : "Save view for the report"}
      </button>
      <p
        role="status"
        className={`w-full text-sm ${state.kind === "error" ? "text-fail-700" : "text-graphite-700"}`}
      >
        {state.message ??
          "Saves the picture as shown, with the factor printed on it, for the acceptance report."}
      </p>
    </div>
  );
}
