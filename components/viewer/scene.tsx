/**
 * What the 3D view draws inside its canvas: a simplified head from primitives at zero, nominal and
 * fitted axis lines, nominal and actual tool-tip paths, the measured tips as instanced spheres
 * coloured by residual, and optionally the other fit of a pre/post pair. Geometry comes from
 * geometry/head-scene.ts; this file only draws. Z up, lengths in mm.
 */
import { Html, Line, OrbitControls } from "@react-three/drei";
import { useThree } from "@react-three/fiber";
import { useEffect, useLayoutEffect, useMemo, useRef, type RefObject } from "react";
import * as THREE from "three";
import type { OrbitControls as OrbitControlsImpl } from "three-stdlib";
import {
  residualColour,
  type HeadOverlayData,
  type HeadSceneData,
  type SceneLine,
} from "@/geometry/head-scene";
import type { HeadConfig } from "@/geometry";
import { HeadModel } from "./head-model";
import { FITTED, NOMINAL, OTHER } from "./palette";

/** Lights, head, axes, paths, measured points, the other fit when asked, and the orbit controls. */
export function HeadScene({
  scene,
  other,
  config,
  maxRes,
  maxTool,
  controls,
}: {
  scene: HeadSceneData;
  other: HeadOverlayData | null;
  config: HeadConfig;
  maxRes: number;
  maxTool: number;
  controls: RefObject<OrbitControlsImpl | null>;
}) {
  const L = config.pivotLengthMm;
  return (
    <>
      <ambientLight intensity={0.8} />
      <directionalLight position={[400, -300, 800]} intensity={1.6} />
      <directionalLight position={[-500, 400, 200]} intensity={0.5} />
      <HeadModel L={L} />
      <Axes scene={scene} L={L} config={config} />
      <Paths scene={scene} />
      {other ? <OtherFit other={other} L={L} /> : null}
      <MeasuredPoints scene={scene} maxRes={maxRes} radius={Math.max(1, 0.017 * L)} />
      <OrbitControls
        ref={controls}
        makeDefault
        target={[0, 0, -0.05 * (L + maxTool)]}
        enableDamping={false}
      />
    </>
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

/** One rotary axis: the nominal line dashed, the fitted one solid over it, and its name at the fitted end. */
function AxisLines({
  nominal,
  fitted,
  from,
  to,
  L,
  name,
}: {
  nominal: SceneLine;
  fitted: SceneLine;
  from: number;
  to: number;
  L: number;
  name: string;
}) {
  const fittedEnds = lineEnds(fitted, from * L, to * L);
  return (
    <>
      <Line
        points={lineEnds(nominal, from * L, to * L)}
        color={NOMINAL}
        lineWidth={2}
        dashed
        dashSize={0.06 * L}
        gapSize={0.04 * L}
      />
      <Line points={fittedEnds} color={FITTED} lineWidth={3} />
      <Html position={fittedEnds[1]} center zIndexRange={[10, 0]}>
        <span className="whitespace-nowrap rounded bg-white/90 px-1.5 py-0.5 text-xs font-semibold text-graphite-800">
          {name} axis
        </span>
      </Html>
    </>
  );
}

/** The two rotary axes, each drawn from `from`·L to `to`·L along itself (the primary reaches past the head). */
const AXIS_SPANS = [
  { nominal: "nominalPrimary", fitted: "fittedPrimary", from: -0.5, to: 1.55, role: "primary" },
  { nominal: "nominalSecondary", fitted: "fittedSecondary", from: -0.95, to: 0.95, role: "secondary" },
] as const;

function Axes({ scene, L, config }: { scene: HeadSceneData; L: number; config: HeadConfig }) {
  return (
    <group>
      {AXIS_SPANS.map((x) => (
        <AxisLines
          key={x.role}
          nominal={scene.axes[x.nominal]}
          fitted={scene.axes[x.fitted]}
          from={x.from}
          to={x.to}
          L={L}
          name={config[x.role]}
        />
      ))}
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
      {AXIS_SPANS.map((x) => (
        <Line
          key={x.role}
          points={lineEnds(other.axes[x.role], x.from * L, x.to * L)}
          color={OTHER}
          lineWidth={2.5}
          dashed
          dashSize={0.035 * L}
          gapSize={0.025 * L}
        />
      ))}
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
