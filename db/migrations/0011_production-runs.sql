CREATE TYPE "public"."run_dye_method" AS ENUM('bath', 'brush');--> statement-breakpoint
CREATE TYPE "public"."run_event_kind" AS ENUM('created', 'edited', 'state', 'progress', 'reading', 'finding');--> statement-breakpoint
CREATE TYPE "public"."run_finding_kind" AS ENUM('seeped', 'thin', 'cracked', 'pooled', 'smudged');--> statement-breakpoint
CREATE TYPE "public"."run_repair" AS ENUM('none', 'lifted', 'filled');--> statement-breakpoint
CREATE TYPE "public"."run_stage_kind" AS ENUM('wax', 'dye', 'bleach', 'boil_off');--> statement-breakpoint
CREATE TYPE "public"."run_stage_state" AS ENUM('planned', 'underway', 'done');--> statement-breakpoint
CREATE TYPE "public"."run_state" AS ENUM('setup', 'underway', 'complete', 'halted');--> statement-breakpoint
CREATE TYPE "public"."run_wax_method" AS ENUM('stamp', 'screen');--> statement-breakpoint
CREATE TABLE "run_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"run_id" uuid NOT NULL,
	"kind" "run_event_kind" NOT NULL,
	"actor_id" uuid,
	"actor_name" text NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"version" integer NOT NULL,
	"changes" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"details" jsonb
);
--> statement-breakpoint
CREATE TABLE "run_findings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"run_id" uuid NOT NULL,
	"stage_id" uuid,
	"found_on" date NOT NULL,
	"kind" "run_finding_kind" NOT NULL,
	"location" text,
	"count" integer DEFAULT 1 NOT NULL,
	"stamp_id" uuid,
	"stamp_code" text,
	"photo_key" text,
	"repair" "run_repair" DEFAULT 'none' NOT NULL,
	"repair_note" text,
	"recorded_by" uuid,
	"recorded_by_name" text NOT NULL,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "run_findings_count_positive" CHECK ("run_findings"."count" >= 1),
	CONSTRAINT "run_findings_stamp_code" CHECK ("run_findings"."stamp_id" IS NULL OR "run_findings"."stamp_code" IS NOT NULL)
);
--> statement-breakpoint
CREATE TABLE "run_plans" (
	"run_id" uuid NOT NULL,
	"plan_id" uuid NOT NULL,
	"position" integer DEFAULT 0 NOT NULL,
	CONSTRAINT "run_plans_run_id_plan_id_pk" PRIMARY KEY("run_id","plan_id")
);
--> statement-breakpoint
CREATE TABLE "run_progress" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"stage_id" uuid NOT NULL,
	"done_on" date NOT NULL,
	"metres" double precision,
	"pieces" integer,
	"impressions" integer,
	"wax_use_id" uuid,
	"pot_before_g" double precision,
	"pot_after_g" double precision,
	"pot_added_g" double precision,
	"wax_used_g" double precision,
	"recovered_g" double precision,
	"note" text,
	"recorded_by" uuid,
	"recorded_by_name" text NOT NULL,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "run_progress_metres_nonnegative" CHECK ("run_progress"."metres" IS NULL OR "run_progress"."metres" >= 0),
	CONSTRAINT "run_progress_pieces_nonnegative" CHECK ("run_progress"."pieces" IS NULL OR "run_progress"."pieces" >= 0),
	CONSTRAINT "run_progress_impressions_nonnegative" CHECK ("run_progress"."impressions" IS NULL OR "run_progress"."impressions" >= 0),
	CONSTRAINT "run_progress_masses_nonnegative" CHECK (("run_progress"."pot_before_g" IS NULL OR "run_progress"."pot_before_g" >= 0) AND ("run_progress"."pot_after_g" IS NULL OR "run_progress"."pot_after_g" >= 0) AND ("run_progress"."pot_added_g" IS NULL OR "run_progress"."pot_added_g" >= 0) AND ("run_progress"."wax_used_g" IS NULL OR "run_progress"."wax_used_g" >= 0) AND ("run_progress"."recovered_g" IS NULL OR "run_progress"."recovered_g" >= 0))
);
--> statement-breakpoint
CREATE TABLE "run_readings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"stage_id" uuid NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"temp_c" double precision NOT NULL,
	"note" text,
	"recorded_by" uuid,
	"recorded_by_name" text NOT NULL,
	CONSTRAINT "run_readings_temp_range" CHECK ("run_readings"."temp_c" >= -20 AND "run_readings"."temp_c" <= 400)
);
--> statement-breakpoint
CREATE TABLE "run_stage_stamps" (
	"stage_id" uuid NOT NULL,
	"stamp_id" uuid NOT NULL,
	"face" "cloth_face" DEFAULT 'front' NOT NULL,
	CONSTRAINT "run_stage_stamps_stage_id_stamp_id_pk" PRIMARY KEY("stage_id","stamp_id")
);
--> statement-breakpoint
CREATE TABLE "run_stages" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"run_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"kind" "run_stage_kind" NOT NULL,
	"state" "run_stage_state" DEFAULT 'planned' NOT NULL,
	"colour_position" integer,
	"colour_name" text,
	"swatch" text,
	"planned_start_on" date,
	"planned_end_on" date,
	"wax_method" "run_wax_method",
	"plan_id" uuid,
	"recipe_id" uuid,
	"faces" "cloth_face",
	"passes" integer DEFAULT 1 NOT NULL,
	"dye_method" "run_dye_method",
	"notes" text,
	"estimate" jsonb,
	"kg_estimated" double precision DEFAULT 0 NOT NULL,
	"impressions_estimated" integer DEFAULT 0 NOT NULL,
	"hours_estimated" double precision DEFAULT 0 NOT NULL,
	CONSTRAINT "run_stages_position_nonnegative" CHECK ("run_stages"."position" >= 0),
	CONSTRAINT "run_stages_dates_order" CHECK ("run_stages"."planned_start_on" IS NULL OR "run_stages"."planned_end_on" IS NULL OR "run_stages"."planned_start_on" <= "run_stages"."planned_end_on"),
	CONSTRAINT "run_stages_wax_has_method" CHECK (("run_stages"."kind" = 'wax') = ("run_stages"."wax_method" IS NOT NULL)),
	CONSTRAINT "run_stages_only_wax_names_wax" CHECK ("run_stages"."kind" = 'wax' OR ("run_stages"."plan_id" IS NULL AND "run_stages"."recipe_id" IS NULL AND "run_stages"."faces" IS NULL)),
	CONSTRAINT "run_stages_dye_method" CHECK ("run_stages"."dye_method" IS NULL OR "run_stages"."kind" = 'dye'),
	CONSTRAINT "run_stages_swatch_hex" CHECK ("run_stages"."swatch" IS NULL OR "run_stages"."swatch" ~ '^#[0-9a-f]{6}$'),
	CONSTRAINT "run_stages_passes_positive" CHECK ("run_stages"."passes" >= 1),
	CONSTRAINT "run_stages_estimates_nonnegative" CHECK ("run_stages"."kg_estimated" >= 0 AND "run_stages"."impressions_estimated" >= 0 AND "run_stages"."hours_estimated" >= 0)
);
--> statement-breakpoint
CREATE TABLE "runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"motif_id" uuid NOT NULL,
	"colourway_id" uuid NOT NULL,
	"cloth" text NOT NULL,
	"metres" double precision,
	"pieces" integer,
	"piece_length_mm" double precision,
	"due_on" date,
	"state" "run_state" DEFAULT 'setup' NOT NULL,
	"state_note" text,
	"notes" text,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" uuid,
	"created_by_name" text NOT NULL,
	"updated_by" uuid,
	"updated_by_name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "runs_name_not_blank" CHECK (length(trim("runs"."name")) > 0),
	CONSTRAINT "runs_cloth_not_blank" CHECK (length(trim("runs"."cloth")) > 0),
	CONSTRAINT "runs_one_size" CHECK (("runs"."metres" IS NOT NULL AND "runs"."metres" > 0 AND "runs"."pieces" IS NULL AND "runs"."piece_length_mm" IS NULL) OR ("runs"."metres" IS NULL AND "runs"."pieces" IS NOT NULL AND "runs"."pieces" > 0 AND "runs"."piece_length_mm" IS NOT NULL AND "runs"."piece_length_mm" > 0)),
	CONSTRAINT "runs_version_positive" CHECK ("runs"."version" > 0)
);
--> statement-breakpoint
ALTER TABLE "run_events" ADD CONSTRAINT "run_events_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_events" ADD CONSTRAINT "run_events_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_findings" ADD CONSTRAINT "run_findings_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_findings" ADD CONSTRAINT "run_findings_stage_id_run_stages_id_fk" FOREIGN KEY ("stage_id") REFERENCES "public"."run_stages"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_findings" ADD CONSTRAINT "run_findings_stamp_id_stamps_id_fk" FOREIGN KEY ("stamp_id") REFERENCES "public"."stamps"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_findings" ADD CONSTRAINT "run_findings_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_plans" ADD CONSTRAINT "run_plans_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_plans" ADD CONSTRAINT "run_plans_plan_id_plans_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."plans"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_progress" ADD CONSTRAINT "run_progress_stage_id_run_stages_id_fk" FOREIGN KEY ("stage_id") REFERENCES "public"."run_stages"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_progress" ADD CONSTRAINT "run_progress_wax_use_id_wax_uses_id_fk" FOREIGN KEY ("wax_use_id") REFERENCES "public"."wax_uses"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_progress" ADD CONSTRAINT "run_progress_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_readings" ADD CONSTRAINT "run_readings_stage_id_run_stages_id_fk" FOREIGN KEY ("stage_id") REFERENCES "public"."run_stages"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_readings" ADD CONSTRAINT "run_readings_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_stage_stamps" ADD CONSTRAINT "run_stage_stamps_stage_id_run_stages_id_fk" FOREIGN KEY ("stage_id") REFERENCES "public"."run_stages"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_stage_stamps" ADD CONSTRAINT "run_stage_stamps_stamp_id_stamps_id_fk" FOREIGN KEY ("stamp_id") REFERENCES "public"."stamps"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_stages" ADD CONSTRAINT "run_stages_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_stages" ADD CONSTRAINT "run_stages_plan_id_plans_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."plans"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_stages" ADD CONSTRAINT "run_stages_recipe_id_wax_recipes_id_fk" FOREIGN KEY ("recipe_id") REFERENCES "public"."wax_recipes"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_motif_id_motifs_id_fk" FOREIGN KEY ("motif_id") REFERENCES "public"."motifs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_colourway_id_motif_colourways_id_fk" FOREIGN KEY ("colourway_id") REFERENCES "public"."motif_colourways"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "run_events_run_at_idx" ON "run_events" USING btree ("run_id","at");--> statement-breakpoint
CREATE INDEX "run_findings_run_idx" ON "run_findings" USING btree ("run_id");--> statement-breakpoint
CREATE INDEX "run_findings_stamp_idx" ON "run_findings" USING btree ("stamp_id","found_on");--> statement-breakpoint
CREATE INDEX "run_plans_plan_idx" ON "run_plans" USING btree ("plan_id");--> statement-breakpoint
CREATE INDEX "run_progress_stage_idx" ON "run_progress" USING btree ("stage_id","done_on");--> statement-breakpoint
CREATE UNIQUE INDEX "run_progress_wax_use_key" ON "run_progress" USING btree ("wax_use_id");--> statement-breakpoint
CREATE INDEX "run_readings_stage_idx" ON "run_readings" USING btree ("stage_id","at");--> statement-breakpoint
CREATE INDEX "run_stage_stamps_stamp_idx" ON "run_stage_stamps" USING btree ("stamp_id");--> statement-breakpoint
CREATE UNIQUE INDEX "run_stages_order_key" ON "run_stages" USING btree ("run_id","position");--> statement-breakpoint
CREATE INDEX "run_stages_plan_idx" ON "run_stages" USING btree ("plan_id");--> statement-breakpoint
CREATE INDEX "run_stages_recipe_idx" ON "run_stages" USING btree ("recipe_id");--> statement-breakpoint
CREATE INDEX "runs_state_idx" ON "runs" USING btree ("state");--> statement-breakpoint
CREATE INDEX "runs_motif_idx" ON "runs" USING btree ("motif_id");--> statement-breakpoint
CREATE INDEX "runs_updated_idx" ON "runs" USING btree ("updated_at");--> statement-breakpoint
ALTER TABLE "wax_uses" ADD CONSTRAINT "wax_uses_run_stage_id_run_stages_id_fk" FOREIGN KEY ("run_stage_id") REFERENCES "public"."run_stages"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "wax_uses_run_stage_idx" ON "wax_uses" USING btree ("run_stage_id");