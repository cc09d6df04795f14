/**
 * A simplified head at zero, drawn from primitives in units of the pivot length L: collar, body,
 * tilt-axis housing, spindle, tool and tool tip. Translucent, so the axes inside show. Z up.
 */
import { drawing } from "@/lib/domain/theme";

type Vec3 = [number, number, number];

/** Cylinders are along +Y by default: ALONG_Z turns one onto the primary axis, ALONG_X onto the tilt axis. */
const ALONG_Z: Vec3 = [Math.PI / 2, 0, 0];
const ALONG_X: Vec3 = [0, 0, Math.PI / 2];

const BODY = {
  color: drawing.faint,
  transparent: true,
  opacity: 0.28,
  roughness: 0.7,
  metalness: 0.1,
  depthWrite: false,
};

/** Each part: where its centre sits (× L), how it is turned, its size (× L) and segments, and its look. */
const PARTS: ReadonlyArray<{
  name: string;
  z: number;
  rotation?: Vec3;
  cylinder?: { top: number; bottom: number; height: number; segments: number };
  sphere?: { radius: number };
  material: Record<string, unknown>;
}> = [
  {
    name: "collar",
    z: 1.26,
    rotation: ALONG_Z,
    cylinder: { top: 0.6, bottom: 0.6, height: 0.12, segments: 48 },
    material: { ...BODY, color: drawing.zeroLine, opacity: 0.35 },
  },
  {
    name: "body",
    z: 0.78,
    rotation: ALONG_Z,
    cylinder: { top: 0.42, bottom: 0.46, height: 0.84, segments: 48 },
    material: BODY,
  },
  {
    name: "tilt-axis housing",
    z: 0,
    rotation: ALONG_X,
    cylinder: { top: 0.3, bottom: 0.3, height: 0.84, segments: 40 },
    material: BODY,
  },
  {
    name: "spindle",
    z: -0.36,
    rotation: ALONG_Z,
    cylinder: { top: 0.16, bottom: 0.19, height: 0.72, segments: 32 },
    material: { ...BODY, opacity: 0.4 },
  },
  {
    name: "tool",
    z: -0.86,
    rotation: ALONG_Z,
    cylinder: { top: 0.045, bottom: 0.045, height: 0.28, segments: 20 },
    material: { color: drawing.axisText, roughness: 0.4, metalness: 0.5 },
  },
  { name: "tool tip", z: -1, sphere: { radius: 0.035 }, material: { color: drawing.labelText } },
];

export function HeadModel({ L }: { L: number }) {
  return (
    <group>
      {PARTS.map((p) => (
        <mesh key={p.name} position={[0, 0, p.z * L]} rotation={p.rotation ?? [0, 0, 0]}>
          {p.cylinder ? (
            <cylinderGeometry
              args={[p.cylinder.top * L, p.cylinder.bottom * L, p.cylinder.height * L, p.cylinder.segments]}
            />
          ) : (
            <sphereGeometry args={[p.sphere!.radius * L, 20, 14]} />
          )}
          <meshStandardMaterial {...p.material} />
        </mesh>
      ))}
    </group>
  );
}
