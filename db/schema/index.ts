// Every table, enum and row type, one file per area; import from "@/db/schema". drizzle-kit reads this folder.
export * from "./users";
export * from "./stamps";
export * from "./scans";
export * from "./settings";
export * from "./wax";
export * from "./plans";
export * from "./requests";
export * from "./motifs";
export * from "./runs";
