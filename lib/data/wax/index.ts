// The wax room's data layer: every function takes the actor and checks its permission first.
export * from "./materials";
export * from "./recipes";
export * from "./estimates";
export * from "./uses";
export * from "./calibration";
export * from "./purchase";
export * from "./defaults";
export { planChoices, type WaxPlan } from "./plans";
