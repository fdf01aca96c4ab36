/**
 * The wax estimator, pure: materials, recipes (density, melting range, temperature rules), estimates per run,
 * calibration of the application rate from recorded uses, and the purchase list. No storage, screen or
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
export * from "./calibration";
export * from "./purchase";
export * from "./impressions";
