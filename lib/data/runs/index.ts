import "server-only";

// Production runs' data layer: every function takes the actor and checks its permission first.
export { listRuns, getRun } from "./list";
export { createRun, updateRun, deleteRun } from "./edit";
export { recordProgress, recordReading, recordFinding, listFindings, listFlaggedStamps, measuredRecovery } from "./records";
export { requestStageStamps } from "./stamp-requests";
export { attachFindingPhoto, findingPhoto } from "./finding-photo";
