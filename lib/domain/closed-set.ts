/**
 * A closed set of values written once, as its labels map: the map's keys, in the order written,
 * are the values (a non-empty tuple that drizzle's `pgEnum` and zod's `z.enum` take as they are),
 * and the map itself is the labels. A comment on one value goes on its entry.
 *
 *   export const { values: PHASES, labels: PHASE_LABELS } = closedSet({ pre: "Before", post: "After" });
 *   export type Phase = (typeof PHASES)[number];
 *
 * Kept free of path aliases and imports: db/schema.ts loads lib/domain under drizzle-kit.
 */
export function closedSet<const K extends string>(
  labels: Record<K, string>,
): { readonly values: readonly [K, ...K[]]; readonly labels: Readonly<Record<K, string>> } {
  const values = Object.keys(labels) as K[];
  if (values.length === 0) throw new Error("A closed set needs at least one value.");
  // JavaScript lists integer-like keys first and in numeric order, not in the order written.
  const numeric = values.find((v) => /^(0|[1-9]\d*)$/.test(v));
  if (numeric !== undefined) {
    throw new Error(`Closed-set value "${numeric}" looks like an array index; its order would not be kept.`);
  }
  return { values: values as [K, ...K[]], labels };
}
