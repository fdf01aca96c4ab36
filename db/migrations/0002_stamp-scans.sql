CREATE TYPE "public"."dpi_source" AS ENUM('file', 'keeper');--> statement-breakpoint
CREATE TYPE "public"."scan_kind" AS ENUM('face', 'print');--> statement-breakpoint
CREATE TYPE "public"."wax_polarity" AS ENUM('darkIsWax', 'lightIsWax');--> statement-breakpoint
CREATE TABLE "stamp_scans" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"stamp_id" uuid NOT NULL,
	"kind" "scan_kind" NOT NULL,
	"file_name" text NOT NULL,
	"content_type" text NOT NULL,
	"object_key" text NOT NULL,
	"thumb_key" text NOT NULL,
	"large_key" text NOT NULL,
	"raster_key" text NOT NULL,
	"width_px" integer NOT NULL,
	"height_px" integer NOT NULL,
	"dpi" double precision,
	"dpi_source" "dpi_source",
	"size_bytes" integer NOT NULL,
	"sha256" text NOT NULL,
	"polarity" "wax_polarity" NOT NULL,
	"threshold" integer NOT NULL,
	"otsu_threshold" integer NOT NULL,
	"coverage_ratio" double precision NOT NULL,
	"phash" text NOT NULL,
	"phash_mirrored" text NOT NULL,
	"uploaded_by" uuid,
	"uploaded_by_name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "stamp_scans_size_positive" CHECK ("stamp_scans"."width_px" > 0 AND "stamp_scans"."height_px" > 0 AND "stamp_scans"."size_bytes" > 0),
	CONSTRAINT "stamp_scans_dpi_positive" CHECK ("stamp_scans"."dpi" IS NULL OR "stamp_scans"."dpi" > 0),
	CONSTRAINT "stamp_scans_dpi_source" CHECK (("stamp_scans"."dpi" IS NULL) = ("stamp_scans"."dpi_source" IS NULL)),
	CONSTRAINT "stamp_scans_threshold_range" CHECK ("stamp_scans"."threshold" BETWEEN 0 AND 255 AND "stamp_scans"."otsu_threshold" BETWEEN 0 AND 255),
	CONSTRAINT "stamp_scans_coverage_range" CHECK ("stamp_scans"."coverage_ratio" >= 0 AND "stamp_scans"."coverage_ratio" <= 1),
	CONSTRAINT "stamp_scans_phash_hex" CHECK ("stamp_scans"."phash" ~ '^[0-9a-f]{16}$' AND "stamp_scans"."phash_mirrored" ~ '^[0-9a-f]{16}$')
);
--> statement-breakpoint
ALTER TABLE "stamp_scans" ADD CONSTRAINT "stamp_scans_stamp_id_stamps_id_fk" FOREIGN KEY ("stamp_id") REFERENCES "public"."stamps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stamp_scans" ADD CONSTRAINT "stamp_scans_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "stamp_scans_stamp_sha256_key" ON "stamp_scans" USING btree ("stamp_id","sha256");--> statement-breakpoint
CREATE INDEX "stamp_scans_stamp_idx" ON "stamp_scans" USING btree ("stamp_id","created_at");