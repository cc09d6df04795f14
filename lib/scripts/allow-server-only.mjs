// For command-line scripts (migrate, seed, audit checks): the "server-only" guard only resolves
// inside the React server build, so scripts map it to an empty module. The app keeps the guard.
import { register } from "node:module";

const hooks = `export async function resolve(specifier, context, next) {
  if (specifier === "server-only") return { url: "data:text/javascript,export{}", shortCircuit: true };
  return next(specifier, context);
}`;
register(`data:text/javascript,${encodeURIComponent(hooks)}`);
