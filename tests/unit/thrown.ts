// The error a call threw, for unit tests that check what a refusal says.

/** The error of class `type` that `fn` threw; fails the test if it threw nothing or another error. */
export function thrownAs<E extends Error>(type: abstract new (...args: never[]) => E, fn: () => unknown): E {
  try {
    fn();
  } catch (e) {
    if (e instanceof type) return e;
    throw e;
  }
  throw new Error(`expected a ${type.name}, nothing was thrown`);
}
