CREATE TYPE "public"."plan_arrangement" AS ENUM('straight', 'half-drop', 'brick', 'mirror', 'turnover', 'half-drop-mirror', 'diagonal', 'rotation');--> statement-breakpoint
CREATE TYPE "public"."plan_event_kind" AS ENUM('created', 'edited', 'renamed', 'recomputed', 'duplicated');--> statement-breakpoint
CREATE TYPE "public"."new_stamp_request_state" AS ENUM('open', 'declined', 'made');--> statement-breakpoint
CREATE TYPE "public"."stamp_request_state" AS ENUM('open', 'accepted', 'checked_out', 'declined');--> statement-breakpoint
CREATE TABLE "plan_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"plan_id" uuid NOT NULL,
	"kind" "plan_event_kind" NOT NULL,
	"actor_id" uuid,
	"actor_name" text NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"version" integer NOT NULL,
	"details" jsonb
);
--> statement-breakpoint
CREATE TABLE "plan_stamps" (
	"plan_id" uuid NOT NULL,
	"stamp_id" uuid NOT NULL,
	"role" text NOT NULL,
	CONSTRAINT "plan_stamps_plan_id_role_pk" PRIMARY KEY("plan_id","role")
);
--> statement-breakpoint
CREATE TABLE "plans" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"notes" text,
	"motif_id" uuid,
	"stamp_id" uuid,
	"layout" jsonb NOT NULL,
	"borders" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"arrangement" "plan_arrangement" NOT NULL,
	"cloth_width_mm" double precision NOT NULL,
	"sides" smallint DEFAULT 1 NOT NULL,
	"summary" jsonb NOT NULL,
	"impressions_per_metre" double precision NOT NULL,
	"waxed_area_per_metre_m2" double precision NOT NULL,
	"stamp_geometry" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"geometry_fingerprint" text NOT NULL,
	"computed_at" timestamp with time zone DEFAULT now() NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" uuid,
	"created_by_name" text NOT NULL,
	"updated_by" uuid,
	"updated_by_name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "plans_name_not_blank" CHECK (length(trim("plans"."name")) > 0),
	CONSTRAINT "plans_cloth_width_positive" CHECK ("plans"."cloth_width_mm" > 0),
	CONSTRAINT "plans_sides_range" CHECK ("plans"."sides" IN (1, 2)),
	CONSTRAINT "plans_version_positive" CHECK ("plans"."version" > 0)
);
--> statement-breakpoint
CREATE TABLE "new_stamp_requests" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"width_mm" double precision NOT NULL,
	"height_mm" double precision NOT NULL,
	"plan_id" uuid,
	"note" text,
	"state" "new_stamp_request_state" DEFAULT 'open' NOT NULL,
	"requested_by" uuid,
	"requester_name" text NOT NULL,
	"answered_by" uuid,
	"answered_by_name" text,
	"answered_at" timestamp with time zone,
	"decline_reason" text,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "new_stamp_requests_size_positive" CHECK ("new_stamp_requests"."width_mm" > 0 AND "new_stamp_requests"."height_mm" > 0),
	CONSTRAINT "new_stamp_requests_declined_reason" CHECK ("new_stamp_requests"."state" <> 'declined' OR "new_stamp_requests"."decline_reason" IS NOT NULL)
);
--> statement-breakpoint
CREATE TABLE "stamp_request_items" (
	"request_id" uuid NOT NULL,
	"stamp_id" uuid NOT NULL,
	"checkout_id" uuid,
	CONSTRAINT "stamp_request_items_request_id_stamp_id_pk" PRIMARY KEY("request_id","stamp_id")
);
--> statement-breakpoint
CREATE TABLE "stamp_requests" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"plan_id" uuid,
	"requested_by" uuid,
	"requester_name" text NOT NULL,
	"requester_email" text,
	"for_whom" text NOT NULL,
	"workstation" text NOT NULL,
	"from_on" date NOT NULL,
	"until_on" date NOT NULL,
	"note" text,
	"state" "stamp_request_state" DEFAULT 'open' NOT NULL,
	"answered_by" uuid,
	"answered_by_name" text,
	"answered_at" timestamp with time zone,
	"decline_reason" text,
	"checkout_problem" text,
	"checked_out_at" timestamp with time zone,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "stamp_requests_dates" CHECK ("stamp_requests"."until_on" >= "stamp_requests"."from_on"),
	CONSTRAINT "stamp_requests_declined_reason" CHECK ("stamp_requests"."state" <> 'declined' OR "stamp_requests"."decline_reason" IS NOT NULL)
);
--> statement-breakpoint
ALTER TABLE "plan_events" ADD CONSTRAINT "plan_events_plan_id_plans_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."plans"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plan_events" ADD CONSTRAINT "plan_events_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plan_stamps" ADD CONSTRAINT "plan_stamps_plan_id_plans_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."plans"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plan_stamps" ADD CONSTRAINT "plan_stamps_stamp_id_stamps_id_fk" FOREIGN KEY ("stamp_id") REFERENCES "public"."stamps"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plans" ADD CONSTRAINT "plans_stamp_id_stamps_id_fk" FOREIGN KEY ("stamp_id") REFERENCES "public"."stamps"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plans" ADD CONSTRAINT "plans_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plans" ADD CONSTRAINT "plans_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "new_stamp_requests" ADD CONSTRAINT "new_stamp_requests_plan_id_plans_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."plans"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "new_stamp_requests" ADD CONSTRAINT "new_stamp_requests_requested_by_users_id_fk" FOREIGN KEY ("requested_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "new_stamp_requests" ADD CONSTRAINT "new_stamp_requests_answered_by_users_id_fk" FOREIGN KEY ("answered_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stamp_request_items" ADD CONSTRAINT "stamp_request_items_request_id_stamp_requests_id_fk" FOREIGN KEY ("request_id") REFERENCES "public"."stamp_requests"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stamp_request_items" ADD CONSTRAINT "stamp_request_items_stamp_id_stamps_id_fk" FOREIGN KEY ("stamp_id") REFERENCES "public"."stamps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stamp_request_items" ADD CONSTRAINT "stamp_request_items_checkout_id_checkouts_id_fk" FOREIGN KEY ("checkout_id") REFERENCES "public"."checkouts"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stamp_requests" ADD CONSTRAINT "stamp_requests_plan_id_plans_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."plans"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stamp_requests" ADD CONSTRAINT "stamp_requests_requested_by_users_id_fk" FOREIGN KEY ("requested_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stamp_requests" ADD CONSTRAINT "stamp_requests_answered_by_users_id_fk" FOREIGN KEY ("answered_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "plan_events_plan_at_idx" ON "plan_events" USING btree ("plan_id","at");--> statement-breakpoint
CREATE INDEX "plan_stamps_stamp_idx" ON "plan_stamps" USING btree ("stamp_id");--> statement-breakpoint
CREATE INDEX "plans_updated_idx" ON "plans" USING btree ("updated_at");--> statement-breakpoint
CREATE INDEX "plans_stamp_idx" ON "plans" USING btree ("stamp_id");--> statement-breakpoint
CREATE INDEX "plans_arrangement_idx" ON "plans" USING btree ("arrangement");--> statement-breakpoint
CREATE INDEX "plans_motif_idx" ON "plans" USING btree ("motif_id");--> statement-breakpoint
CREATE INDEX "new_stamp_requests_state_idx" ON "new_stamp_requests" USING btree ("state","created_at");--> statement-breakpoint
CREATE INDEX "stamp_request_items_stamp_idx" ON "stamp_request_items" USING btree ("stamp_id");--> statement-breakpoint
CREATE INDEX "stamp_requests_state_idx" ON "stamp_requests" USING btree ("state","from_on");--> statement-breakpoint
CREATE INDEX "stamp_requests_plan_idx" ON "stamp_requests" USING btree ("plan_id");