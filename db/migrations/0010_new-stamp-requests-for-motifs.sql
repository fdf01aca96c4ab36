ALTER TABLE "new_stamp_requests" ADD COLUMN "motif_id" uuid;--> statement-breakpoint
ALTER TABLE "new_stamp_requests" ADD COLUMN "role" "motif_stamp_role";--> statement-breakpoint
ALTER TABLE "new_stamp_requests" ADD COLUMN "sketch_key" text;--> statement-breakpoint
ALTER TABLE "new_stamp_requests" ADD COLUMN "sketch_type" text;--> statement-breakpoint
ALTER TABLE "new_stamp_requests" ADD COLUMN "sketch_name" text;--> statement-breakpoint
ALTER TABLE "new_stamp_requests" ADD COLUMN "stamp_id" uuid;--> statement-breakpoint
ALTER TABLE "new_stamp_requests" ADD CONSTRAINT "new_stamp_requests_motif_id_motifs_id_fk" FOREIGN KEY ("motif_id") REFERENCES "public"."motifs"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "new_stamp_requests" ADD CONSTRAINT "new_stamp_requests_stamp_id_stamps_id_fk" FOREIGN KEY ("stamp_id") REFERENCES "public"."stamps"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "new_stamp_requests_motif_idx" ON "new_stamp_requests" USING btree ("motif_id");--> statement-breakpoint
ALTER TABLE "new_stamp_requests" ADD CONSTRAINT "new_stamp_requests_made_answered" CHECK ("new_stamp_requests"."state" <> 'made' OR "new_stamp_requests"."answered_at" IS NOT NULL);