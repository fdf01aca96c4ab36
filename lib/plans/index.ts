// The cloth plans' pure rules: library stamps → engine input, what a plan keeps of a layout, run size and
// stamping time, and when a saved summary is stale. No storage, screen or transport.
export { engineStampOf, resolveLayoutRequest, stampCodesOf, type LayoutRequestLike, type LibraryStampGeometry, type StampRef } from "./geometry";
export { planSummary, type PlanSummary } from "./summary";
export { DEFAULT_IMPRESSIONS_PER_HOUR_PER_FACE, PIECES_PER_KODI, runSize, stampingTime, type RunSize, type StampingTime } from "./run";
export { canonicalGeometry, geometryRecord, staleReasons, type StaleChange, type StaleReason, type StampGeometryRecord } from "./stale";
