CREATE TYPE "public"."damage_kind" AS ENUM('bent_strip', 'cracked_solder', 'loose_handle', 'worn_face', 'other');--> statement-breakpoint
CREATE TYPE "public"."stamp_condition" AS ENUM('sound', 'worn', 'needs_repair', 'in_repair', 'retired');--> statement-breakpoint
CREATE TYPE "public"."stamp_event_kind" AS ENUM('created', 'edited', 'moved', 'checked_out', 'returned', 'condition_changed', 'damage_reported', 'repaired', 'twin_linked', 'seen_in_stock_take', 'scanned');--> statement-breakpoint
CREATE TYPE "public"."stamp_face" AS ENUM('single', 'pair');--> statement-breakpoint
CREATE TYPE "public"."stock_take_status" AS ENUM('open', 'closed');--> statement-breakpoint
CREATE TABLE "checkouts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"stamp_id" uuid NOT NULL,
	"borrower_id" uuid,
	"borrower_name" text NOT NULL,
	"borrower_email" text,
	"workstation" text NOT NULL,
	"out_at" timestamp with time zone DEFAULT now() NOT NULL,
	"due_on" date NOT NULL,
	"returned_at" timestamp with time zone,
	"checked_out_by" uuid,
	"returned_by" uuid,
	"note" text,
	"last_reminded_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "damage_reports" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"stamp_id" uuid NOT NULL,
	"kind" "damage_kind" NOT NULL,
	"note" text,
	"reported_by" uuid,
	"reported_at" timestamp with time zone DEFAULT now() NOT NULL,
	"resolved_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "locations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"site" text NOT NULL,
	"code" text NOT NULL,
	"description" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "stamp_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"stamp_id" uuid NOT NULL,
	"kind" "stamp_event_kind" NOT NULL,
	"actor_id" uuid,
	"actor_name" text NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"from_value" text,
	"to_value" text,
	"note" text,
	"details" jsonb
);
--> statement-breakpoint
CREATE TABLE "stamps" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"code" text NOT NULL,
	"name" text NOT NULL,
	"motif_id" uuid,
	"width_mm" double precision NOT NULL,
	"height_mm" double precision NOT NULL,
	"strip_depth_mm" double precision,
	"weight_g" double precision,
	"face" "stamp_face" DEFAULT 'single' NOT NULL,
	"twin_id" uuid,
	"mirrored" boolean DEFAULT false NOT NULL,
	"maker" text,
	"made_on" date,
	"condition" "stamp_condition" DEFAULT 'sound' NOT NULL,
	"location_id" uuid,
	"coverage_ratio" double precision,
	"outline_path" text,
	"impressions_count" integer DEFAULT 0 NOT NULL,
	"notes" text,
	"tags" text[] DEFAULT '{}'::text[] NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "stamps_width_positive" CHECK ("stamps"."width_mm" > 0),
	CONSTRAINT "stamps_height_positive" CHECK ("stamps"."height_mm" > 0),
	CONSTRAINT "stamps_coverage_range" CHECK ("stamps"."coverage_ratio" IS NULL OR ("stamps"."coverage_ratio" >= 0 AND "stamps"."coverage_ratio" <= 1)),
	CONSTRAINT "stamps_impressions_nonnegative" CHECK ("stamps"."impressions_count" >= 0),
	CONSTRAINT "stamps_not_own_twin" CHECK ("stamps"."twin_id" IS NULL OR "stamps"."twin_id" <> "stamps"."id")
);
--> statement-breakpoint
CREATE TABLE "stock_take_sightings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"stock_take_id" uuid NOT NULL,
	"code" text NOT NULL,
	"stamp_id" uuid,
	"location_id" uuid,
	"seen_by" uuid,
	"seen_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "stock_takes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"site" text NOT NULL,
	"status" "stock_take_status" DEFAULT 'open' NOT NULL,
	"started_by" uuid,
	"started_at" timestamp with time zone DEFAULT now() NOT NULL,
	"ended_at" timestamp with time zone,
	"expected_count" integer DEFAULT 0 NOT NULL
);
--> statement-breakpoint
ALTER TABLE "checkouts" ADD CONSTRAINT "checkouts_stamp_id_stamps_id_fk" FOREIGN KEY ("stamp_id") REFERENCES "public"."stamps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "checkouts" ADD CONSTRAINT "checkouts_borrower_id_users_id_fk" FOREIGN KEY ("borrower_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "checkouts" ADD CONSTRAINT "checkouts_checked_out_by_users_id_fk" FOREIGN KEY ("checked_out_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "checkouts" ADD CONSTRAINT "checkouts_returned_by_users_id_fk" FOREIGN KEY ("returned_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "damage_reports" ADD CONSTRAINT "damage_reports_stamp_id_stamps_id_fk" FOREIGN KEY ("stamp_id") REFERENCES "public"."stamps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "damage_reports" ADD CONSTRAINT "damage_reports_reported_by_users_id_fk" FOREIGN KEY ("reported_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stamp_events" ADD CONSTRAINT "stamp_events_stamp_id_stamps_id_fk" FOREIGN KEY ("stamp_id") REFERENCES "public"."stamps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stamp_events" ADD CONSTRAINT "stamp_events_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stamps" ADD CONSTRAINT "stamps_twin_id_stamps_id_fk" FOREIGN KEY ("twin_id") REFERENCES "public"."stamps"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stamps" ADD CONSTRAINT "stamps_location_id_locations_id_fk" FOREIGN KEY ("location_id") REFERENCES "public"."locations"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_take_sightings" ADD CONSTRAINT "stock_take_sightings_stock_take_id_stock_takes_id_fk" FOREIGN KEY ("stock_take_id") REFERENCES "public"."stock_takes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_take_sightings" ADD CONSTRAINT "stock_take_sightings_stamp_id_stamps_id_fk" FOREIGN KEY ("stamp_id") REFERENCES "public"."stamps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_take_sightings" ADD CONSTRAINT "stock_take_sightings_location_id_locations_id_fk" FOREIGN KEY ("location_id") REFERENCES "public"."locations"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_take_sightings" ADD CONSTRAINT "stock_take_sightings_seen_by_users_id_fk" FOREIGN KEY ("seen_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_takes" ADD CONSTRAINT "stock_takes_started_by_users_id_fk" FOREIGN KEY ("started_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "checkouts_one_open_per_stamp" ON "checkouts" USING btree ("stamp_id") WHERE "checkouts"."returned_at" IS NULL;--> statement-breakpoint
CREATE INDEX "checkouts_stamp_idx" ON "checkouts" USING btree ("stamp_id");--> statement-breakpoint
CREATE INDEX "checkouts_open_due_idx" ON "checkouts" USING btree ("due_on") WHERE "checkouts"."returned_at" IS NULL;--> statement-breakpoint
CREATE INDEX "damage_reports_stamp_idx" ON "damage_reports" USING btree ("stamp_id");--> statement-breakpoint
CREATE UNIQUE INDEX "locations_site_code_key" ON "locations" USING btree ("site","code");--> statement-breakpoint
CREATE INDEX "locations_code_idx" ON "locations" USING btree ("code");--> statement-breakpoint
CREATE INDEX "stamp_events_stamp_at_idx" ON "stamp_events" USING btree ("stamp_id","at");--> statement-breakpoint
CREATE UNIQUE INDEX "stamps_code_key" ON "stamps" USING btree ("code");--> statement-breakpoint
CREATE INDEX "stamps_location_idx" ON "stamps" USING btree ("location_id");--> statement-breakpoint
CREATE INDEX "stamps_condition_idx" ON "stamps" USING btree ("condition");--> statement-breakpoint
CREATE INDEX "stamps_width_idx" ON "stamps" USING btree ("width_mm");--> statement-breakpoint
CREATE INDEX "stamps_updated_idx" ON "stamps" USING btree ("updated_at");--> statement-breakpoint
CREATE INDEX "stamps_tags_idx" ON "stamps" USING gin ("tags");--> statement-breakpoint
CREATE UNIQUE INDEX "stock_take_sightings_code_key" ON "stock_take_sightings" USING btree ("stock_take_id","code");--> statement-breakpoint
CREATE INDEX "stock_takes_site_idx" ON "stock_takes" USING btree ("site");--> statement-breakpoint
CREATE UNIQUE INDEX "stock_takes_one_open_per_site" ON "stock_takes" USING btree ("site") WHERE "stock_takes"."status" = 'open';