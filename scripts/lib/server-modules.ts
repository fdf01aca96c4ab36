// Lets a script import the app's server modules (lib/data, lib/mail): they start with
// `import "server-only"`, which throws outside Next's server bundles. Call before importing them.
import { register } from "node:module";

const hook = `export async function resolve(specifier, context, next) {
  if (specifier === "server-only") return { url: "data:text/javascript,export{}", shortCircuit: true };
  return next(specifier, context);
}`;

export function allowServerModules() {
  register(`data:text/javascript,${encodeURIComponent(hook)}`);
}
