CREATE TYPE "public"."cloth_face" AS ENUM('front', 'back', 'both');--> statement-breakpoint
CREATE TYPE "public"."motif_event_kind" AS ENUM('created', 'edited', 'copied');--> statement-breakpoint
CREATE TYPE "public"."motif_stamp_role" AS ENUM('main', 'filler', 'border', 'corner', 'reverse_twin');--> statement-breakpoint
CREATE TABLE "motif_collection_members" (
	"motif_id" uuid NOT NULL,
	"collection_id" uuid NOT NULL,
	CONSTRAINT "motif_collection_members_motif_id_collection_id_pk" PRIMARY KEY("motif_id","collection_id")
);
--> statement-breakpoint
CREATE TABLE "motif_collections" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"season" text,
	"year" integer,
	"description" text,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "motif_collections_year_range" CHECK ("motif_collections"."year" IS NULL OR "motif_collections"."year" BETWEEN 1800 AND 2200)
);
--> statement-breakpoint
CREATE TABLE "motif_colours" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"colourway_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"name" text NOT NULL,
	"swatch" text NOT NULL,
	"dye_notes" text,
	"wax_stamp_ids" uuid[] DEFAULT '{}'::uuid[] NOT NULL,
	"face" "cloth_face" DEFAULT 'front' NOT NULL,
	CONSTRAINT "motif_colours_swatch_hex" CHECK ("motif_colours"."swatch" ~ '^#[0-9a-f]{6}$')
);
--> statement-breakpoint
CREATE TABLE "motif_colourways" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"motif_id" uuid NOT NULL,
	"name" text NOT NULL,
	"notes" text,
	"position" integer DEFAULT 0 NOT NULL
);
--> statement-breakpoint
CREATE TABLE "motif_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"motif_id" uuid NOT NULL,
	"kind" "motif_event_kind" NOT NULL,
	"actor_id" uuid,
	"actor_name" text NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"changes" jsonb DEFAULT '[]'::jsonb NOT NULL
);
--> statement-breakpoint
CREATE TABLE "motif_stamps" (
	"motif_id" uuid NOT NULL,
	"stamp_id" uuid NOT NULL,
	"role" "motif_stamp_role" NOT NULL,
	"position" integer DEFAULT 0 NOT NULL,
	CONSTRAINT "motif_stamps_motif_id_stamp_id_pk" PRIMARY KEY("motif_id","stamp_id")
);
--> statement-breakpoint
CREATE TABLE "motifs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"description" text,
	"tags" text[] DEFAULT '{}'::text[] NOT NULL,
	"designer" text,
	"first_used_on" date,
	"notes" text,
	"copied_from_id" uuid,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "motifs_version_positive" CHECK ("motifs"."version" > 0)
);
--> statement-breakpoint
ALTER TABLE "stamp_scans" ADD COLUMN "signature" "bytea";--> statement-breakpoint
ALTER TABLE "motif_collection_members" ADD CONSTRAINT "motif_collection_members_motif_id_motifs_id_fk" FOREIGN KEY ("motif_id") REFERENCES "public"."motifs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "motif_collection_members" ADD CONSTRAINT "motif_collection_members_collection_id_motif_collections_id_fk" FOREIGN KEY ("collection_id") REFERENCES "public"."motif_collections"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "motif_colours" ADD CONSTRAINT "motif_colours_colourway_id_motif_colourways_id_fk" FOREIGN KEY ("colourway_id") REFERENCES "public"."motif_colourways"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "motif_colourways" ADD CONSTRAINT "motif_colourways_motif_id_motifs_id_fk" FOREIGN KEY ("motif_id") REFERENCES "public"."motifs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "motif_events" ADD CONSTRAINT "motif_events_motif_id_motifs_id_fk" FOREIGN KEY ("motif_id") REFERENCES "public"."motifs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "motif_events" ADD CONSTRAINT "motif_events_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "motif_stamps" ADD CONSTRAINT "motif_stamps_motif_id_motifs_id_fk" FOREIGN KEY ("motif_id") REFERENCES "public"."motifs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "motif_stamps" ADD CONSTRAINT "motif_stamps_stamp_id_stamps_id_fk" FOREIGN KEY ("stamp_id") REFERENCES "public"."stamps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "motifs" ADD CONSTRAINT "motifs_copied_from_id_motifs_id_fk" FOREIGN KEY ("copied_from_id") REFERENCES "public"."motifs"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "motif_collection_members_collection_idx" ON "motif_collection_members" USING btree ("collection_id");--> statement-breakpoint
CREATE UNIQUE INDEX "motif_collections_name_key" ON "motif_collections" USING btree (lower("name"));--> statement-breakpoint
CREATE UNIQUE INDEX "motif_colours_order_key" ON "motif_colours" USING btree ("colourway_id","position");--> statement-breakpoint
CREATE UNIQUE INDEX "motif_colourways_name_key" ON "motif_colourways" USING btree ("motif_id",lower("name"));--> statement-breakpoint
CREATE INDEX "motif_events_motif_at_idx" ON "motif_events" USING btree ("motif_id","at");--> statement-breakpoint
CREATE UNIQUE INDEX "motif_stamps_one_main" ON "motif_stamps" USING btree ("motif_id") WHERE "motif_stamps"."role" = 'main';--> statement-breakpoint
CREATE INDEX "motif_stamps_stamp_idx" ON "motif_stamps" USING btree ("stamp_id");--> statement-breakpoint
CREATE INDEX "motifs_name_idx" ON "motifs" USING btree ("name");--> statement-breakpoint
CREATE INDEX "motifs_tags_idx" ON "motifs" USING gin ("tags");