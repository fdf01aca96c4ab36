// The stamp shelf's data layer, one module per concern: the table (list), a record and its history
// (record), changes (edit), the condition path and damage (condition), check-outs (checkouts).
// Locations, stock-takes, the CSV import and export and the shelf's e-mails are imported by their own path.
export { listAllStamps, listStamps, stampCounts, stampFacets, stampFilter } from "./list";
export { getStamp, stampHistory } from "./record";
export { createStamp, deleteStamp, updateStamp } from "./edit";
export { changeCondition, reportDamage } from "./condition";
export { checkOutStamp, listBorrowers, listCheckouts, returnStamp } from "./checkouts";
