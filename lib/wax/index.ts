/**
 * The wax estimator, pure: materials, recipes (density, melting range, temperature rules), estimates per run,
 * transport; imports only zod and lib/units. Every input has its zod schema here (messages are catalogue keys),
 * and refusals are WaxInputError (field, code = catalogue key, params).
 */
export * from "./errors";
export * from "./limits";
export * from "./materials";
export * from "./mix";
export * from "./temperature";
export * from "./recipe";
export * from "./estimate";
export * from "./run";
