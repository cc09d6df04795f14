/** The named fields of a result, in the order named: the CLI's JSON and the stored summaries. */
export function pickFields<T extends object, K extends keyof T>(result: T, keys: readonly K[]): Pick<T, K> {
  return Object.fromEntries(keys.map((k) => [k, result[k]])) as Pick<T, K>;
}
