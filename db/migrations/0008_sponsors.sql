DELETE FROM "deliverables";--> statement-breakpoint
CREATE TABLE "deal_episodes" (
	"deal_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	CONSTRAINT "deal_episodes_deal_id_episode_id_pk" PRIMARY KEY("deal_id","episode_id")
);
--> statement-breakpoint
CREATE TABLE "deal_tools" (
	"deal_id" uuid NOT NULL,
	"tool_id" uuid NOT NULL,
	CONSTRAINT "deal_tools_deal_id_tool_id_pk" PRIMARY KEY("deal_id","tool_id")
);
--> statement-breakpoint
CREATE TABLE "payment_events" (
	"id" text PRIMARY KEY NOT NULL,
	"type" text NOT NULL,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "review_comments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"deal_id" uuid NOT NULL,
	"guest_link_id" uuid,
	"user_id" uuid,
	"decision" text,
	"body" text DEFAULT '' NOT NULL,
	"script_fingerprint" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sponsor_contacts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"sponsor_id" uuid NOT NULL,
	"name" text NOT NULL,
	"email" text NOT NULL
);
--> statement-breakpoint
ALTER TABLE "deliverables" DROP CONSTRAINT "deliverables_segment_id_script_segments_id_fk";
--> statement-breakpoint
DROP INDEX "deliverables_segment_idx";--> statement-breakpoint
ALTER TABLE "deals" ADD COLUMN "kind" text DEFAULT 'paid_integration' NOT NULL;--> statement-breakpoint
ALTER TABLE "deals" ADD COLUMN "signed_on" date;--> statement-breakpoint
ALTER TABLE "deals" ADD COLUMN "script_due" date;--> statement-breakpoint
ALTER TABLE "deals" ADD COLUMN "review_due" date;--> statement-breakpoint
ALTER TABLE "deals" ADD COLUMN "publish_from" date;--> statement-breakpoint
ALTER TABLE "deals" ADD COLUMN "publish_to" date;--> statement-breakpoint
ALTER TABLE "deals" ADD COLUMN "return_by" date;--> statement-breakpoint
ALTER TABLE "deals" ADD COLUMN "notes" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "deals" ADD COLUMN "updated_at" timestamp with time zone DEFAULT now() NOT NULL;--> statement-breakpoint
ALTER TABLE "deliverables" ADD COLUMN "kind" text NOT NULL;--> statement-breakpoint
ALTER TABLE "deliverables" ADD COLUMN "seconds" integer;--> statement-breakpoint
ALTER TABLE "deliverables" ADD COLUMN "phrases" text[] DEFAULT '{}'::text[] NOT NULL;--> statement-breakpoint
ALTER TABLE "deliverables" ADD COLUMN "url" text;--> statement-breakpoint
ALTER TABLE "deliverables" ADD COLUMN "position" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "deliverables" ADD COLUMN "created_at" timestamp with time zone DEFAULT now() NOT NULL;--> statement-breakpoint
ALTER TABLE "guest_links" ADD COLUMN "contact_email" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "guest_links" ADD COLUMN "created_by" uuid;--> statement-breakpoint
ALTER TABLE "invoices" ADD COLUMN "provider_customer_id" text;--> statement-breakpoint
ALTER TABLE "invoices" ADD COLUMN "hosted_url" text;--> statement-breakpoint
ALTER TABLE "sponsors" ADD COLUMN "website" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "sponsors" ADD COLUMN "notes" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "deal_episodes" ADD CONSTRAINT "deal_episodes_deal_id_deals_id_fk" FOREIGN KEY ("deal_id") REFERENCES "public"."deals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deal_episodes" ADD CONSTRAINT "deal_episodes_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deal_tools" ADD CONSTRAINT "deal_tools_deal_id_deals_id_fk" FOREIGN KEY ("deal_id") REFERENCES "public"."deals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deal_tools" ADD CONSTRAINT "deal_tools_tool_id_tools_id_fk" FOREIGN KEY ("tool_id") REFERENCES "public"."tools"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_comments" ADD CONSTRAINT "review_comments_deal_id_deals_id_fk" FOREIGN KEY ("deal_id") REFERENCES "public"."deals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_comments" ADD CONSTRAINT "review_comments_guest_link_id_guest_links_id_fk" FOREIGN KEY ("guest_link_id") REFERENCES "public"."guest_links"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_comments" ADD CONSTRAINT "review_comments_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sponsor_contacts" ADD CONSTRAINT "sponsor_contacts_sponsor_id_sponsors_id_fk" FOREIGN KEY ("sponsor_id") REFERENCES "public"."sponsors"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "deal_episodes_episode_idx" ON "deal_episodes" USING btree ("episode_id");--> statement-breakpoint
CREATE INDEX "deal_tools_tool_idx" ON "deal_tools" USING btree ("tool_id");--> statement-breakpoint
CREATE INDEX "review_comments_deal_idx" ON "review_comments" USING btree ("deal_id","created_at");--> statement-breakpoint
CREATE INDEX "sponsor_contacts_sponsor_idx" ON "sponsor_contacts" USING btree ("sponsor_id");--> statement-breakpoint
ALTER TABLE "guest_links" ADD CONSTRAINT "guest_links_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliverables" DROP COLUMN "segment_id";--> statement-breakpoint
ALTER TABLE "deliverables" DROP COLUMN "window_start_seconds";--> statement-breakpoint
ALTER TABLE "deliverables" DROP COLUMN "window_end_seconds";--> statement-breakpoint
ALTER TABLE "deliverables" DROP COLUMN "min_seconds";--> statement-breakpoint
ALTER TABLE "deliverables" DROP COLUMN "max_seconds";--> statement-breakpoint
ALTER TABLE "deliverables" DROP COLUMN "disclosure_required";--> statement-breakpoint
ALTER TABLE "deliverables" DROP COLUMN "disclosure_text";--> statement-breakpoint
ALTER TABLE "deliverables" DROP COLUMN "link_url";--> statement-breakpoint
ALTER TABLE "deliverables" DROP COLUMN "credit_text";--> statement-breakpoint
ALTER TABLE "deliverables" DROP COLUMN "review_status";--> statement-breakpoint
ALTER TABLE "deliverables" DROP COLUMN "review_note";--> statement-breakpoint
ALTER TABLE "deliverables" DROP COLUMN "reviewed_at";