import { sql } from "drizzle-orm";
import { check, customType, doublePrecision, index, integer, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { stamps } from "./stamps";
import { users } from "./users";

// Stamp scans: pictures of a stamp's face and of its wax print, kept in the object store.

const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => "bytea" });

export const scanKindEnum = pgEnum("scan_kind", ["face", "print"]);
export const waxPolarityEnum = pgEnum("wax_polarity", ["darkIsWax", "lightIsWax"]);
export const dpiSourceEnum = pgEnum("dpi_source", ["file", "keeper"]);

/**
 * One stored scan. The bytes live in the object store under random keys (never a name the user typed); this
 * row holds the keys and what was measured. The same file twice for one stamp is refused by a unique index.
 */
export const stampScans = pgTable(
  "stamp_scans",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    stampId: uuid("stamp_id")
      .notNull()
      .references(() => stamps.id, { onDelete: "cascade" }),
    kind: scanKindEnum("kind").notNull(),
    /** The name the file was uploaded with; only for display and download names. */
    fileName: text("file_name").notNull(),
    contentType: text("content_type").notNull(),
    objectKey: text("object_key").notNull(),
    thumbKey: text("thumb_key").notNull(),
    largeKey: text("large_key").notNull(),
    /** Grey PNG of the analysis raster, for re-thresholding without decoding the original again. */
    rasterKey: text("raster_key").notNull(),
    widthPx: integer("width_px").notNull(),
    heightPx: integer("height_px").notNull(),
    dpi: doublePrecision("dpi"),
    dpiSource: dpiSourceEnum("dpi_source"),
    sizeBytes: integer("size_bytes").notNull(),
    sha256: text("sha256").notNull(),
    polarity: waxPolarityEnum("polarity").notNull(),
    threshold: integer("threshold").notNull(),
    otsuThreshold: integer("otsu_threshold").notNull(),
    coverageRatio: doublePrecision("coverage_ratio").notNull(),
    phash: text("phash").notNull(),
    phashMirrored: text("phash_mirrored").notNull(),
    /** The motif's signature for search by picture (lib/scans/similar.ts encodeSignature); null for scans stored before it. */
    signature: bytea("signature"),
    uploadedBy: uuid("uploaded_by").references(() => users.id, { onDelete: "set null" }),
    uploadedByName: text("uploaded_by_name").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("stamp_scans_stamp_sha256_key").on(t.stampId, t.sha256),
    index("stamp_scans_stamp_idx").on(t.stampId, t.createdAt),
    check("stamp_scans_size_positive", sql`${t.widthPx} > 0 AND ${t.heightPx} > 0 AND ${t.sizeBytes} > 0`),
    check("stamp_scans_dpi_positive", sql`${t.dpi} IS NULL OR ${t.dpi} > 0`),
    check("stamp_scans_dpi_source", sql`(${t.dpi} IS NULL) = (${t.dpiSource} IS NULL)`),
    check("stamp_scans_threshold_range", sql`${t.threshold} BETWEEN 0 AND 255 AND ${t.otsuThreshold} BETWEEN 0 AND 255`),
    check("stamp_scans_coverage_range", sql`${t.coverageRatio} >= 0 AND ${t.coverageRatio} <= 1`),
    check("stamp_scans_phash_hex", sql`${t.phash} ~ '^[0-9a-f]{16}$' AND ${t.phashMirrored} ~ '^[0-9a-f]{16}$'`),
  ],
);

export type StampScan = typeof stampScans.$inferSelect;
export type NewStampScan = typeof stampScans.$inferInsert;
export type ScanKind = (typeof scanKindEnum.enumValues)[number];
