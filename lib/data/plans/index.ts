// The cloth plans' data layer: one plan and its history (record), the table (list), changes (edit), the stamp
// library as the planner sees it (stamps), and the engine run behind every save (compute).
// The wax room calls getPlan for a plan's summary.
export { getPlan, getPlanPicture, getPlans, planHistory } from "./record";
export { listPlans, planCount } from "./list";
export { createPlan, deletePlan, duplicatePlan, recomputePlan, updatePlan } from "./edit";
export { getPlannerStamp, searchPlanStamps, stampPictures } from "./stamps";
