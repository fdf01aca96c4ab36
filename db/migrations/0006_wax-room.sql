CREATE TYPE "public"."wax_change_kind" AS ENUM('created', 'edited', 'duplicated', 'archived', 'restored');--> statement-breakpoint
CREATE TYPE "public"."wax_movement_kind" AS ENUM('receipt', 'use', 'recovery', 'correction');--> statement-breakpoint
CREATE TYPE "public"."wax_recipe_use" AS ENUM('stamping', 'hand-drawn', 'screen-paste', 'blocking');--> statement-breakpoint
CREATE TYPE "public"."wax_season" AS ENUM('dry', 'humid', 'rainy', 'any');--> statement-breakpoint
ALTER TYPE "public"."stamp_event_kind" ADD VALUE 'impressions_added';--> statement-breakpoint
CREATE TABLE "wax_estimates" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"plan_id" uuid,
	"recipe_id" uuid NOT NULL,
	"inputs" jsonb NOT NULL,
	"results" jsonb NOT NULL,
	"grams_per_metre" double precision NOT NULL,
	"kg_new" double precision NOT NULL,
	"planned" boolean DEFAULT false NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" uuid,
	"created_by_name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "wax_estimates_grams_nonnegative" CHECK ("wax_estimates"."grams_per_metre" >= 0 AND "wax_estimates"."kg_new" >= 0),
	CONSTRAINT "wax_estimates_version_positive" CHECK ("wax_estimates"."version" > 0)
);
--> statement-breakpoint
CREATE TABLE "wax_material_changes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"version" integer NOT NULL,
	"kind" "wax_change_kind" NOT NULL,
	"actor_id" uuid,
	"actor_name" text NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"changes" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"note" text,
	"material_id" uuid NOT NULL
);
--> statement-breakpoint
CREATE TABLE "wax_materials" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"code" text NOT NULL,
	"name" text NOT NULL,
	"density_g_per_cm3" double precision NOT NULL,
	"melt_from_c" double precision NOT NULL,
	"melt_to_c" double precision NOT NULL,
	"flash_point_c" double precision,
	"discolours_above_c" double precision,
	"price_per_kg" double precision,
	"sources" jsonb NOT NULL,
	"reorder_level_kg" double precision DEFAULT 0 NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "wax_materials_density_range" CHECK ("wax_materials"."density_g_per_cm3" >= 0.5 AND "wax_materials"."density_g_per_cm3" <= 2),
	CONSTRAINT "wax_materials_melt_order" CHECK ("wax_materials"."melt_from_c" <= "wax_materials"."melt_to_c"),
	CONSTRAINT "wax_materials_flash_point_range" CHECK ("wax_materials"."flash_point_c" IS NULL OR ("wax_materials"."flash_point_c" >= 50 AND "wax_materials"."flash_point_c" <= 600)),
	CONSTRAINT "wax_materials_price_nonnegative" CHECK ("wax_materials"."price_per_kg" IS NULL OR "wax_materials"."price_per_kg" >= 0),
	CONSTRAINT "wax_materials_reorder_nonnegative" CHECK ("wax_materials"."reorder_level_kg" >= 0),
	CONSTRAINT "wax_materials_version_positive" CHECK ("wax_materials"."version" > 0)
);
--> statement-breakpoint
CREATE TABLE "wax_recipe_changes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"version" integer NOT NULL,
	"kind" "wax_change_kind" NOT NULL,
	"actor_id" uuid,
	"actor_name" text NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"changes" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"note" text,
	"recipe_id" uuid NOT NULL
);
--> statement-breakpoint
CREATE TABLE "wax_recipe_components" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"recipe_id" uuid NOT NULL,
	"line" integer NOT NULL,
	"material_id" uuid NOT NULL,
	"pct" double precision NOT NULL,
	CONSTRAINT "wax_recipe_components_pct_range" CHECK ("wax_recipe_components"."pct" > 0 AND "wax_recipe_components"."pct" <= 100)
);
--> statement-breakpoint
CREATE TABLE "wax_recipes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"season" "wax_season" NOT NULL,
	"use" "wax_recipe_use" NOT NULL,
	"working_min_c" double precision NOT NULL,
	"working_max_c" double precision NOT NULL,
	"notes" text,
	"duplicated_from_id" uuid,
	"archived_at" timestamp with time zone,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "wax_recipes_working_order" CHECK ("wax_recipes"."working_min_c" <= "wax_recipes"."working_max_c"),
	CONSTRAINT "wax_recipes_working_range" CHECK ("wax_recipes"."working_min_c" >= 20 AND "wax_recipes"."working_max_c" <= 300),
	CONSTRAINT "wax_recipes_version_positive" CHECK ("wax_recipes"."version" > 0)
);
--> statement-breakpoint
CREATE TABLE "wax_stock_movements" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"material_id" uuid NOT NULL,
	"kind" "wax_movement_kind" NOT NULL,
	"kg" double precision NOT NULL,
	"note" text,
	"wax_use_id" uuid,
	"actor_id" uuid,
	"actor_name" text NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "wax_stock_movements_sign" CHECK (("wax_stock_movements"."kind" IN ('receipt', 'recovery') AND "wax_stock_movements"."kg" > 0) OR ("wax_stock_movements"."kind" = 'use' AND "wax_stock_movements"."kg" < 0) OR ("wax_stock_movements"."kind" = 'correction' AND "wax_stock_movements"."kg" <> 0))
);
--> statement-breakpoint
CREATE TABLE "wax_use_impressions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"wax_use_id" uuid NOT NULL,
	"stamp_id" uuid,
	"stamp_code" text NOT NULL,
	"impressions" integer NOT NULL,
	CONSTRAINT "wax_use_impressions_positive" CHECK ("wax_use_impressions"."impressions" > 0)
);
--> statement-breakpoint
CREATE TABLE "wax_uses" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"used_on" date NOT NULL,
	"plan_id" uuid,
	"run_stage_id" uuid,
	"recipe_id" uuid NOT NULL,
	"cloth" text,
	"waxed_area_per_metre_m2" double precision NOT NULL,
	"metres" double precision NOT NULL,
	"passes" integer DEFAULT 1 NOT NULL,
	"grams_used" double precision,
	"pot_before_g" double precision,
	"pot_after_g" double precision,
	"pot_added_g" double precision,
	"grams" double precision NOT NULL,
	"note" text,
	"recorded_by" uuid,
	"recorded_by_name" text NOT NULL,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	"withdrawn_at" timestamp with time zone,
	"withdrawn_by" uuid,
	"withdrawn_reason" text,
	CONSTRAINT "wax_uses_area_positive" CHECK ("wax_uses"."waxed_area_per_metre_m2" > 0),
	CONSTRAINT "wax_uses_metres_positive" CHECK ("wax_uses"."metres" > 0),
	CONSTRAINT "wax_uses_passes_positive" CHECK ("wax_uses"."passes" >= 1),
	CONSTRAINT "wax_uses_grams_nonnegative" CHECK ("wax_uses"."grams" >= 0)
);
--> statement-breakpoint
ALTER TABLE "wax_estimates" ADD CONSTRAINT "wax_estimates_recipe_id_wax_recipes_id_fk" FOREIGN KEY ("recipe_id") REFERENCES "public"."wax_recipes"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wax_estimates" ADD CONSTRAINT "wax_estimates_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wax_material_changes" ADD CONSTRAINT "wax_material_changes_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wax_material_changes" ADD CONSTRAINT "wax_material_changes_material_id_wax_materials_id_fk" FOREIGN KEY ("material_id") REFERENCES "public"."wax_materials"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wax_recipe_changes" ADD CONSTRAINT "wax_recipe_changes_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wax_recipe_changes" ADD CONSTRAINT "wax_recipe_changes_recipe_id_wax_recipes_id_fk" FOREIGN KEY ("recipe_id") REFERENCES "public"."wax_recipes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wax_recipe_components" ADD CONSTRAINT "wax_recipe_components_recipe_id_wax_recipes_id_fk" FOREIGN KEY ("recipe_id") REFERENCES "public"."wax_recipes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wax_recipe_components" ADD CONSTRAINT "wax_recipe_components_material_id_wax_materials_id_fk" FOREIGN KEY ("material_id") REFERENCES "public"."wax_materials"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wax_recipes" ADD CONSTRAINT "wax_recipes_duplicated_from_id_wax_recipes_id_fk" FOREIGN KEY ("duplicated_from_id") REFERENCES "public"."wax_recipes"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wax_recipes" ADD CONSTRAINT "wax_recipes_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wax_stock_movements" ADD CONSTRAINT "wax_stock_movements_material_id_wax_materials_id_fk" FOREIGN KEY ("material_id") REFERENCES "public"."wax_materials"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wax_stock_movements" ADD CONSTRAINT "wax_stock_movements_wax_use_id_wax_uses_id_fk" FOREIGN KEY ("wax_use_id") REFERENCES "public"."wax_uses"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wax_stock_movements" ADD CONSTRAINT "wax_stock_movements_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wax_use_impressions" ADD CONSTRAINT "wax_use_impressions_wax_use_id_wax_uses_id_fk" FOREIGN KEY ("wax_use_id") REFERENCES "public"."wax_uses"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wax_use_impressions" ADD CONSTRAINT "wax_use_impressions_stamp_id_stamps_id_fk" FOREIGN KEY ("stamp_id") REFERENCES "public"."stamps"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wax_uses" ADD CONSTRAINT "wax_uses_recipe_id_wax_recipes_id_fk" FOREIGN KEY ("recipe_id") REFERENCES "public"."wax_recipes"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wax_uses" ADD CONSTRAINT "wax_uses_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wax_uses" ADD CONSTRAINT "wax_uses_withdrawn_by_users_id_fk" FOREIGN KEY ("withdrawn_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "wax_estimates_planned_idx" ON "wax_estimates" USING btree ("planned");--> statement-breakpoint
CREATE INDEX "wax_estimates_recipe_idx" ON "wax_estimates" USING btree ("recipe_id");--> statement-breakpoint
CREATE INDEX "wax_estimates_plan_idx" ON "wax_estimates" USING btree ("plan_id");--> statement-breakpoint
CREATE INDEX "wax_material_changes_material_idx" ON "wax_material_changes" USING btree ("material_id","at");--> statement-breakpoint
CREATE UNIQUE INDEX "wax_materials_code_key" ON "wax_materials" USING btree ("code");--> statement-breakpoint
CREATE UNIQUE INDEX "wax_materials_name_key" ON "wax_materials" USING btree (lower("name"));--> statement-breakpoint
CREATE INDEX "wax_recipe_changes_recipe_idx" ON "wax_recipe_changes" USING btree ("recipe_id","at");--> statement-breakpoint
CREATE UNIQUE INDEX "wax_recipe_components_line_key" ON "wax_recipe_components" USING btree ("recipe_id","line");--> statement-breakpoint
CREATE UNIQUE INDEX "wax_recipe_components_material_key" ON "wax_recipe_components" USING btree ("recipe_id","material_id");--> statement-breakpoint
CREATE INDEX "wax_recipe_components_material_idx" ON "wax_recipe_components" USING btree ("material_id");--> statement-breakpoint
CREATE UNIQUE INDEX "wax_recipes_name_key" ON "wax_recipes" USING btree (lower("name"));--> statement-breakpoint
CREATE INDEX "wax_stock_movements_material_idx" ON "wax_stock_movements" USING btree ("material_id","at");--> statement-breakpoint
CREATE INDEX "wax_stock_movements_use_idx" ON "wax_stock_movements" USING btree ("wax_use_id");--> statement-breakpoint
CREATE INDEX "wax_use_impressions_use_idx" ON "wax_use_impressions" USING btree ("wax_use_id");--> statement-breakpoint
CREATE INDEX "wax_uses_recipe_idx" ON "wax_uses" USING btree ("recipe_id");--> statement-breakpoint
CREATE INDEX "wax_uses_used_on_idx" ON "wax_uses" USING btree ("used_on");--> statement-breakpoint
CREATE INDEX "wax_uses_plan_idx" ON "wax_uses" USING btree ("plan_id");