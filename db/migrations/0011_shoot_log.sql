ALTER TABLE "shoot_log_notes" ADD COLUMN "clip_id" uuid;--> statement-breakpoint
ALTER TABLE "shoot_log_notes" ADD COLUMN "shot_id" uuid;--> statement-breakpoint
ALTER TABLE "shoot_log_notes" ADD COLUMN "received_at" timestamp with time zone DEFAULT now() NOT NULL;--> statement-breakpoint
ALTER TABLE "shoot_log_notes" ADD CONSTRAINT "shoot_log_notes_clip_id_clips_id_fk" FOREIGN KEY ("clip_id") REFERENCES "public"."clips"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shoot_log_notes" ADD CONSTRAINT "shoot_log_notes_shot_id_shots_id_fk" FOREIGN KEY ("shot_id") REFERENCES "public"."shots"("id") ON DELETE set null ON UPDATE no action;