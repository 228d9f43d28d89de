ALTER TABLE "clips" ADD COLUMN "part_size" bigint;--> statement-breakpoint
ALTER TABLE "coverage_ranges" ADD COLUMN "clip_in_frame" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "gaps" ADD COLUMN "reason" text;--> statement-breakpoint
CREATE INDEX "episodes_presenter_idx" ON "episodes" USING btree ("presenter_id");--> statement-breakpoint
CREATE INDEX "gaps_segment_idx" ON "gaps" USING btree ("segment_id");