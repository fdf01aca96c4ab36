CREATE TABLE "workshop_setting_changes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"version" integer NOT NULL,
	"actor_id" uuid,
	"actor_name" text NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"changes" jsonb NOT NULL
);
--> statement-breakpoint
CREATE TABLE "workshop_settings" (
	"id" integer PRIMARY KEY DEFAULT 1 NOT NULL,
	"values" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_by" uuid,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "workshop_settings_one_row" CHECK ("workshop_settings"."id" = 1),
	CONSTRAINT "workshop_settings_version_positive" CHECK ("workshop_settings"."version" > 0)
);
--> statement-breakpoint
ALTER TABLE "workshop_setting_changes" ADD CONSTRAINT "workshop_setting_changes_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "workshop_settings" ADD CONSTRAINT "workshop_settings_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "workshop_setting_changes_version_key" ON "workshop_setting_changes" USING btree ("version");--> statement-breakpoint
CREATE INDEX "workshop_setting_changes_at_idx" ON "workshop_setting_changes" USING btree ("at");