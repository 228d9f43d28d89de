DELETE FROM "scheduled_steps";--> statement-breakpoint
CREATE TABLE "call_sheet_sends" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shoot_day_id" uuid NOT NULL,
	"sent_by" uuid,
	"recipients" text[] NOT NULL,
	"status" text DEFAULT 'queued' NOT NULL,
	"error" text,
	"queued_at" timestamp with time zone DEFAULT now() NOT NULL,
	"sent_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "days_away" (
	"channel_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"day" date NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	CONSTRAINT "days_away_channel_id_user_id_day_pk" PRIMARY KEY("channel_id","user_id","day")
);
--> statement-breakpoint
CREATE TABLE "shoot_day_helpers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shoot_day_id" uuid NOT NULL,
	"name" text NOT NULL,
	"duty" text DEFAULT '' NOT NULL,
	"email" text,
	"call_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "scheduled_steps" DROP CONSTRAINT "scheduled_steps_shoot_day_id_shoot_days_id_fk";
--> statement-breakpoint
DROP INDEX "scheduled_steps_step_idx";--> statement-breakpoint
ALTER TABLE "scheduled_steps" DROP CONSTRAINT "scheduled_steps_shoot_day_id_step_id_pk";--> statement-breakpoint
ALTER TABLE "scheduled_steps" ADD PRIMARY KEY ("step_id");--> statement-breakpoint
ALTER TABLE "scheduled_steps" ALTER COLUMN "shoot_day_id" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "build_steps" ADD COLUMN "must_film" boolean DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE "build_steps" ADD COLUMN "pinned_shoot_day_id" uuid;--> statement-breakpoint
ALTER TABLE "channels" ADD COLUMN "time_zone" text DEFAULT 'UTC' NOT NULL;--> statement-breakpoint
ALTER TABLE "channels" ADD COLUMN "calendar_token_hash" text;--> statement-breakpoint
ALTER TABLE "scheduled_steps" ADD COLUMN "episode_id" uuid NOT NULL;--> statement-breakpoint
ALTER TABLE "scheduled_steps" ADD COLUMN "ends_at" timestamp with time zone NOT NULL;--> statement-breakpoint
ALTER TABLE "scheduled_steps" ADD COLUMN "planned_at" timestamp with time zone DEFAULT now() NOT NULL;--> statement-breakpoint
ALTER TABLE "shoot_day_crew" ADD COLUMN "call_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "shoot_days" ADD COLUMN "equipment_notes" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "shoot_days" ADD COLUMN "safety_notes" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "shoot_days" ADD COLUMN "weather_note" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "shoot_days" ADD COLUMN "contacts" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "shoot_days" ADD COLUMN "status" text DEFAULT 'planned' NOT NULL;--> statement-breakpoint
ALTER TABLE "shoot_days" ADD COLUMN "created_at" timestamp with time zone DEFAULT now() NOT NULL;--> statement-breakpoint
ALTER TABLE "shoot_days" ADD COLUMN "updated_at" timestamp with time zone DEFAULT now() NOT NULL;--> statement-breakpoint
ALTER TABLE "call_sheet_sends" ADD CONSTRAINT "call_sheet_sends_shoot_day_id_shoot_days_id_fk" FOREIGN KEY ("shoot_day_id") REFERENCES "public"."shoot_days"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "call_sheet_sends" ADD CONSTRAINT "call_sheet_sends_sent_by_users_id_fk" FOREIGN KEY ("sent_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "days_away" ADD CONSTRAINT "days_away_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "days_away" ADD CONSTRAINT "days_away_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shoot_day_helpers" ADD CONSTRAINT "shoot_day_helpers_shoot_day_id_shoot_days_id_fk" FOREIGN KEY ("shoot_day_id") REFERENCES "public"."shoot_days"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "call_sheet_sends_day_idx" ON "call_sheet_sends" USING btree ("shoot_day_id","queued_at");--> statement-breakpoint
CREATE INDEX "days_away_channel_day_idx" ON "days_away" USING btree ("channel_id","day");--> statement-breakpoint
CREATE INDEX "shoot_day_helpers_day_idx" ON "shoot_day_helpers" USING btree ("shoot_day_id");--> statement-breakpoint
ALTER TABLE "build_steps" ADD CONSTRAINT "build_steps_pinned_shoot_day_id_shoot_days_id_fk" FOREIGN KEY ("pinned_shoot_day_id") REFERENCES "public"."shoot_days"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scheduled_steps" ADD CONSTRAINT "scheduled_steps_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scheduled_steps" ADD CONSTRAINT "scheduled_steps_shoot_day_id_shoot_days_id_fk" FOREIGN KEY ("shoot_day_id") REFERENCES "public"."shoot_days"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "build_steps_pinned_day_idx" ON "build_steps" USING btree ("pinned_shoot_day_id");--> statement-breakpoint
CREATE INDEX "scheduled_steps_episode_idx" ON "scheduled_steps" USING btree ("episode_id");--> statement-breakpoint
CREATE INDEX "scheduled_steps_day_idx" ON "scheduled_steps" USING btree ("shoot_day_id");--> statement-breakpoint
ALTER TABLE "shoot_day_crew" DROP COLUMN "available";