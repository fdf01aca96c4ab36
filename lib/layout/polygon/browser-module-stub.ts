// Stands in for Node's "module" in browser bundles (next.config.ts aliases it here). The ES build of
// clipper2-wasm names it in a branch that runs in Node only, but bundlers resolve every import they see.
export {};
