CREATE TABLE "audit_entries" (
	"id" bigint PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "audit_entries_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 9223372036854775807 START WITH 1 CACHE 1),
	"channel_id" uuid,
	"user_id" uuid,
	"action" text NOT NULL,
	"entity" text NOT NULL,
	"entity_id" text,
	"before" jsonb,
	"after" jsonb,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "build_steps" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"episode_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"title" text NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"active_minutes" integer DEFAULT 0 NOT NULL,
	"wait_minutes" integer DEFAULT 0 NOT NULL,
	"wait_reason" text DEFAULT '' NOT NULL,
	"crew_needed" integer DEFAULT 1 NOT NULL,
	"coverage_kinds" text[] DEFAULT '{}'::text[] NOT NULL,
	"status" text DEFAULT 'planned' NOT NULL,
	"failure_note" text,
	"failure_photo_key" text,
	"remedy_of_step_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "channels" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"units" text DEFAULT 'imperial' NOT NULL,
	"currency" text DEFAULT 'USD' NOT NULL,
	"broll_gap_ms" integer DEFAULT 2000 NOT NULL,
	"to_camera_max_ms" integer DEFAULT 20000 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"archived_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "clips" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	"shot_id" uuid,
	"storage_key" text NOT NULL,
	"upload_id" text,
	"state" text DEFAULT 'uploading' NOT NULL,
	"original_name" text NOT NULL,
	"size_bytes" bigint NOT NULL,
	"content_type" text NOT NULL,
	"duration_ms" integer,
	"frame_rate" text,
	"width" integer,
	"height" integer,
	"start_timecode" text,
	"checksum" text,
	"in_frame" integer,
	"out_frame" integer,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "coverage_ranges" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"episode_id" uuid NOT NULL,
	"clip_id" uuid,
	"start_frame" integer NOT NULL,
	"end_frame" integer NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "coverage_range" CHECK ("coverage_ranges"."end_frame" > "coverage_ranges"."start_frame")
);
--> statement-breakpoint
CREATE TABLE "deals" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"sponsor_id" uuid NOT NULL,
	"episode_id" uuid,
	"title" text NOT NULL,
	"fee_minor" integer DEFAULT 0 NOT NULL,
	"currency" text DEFAULT 'USD' NOT NULL,
	"status" text DEFAULT 'proposed' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"archived_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "deliverables" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"deal_id" uuid NOT NULL,
	"segment_id" uuid,
	"window_start_seconds" integer,
	"window_end_seconds" integer,
	"min_seconds" integer,
	"max_seconds" integer,
	"disclosure_required" boolean DEFAULT true NOT NULL,
	"disclosure_text" text DEFAULT '' NOT NULL,
	"link_url" text,
	"credit_text" text DEFAULT '' NOT NULL,
	"review_status" text DEFAULT 'pending' NOT NULL,
	"review_note" text DEFAULT '' NOT NULL,
	"reviewed_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "episodes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"title" text NOT NULL,
	"summary" text DEFAULT '' NOT NULL,
	"stage" text NOT NULL,
	"position" integer NOT NULL,
	"target_runtime_seconds" integer,
	"publish_date" date,
	"frame_rate" text DEFAULT '29.97' NOT NULL,
	"drop_frame" boolean DEFAULT false NOT NULL,
	"created_by" uuid,
	"updated_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"archived_at" timestamp with time zone,
	CONSTRAINT "episodes_drop_frame_rate" CHECK (not "episodes"."drop_frame" or "episodes"."frame_rate" in ('29.97','59.94'))
);
--> statement-breakpoint
CREATE TABLE "gaps" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"episode_id" uuid NOT NULL,
	"segment_id" uuid,
	"start_frame" integer NOT NULL,
	"end_frame" integer NOT NULL,
	"source" text NOT NULL,
	"status" text DEFAULT 'open' NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "gaps_range" CHECK ("gaps"."end_frame" > "gaps"."start_frame")
);
--> statement-breakpoint
CREATE TABLE "guest_links" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"deal_id" uuid NOT NULL,
	"token_hash" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"revoked_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "invitations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"email" text NOT NULL,
	"roles" text[] NOT NULL,
	"token_hash" text NOT NULL,
	"invited_by" uuid,
	"expires_at" timestamp with time zone NOT NULL,
	"accepted_at" timestamp with time zone,
	"revoked_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "invoices" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"deal_id" uuid NOT NULL,
	"amount_minor" integer NOT NULL,
	"currency" text NOT NULL,
	"provider_id" text,
	"status" text DEFAULT 'draft' NOT NULL,
	"issued_at" timestamp with time zone,
	"paid_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "mail_messages" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"from_address" text NOT NULL,
	"to_addresses" text[] NOT NULL,
	"subject" text DEFAULT '' NOT NULL,
	"text_body" text DEFAULT '' NOT NULL,
	"html_body" text,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "materials" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"episode_id" uuid NOT NULL,
	"step_id" uuid,
	"position" integer DEFAULT 0 NOT NULL,
	"part_name" text NOT NULL,
	"material" text DEFAULT '' NOT NULL,
	"unit" text DEFAULT 'in' NOT NULL,
	"thickness" numeric(12, 4) NOT NULL,
	"width" numeric(12, 4) NOT NULL,
	"length" numeric(12, 4) NOT NULL,
	"quantity" integer DEFAULT 1 NOT NULL,
	"sizing" text DEFAULT 'actual' NOT NULL,
	"pricing_unit" text DEFAULT 'board_foot' NOT NULL,
	"unit_price_minor" integer DEFAULT 0 NOT NULL,
	"currency" text DEFAULT 'USD' NOT NULL,
	"waste_percent" numeric(5, 2) DEFAULT '0' NOT NULL,
	"supplier_note" text DEFAULT '' NOT NULL
);
--> statement-breakpoint
CREATE TABLE "memberships" (
	"channel_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"roles" text[] NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "memberships_channel_id_user_id_pk" PRIMARY KEY("channel_id","user_id")
);
--> statement-breakpoint
CREATE TABLE "password_resets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"token_hash" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"used_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "publish_packages" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"episode_id" uuid NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"disclosures" text DEFAULT '' NOT NULL,
	"credits" text DEFAULT '' NOT NULL,
	"checklist" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "scheduled_steps" (
	"shoot_day_id" uuid NOT NULL,
	"step_id" uuid NOT NULL,
	"starts_at" timestamp with time zone NOT NULL,
	CONSTRAINT "scheduled_steps_shoot_day_id_step_id_pk" PRIMARY KEY("shoot_day_id","step_id")
);
--> statement-breakpoint
CREATE TABLE "script_revisions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"episode_id" uuid NOT NULL,
	"segment_id" uuid,
	"user_id" uuid,
	"before" jsonb,
	"after" jsonb,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "script_segments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"episode_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"kind" text NOT NULL,
	"text" text DEFAULT '' NOT NULL,
	"step_id" uuid,
	"pinned_start_frame" integer,
	"explicit_duration_frames" integer,
	"editor_notes" text DEFAULT '' NOT NULL,
	"chapter_start" boolean DEFAULT false NOT NULL,
	"chapter_title" text,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_by" uuid,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "shoot_day_crew" (
	"shoot_day_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"available" boolean DEFAULT true NOT NULL,
	"duty" text DEFAULT '' NOT NULL,
	CONSTRAINT "shoot_day_crew_shoot_day_id_user_id_pk" PRIMARY KEY("shoot_day_id","user_id")
);
--> statement-breakpoint
CREATE TABLE "shoot_days" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid,
	"day" date NOT NULL,
	"time_zone" text DEFAULT 'UTC' NOT NULL,
	"call_at" timestamp with time zone NOT NULL,
	"wrap_at" timestamp with time zone NOT NULL,
	"location" text DEFAULT '' NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"call_sheet_sent_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "shoot_log_notes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"episode_id" uuid NOT NULL,
	"shoot_day_id" uuid,
	"step_id" uuid,
	"segment_id" uuid,
	"author_id" uuid,
	"noted_at" timestamp with time zone DEFAULT now() NOT NULL,
	"text" text NOT NULL
);
--> statement-breakpoint
CREATE TABLE "shots" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"episode_id" uuid NOT NULL,
	"step_id" uuid,
	"segment_id" uuid,
	"shoot_day_id" uuid,
	"gap_id" uuid,
	"position" integer DEFAULT 0 NOT NULL,
	"kind" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"framing" text DEFAULT '' NOT NULL,
	"camera_notes" text DEFAULT '' NOT NULL,
	"priority" integer DEFAULT 2 NOT NULL,
	"status" text DEFAULT 'planned' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sign_in_attempts" (
	"id" bigint PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "sign_in_attempts_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 9223372036854775807 START WITH 1 CACHE 1),
	"key" text NOT NULL,
	"succeeded" boolean NOT NULL,
	"attempted_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sponsors" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"name" text NOT NULL,
	"contact_name" text DEFAULT '' NOT NULL,
	"contact_email" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"archived_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "step_dependencies" (
	"step_id" uuid NOT NULL,
	"depends_on_step_id" uuid NOT NULL,
	CONSTRAINT "step_dependencies_step_id_depends_on_step_id_pk" PRIMARY KEY("step_id","depends_on_step_id")
);
--> statement-breakpoint
CREATE TABLE "step_tools" (
	"step_id" uuid NOT NULL,
	"tool_id" uuid NOT NULL,
	CONSTRAINT "step_tools_step_id_tool_id_pk" PRIMARY KEY("step_id","tool_id")
);
--> statement-breakpoint
CREATE TABLE "tools" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"name" text NOT NULL,
	"kind" text DEFAULT '' NOT NULL,
	"acquisition" text DEFAULT 'bought' NOT NULL,
	"sponsor_id" uuid,
	"caution" text DEFAULT '' NOT NULL,
	"photo_key" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"archived_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "users" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"name" text NOT NULL,
	"password_hash" text NOT NULL,
	"reading_rate_wpm" integer DEFAULT 150 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "users_email_lower" CHECK ("users"."email" = lower("users"."email"))
);
--> statement-breakpoint
ALTER TABLE "audit_entries" ADD CONSTRAINT "audit_entries_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_entries" ADD CONSTRAINT "audit_entries_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_steps" ADD CONSTRAINT "build_steps_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "clips" ADD CONSTRAINT "clips_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "clips" ADD CONSTRAINT "clips_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "clips" ADD CONSTRAINT "clips_shot_id_shots_id_fk" FOREIGN KEY ("shot_id") REFERENCES "public"."shots"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "clips" ADD CONSTRAINT "clips_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "coverage_ranges" ADD CONSTRAINT "coverage_ranges_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "coverage_ranges" ADD CONSTRAINT "coverage_ranges_clip_id_clips_id_fk" FOREIGN KEY ("clip_id") REFERENCES "public"."clips"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deals" ADD CONSTRAINT "deals_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deals" ADD CONSTRAINT "deals_sponsor_id_sponsors_id_fk" FOREIGN KEY ("sponsor_id") REFERENCES "public"."sponsors"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deals" ADD CONSTRAINT "deals_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliverables" ADD CONSTRAINT "deliverables_deal_id_deals_id_fk" FOREIGN KEY ("deal_id") REFERENCES "public"."deals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliverables" ADD CONSTRAINT "deliverables_segment_id_script_segments_id_fk" FOREIGN KEY ("segment_id") REFERENCES "public"."script_segments"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "episodes" ADD CONSTRAINT "episodes_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "episodes" ADD CONSTRAINT "episodes_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "episodes" ADD CONSTRAINT "episodes_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "gaps" ADD CONSTRAINT "gaps_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "gaps" ADD CONSTRAINT "gaps_segment_id_script_segments_id_fk" FOREIGN KEY ("segment_id") REFERENCES "public"."script_segments"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "guest_links" ADD CONSTRAINT "guest_links_deal_id_deals_id_fk" FOREIGN KEY ("deal_id") REFERENCES "public"."deals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_invited_by_users_id_fk" FOREIGN KEY ("invited_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invoices" ADD CONSTRAINT "invoices_deal_id_deals_id_fk" FOREIGN KEY ("deal_id") REFERENCES "public"."deals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "materials" ADD CONSTRAINT "materials_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "materials" ADD CONSTRAINT "materials_step_id_build_steps_id_fk" FOREIGN KEY ("step_id") REFERENCES "public"."build_steps"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "password_resets" ADD CONSTRAINT "password_resets_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "publish_packages" ADD CONSTRAINT "publish_packages_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scheduled_steps" ADD CONSTRAINT "scheduled_steps_shoot_day_id_shoot_days_id_fk" FOREIGN KEY ("shoot_day_id") REFERENCES "public"."shoot_days"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scheduled_steps" ADD CONSTRAINT "scheduled_steps_step_id_build_steps_id_fk" FOREIGN KEY ("step_id") REFERENCES "public"."build_steps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "script_revisions" ADD CONSTRAINT "script_revisions_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "script_revisions" ADD CONSTRAINT "script_revisions_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "script_segments" ADD CONSTRAINT "script_segments_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "script_segments" ADD CONSTRAINT "script_segments_step_id_build_steps_id_fk" FOREIGN KEY ("step_id") REFERENCES "public"."build_steps"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "script_segments" ADD CONSTRAINT "script_segments_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shoot_day_crew" ADD CONSTRAINT "shoot_day_crew_shoot_day_id_shoot_days_id_fk" FOREIGN KEY ("shoot_day_id") REFERENCES "public"."shoot_days"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shoot_day_crew" ADD CONSTRAINT "shoot_day_crew_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shoot_days" ADD CONSTRAINT "shoot_days_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shoot_days" ADD CONSTRAINT "shoot_days_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shoot_log_notes" ADD CONSTRAINT "shoot_log_notes_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shoot_log_notes" ADD CONSTRAINT "shoot_log_notes_shoot_day_id_shoot_days_id_fk" FOREIGN KEY ("shoot_day_id") REFERENCES "public"."shoot_days"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shoot_log_notes" ADD CONSTRAINT "shoot_log_notes_step_id_build_steps_id_fk" FOREIGN KEY ("step_id") REFERENCES "public"."build_steps"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shoot_log_notes" ADD CONSTRAINT "shoot_log_notes_segment_id_script_segments_id_fk" FOREIGN KEY ("segment_id") REFERENCES "public"."script_segments"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shoot_log_notes" ADD CONSTRAINT "shoot_log_notes_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shots" ADD CONSTRAINT "shots_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shots" ADD CONSTRAINT "shots_step_id_build_steps_id_fk" FOREIGN KEY ("step_id") REFERENCES "public"."build_steps"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shots" ADD CONSTRAINT "shots_segment_id_script_segments_id_fk" FOREIGN KEY ("segment_id") REFERENCES "public"."script_segments"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shots" ADD CONSTRAINT "shots_shoot_day_id_shoot_days_id_fk" FOREIGN KEY ("shoot_day_id") REFERENCES "public"."shoot_days"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shots" ADD CONSTRAINT "shots_gap_id_gaps_id_fk" FOREIGN KEY ("gap_id") REFERENCES "public"."gaps"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sponsors" ADD CONSTRAINT "sponsors_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "step_dependencies" ADD CONSTRAINT "step_dependencies_step_id_build_steps_id_fk" FOREIGN KEY ("step_id") REFERENCES "public"."build_steps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "step_dependencies" ADD CONSTRAINT "step_dependencies_depends_on_step_id_build_steps_id_fk" FOREIGN KEY ("depends_on_step_id") REFERENCES "public"."build_steps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "step_tools" ADD CONSTRAINT "step_tools_step_id_build_steps_id_fk" FOREIGN KEY ("step_id") REFERENCES "public"."build_steps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "step_tools" ADD CONSTRAINT "step_tools_tool_id_tools_id_fk" FOREIGN KEY ("tool_id") REFERENCES "public"."tools"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tools" ADD CONSTRAINT "tools_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tools" ADD CONSTRAINT "tools_sponsor_id_sponsors_id_fk" FOREIGN KEY ("sponsor_id") REFERENCES "public"."sponsors"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "audit_entries_channel_idx" ON "audit_entries" USING btree ("channel_id","at");--> statement-breakpoint
CREATE INDEX "build_steps_episode_idx" ON "build_steps" USING btree ("episode_id","position");--> statement-breakpoint
CREATE INDEX "build_steps_remedy_idx" ON "build_steps" USING btree ("remedy_of_step_id");--> statement-breakpoint
CREATE UNIQUE INDEX "clips_storage_key" ON "clips" USING btree ("storage_key");--> statement-breakpoint
CREATE INDEX "clips_episode_idx" ON "clips" USING btree ("episode_id");--> statement-breakpoint
CREATE INDEX "clips_shot_idx" ON "clips" USING btree ("shot_id");--> statement-breakpoint
CREATE INDEX "clips_channel_state_idx" ON "clips" USING btree ("channel_id","state");--> statement-breakpoint
CREATE INDEX "coverage_ranges_episode_idx" ON "coverage_ranges" USING btree ("episode_id");--> statement-breakpoint
CREATE INDEX "coverage_ranges_clip_idx" ON "coverage_ranges" USING btree ("clip_id");--> statement-breakpoint
CREATE INDEX "deals_channel_idx" ON "deals" USING btree ("channel_id");--> statement-breakpoint
CREATE INDEX "deals_sponsor_idx" ON "deals" USING btree ("sponsor_id");--> statement-breakpoint
CREATE INDEX "deals_episode_idx" ON "deals" USING btree ("episode_id");--> statement-breakpoint
CREATE INDEX "deliverables_deal_idx" ON "deliverables" USING btree ("deal_id");--> statement-breakpoint
CREATE INDEX "deliverables_segment_idx" ON "deliverables" USING btree ("segment_id");--> statement-breakpoint
CREATE INDEX "episodes_channel_stage_pos_idx" ON "episodes" USING btree ("channel_id","stage","position");--> statement-breakpoint
CREATE INDEX "episodes_channel_publish_idx" ON "episodes" USING btree ("channel_id","publish_date");--> statement-breakpoint
CREATE INDEX "gaps_episode_idx" ON "gaps" USING btree ("episode_id","status");--> statement-breakpoint
CREATE UNIQUE INDEX "guest_links_token_key" ON "guest_links" USING btree ("token_hash");--> statement-breakpoint
CREATE INDEX "guest_links_deal_idx" ON "guest_links" USING btree ("deal_id");--> statement-breakpoint
CREATE UNIQUE INDEX "invitations_token_key" ON "invitations" USING btree ("token_hash");--> statement-breakpoint
CREATE INDEX "invitations_channel_idx" ON "invitations" USING btree ("channel_id");--> statement-breakpoint
CREATE INDEX "invoices_deal_idx" ON "invoices" USING btree ("deal_id");--> statement-breakpoint
CREATE UNIQUE INDEX "invoices_provider_key" ON "invoices" USING btree ("provider_id");--> statement-breakpoint
CREATE INDEX "mail_messages_received_idx" ON "mail_messages" USING btree ("received_at");--> statement-breakpoint
CREATE INDEX "materials_episode_idx" ON "materials" USING btree ("episode_id");--> statement-breakpoint
CREATE INDEX "materials_step_idx" ON "materials" USING btree ("step_id");--> statement-breakpoint
CREATE INDEX "memberships_user_idx" ON "memberships" USING btree ("user_id");--> statement-breakpoint
CREATE UNIQUE INDEX "password_resets_token_key" ON "password_resets" USING btree ("token_hash");--> statement-breakpoint
CREATE INDEX "password_resets_user_idx" ON "password_resets" USING btree ("user_id");--> statement-breakpoint
CREATE UNIQUE INDEX "publish_packages_episode_key" ON "publish_packages" USING btree ("episode_id");--> statement-breakpoint
CREATE INDEX "scheduled_steps_step_idx" ON "scheduled_steps" USING btree ("step_id");--> statement-breakpoint
CREATE INDEX "script_revisions_episode_idx" ON "script_revisions" USING btree ("episode_id","created_at");--> statement-breakpoint
CREATE INDEX "script_segments_episode_idx" ON "script_segments" USING btree ("episode_id","position");--> statement-breakpoint
CREATE INDEX "script_segments_step_idx" ON "script_segments" USING btree ("step_id");--> statement-breakpoint
CREATE INDEX "shoot_day_crew_user_idx" ON "shoot_day_crew" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "shoot_days_channel_day_idx" ON "shoot_days" USING btree ("channel_id","day");--> statement-breakpoint
CREATE INDEX "shoot_days_episode_idx" ON "shoot_days" USING btree ("episode_id");--> statement-breakpoint
CREATE INDEX "shoot_log_notes_episode_idx" ON "shoot_log_notes" USING btree ("episode_id","noted_at");--> statement-breakpoint
CREATE INDEX "shots_episode_idx" ON "shots" USING btree ("episode_id","status");--> statement-breakpoint
CREATE INDEX "shots_step_idx" ON "shots" USING btree ("step_id");--> statement-breakpoint
CREATE INDEX "shots_segment_idx" ON "shots" USING btree ("segment_id");--> statement-breakpoint
CREATE INDEX "shots_day_idx" ON "shots" USING btree ("shoot_day_id");--> statement-breakpoint
CREATE INDEX "shots_gap_idx" ON "shots" USING btree ("gap_id");--> statement-breakpoint
CREATE INDEX "sign_in_attempts_key_time_idx" ON "sign_in_attempts" USING btree ("key","attempted_at");--> statement-breakpoint
CREATE INDEX "sponsors_channel_idx" ON "sponsors" USING btree ("channel_id");--> statement-breakpoint
CREATE INDEX "step_dependencies_dep_idx" ON "step_dependencies" USING btree ("depends_on_step_id");--> statement-breakpoint
CREATE INDEX "step_tools_tool_idx" ON "step_tools" USING btree ("tool_id");--> statement-breakpoint
CREATE INDEX "tools_channel_idx" ON "tools" USING btree ("channel_id");--> statement-breakpoint
CREATE INDEX "tools_sponsor_idx" ON "tools" USING btree ("sponsor_id");--> statement-breakpoint
CREATE UNIQUE INDEX "users_email_key" ON "users" USING btree ("email");