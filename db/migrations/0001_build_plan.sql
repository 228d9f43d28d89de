ALTER TABLE "tools" ALTER COLUMN "kind" SET DEFAULT 'other';--> statement-breakpoint
ALTER TABLE "build_steps" ADD COLUMN "hazards" text[] DEFAULT '{}'::text[] NOT NULL;