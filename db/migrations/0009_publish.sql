CREATE TABLE "publish_overrides" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"episode_id" uuid NOT NULL,
	"user_id" uuid,
	"reason" text NOT NULL,
	"failing" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
DROP INDEX "invoices_provider_key";--> statement-breakpoint
ALTER TABLE "publish_packages" ADD COLUMN "title" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "publish_packages" ADD COLUMN "summary" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "publish_packages" ADD COLUMN "closing" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "publish_packages" ADD COLUMN "sections" jsonb DEFAULT '{"chapters":true,"credits":true,"materials":true,"safety":true}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "publish_packages" ADD COLUMN "thumbnail_key" text;--> statement-breakpoint
ALTER TABLE "publish_packages" ADD COLUMN "thumbnail_content_type" text;--> statement-breakpoint
ALTER TABLE "publish_packages" ADD COLUMN "thumbnail_ad_label" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "publish_packages" ADD COLUMN "script_final_fingerprint" text;--> statement-breakpoint
ALTER TABLE "publish_packages" ADD COLUMN "script_final_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "publish_packages" ADD COLUMN "script_final_by" uuid;--> statement-breakpoint
ALTER TABLE "publish_packages" ADD COLUMN "updated_by" uuid;--> statement-breakpoint
ALTER TABLE "publish_overrides" ADD CONSTRAINT "publish_overrides_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "publish_overrides" ADD CONSTRAINT "publish_overrides_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "publish_overrides_episode_idx" ON "publish_overrides" USING btree ("episode_id","created_at");--> statement-breakpoint
ALTER TABLE "publish_packages" ADD CONSTRAINT "publish_packages_script_final_by_users_id_fk" FOREIGN KEY ("script_final_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "publish_packages" ADD CONSTRAINT "publish_packages_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "invoices_provider_idx" ON "invoices" USING btree ("provider_id");--> statement-breakpoint
ALTER TABLE "publish_packages" DROP COLUMN "description";--> statement-breakpoint
ALTER TABLE "publish_packages" DROP COLUMN "disclosures";--> statement-breakpoint
ALTER TABLE "publish_packages" DROP COLUMN "credits";--> statement-breakpoint
ALTER TABLE "publish_packages" DROP COLUMN "checklist";