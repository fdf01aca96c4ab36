/**
 * Production runs, pure: the run's input schemas, its default stages from a colourway, the per-stage wax need and
 * stamper hours (reusing the wax estimator and the plans' stamping time), the totals, the recovery measured at
 * boil-offs, the flag rule for stamps and the pot reading cautions. No storage, screen or transport.
 */
export * from "./errors";
export * from "./limits";
export * from "./schema";
export * from "./stages";
export * from "./totals";
export * from "./flags";
export * from "./schedule";
