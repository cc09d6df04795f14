// fast-check arbitraries that the geometry property tests share.
import fc from "fast-check";

/** Three finite numbers (no NaN, no infinity), each in [min, max]: a point or an offset in space. */
export function vec3(min: number, max: number): fc.Arbitrary<[number, number, number]> {
  const one = fc.double({ min, max, noNaN: true });
  return fc.tuple(one, one, one);
}
