CREATE TABLE "pending_uploads" (
	"key" text PRIMARY KEY NOT NULL,
	"channel_id" uuid NOT NULL,
	"purpose" text NOT NULL,
	"content_type" text NOT NULL,
	"size_bytes" bigint NOT NULL,
	"created_by" uuid,
	"used_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "mail_messages" ADD COLUMN "channel_id" uuid;--> statement-breakpoint
ALTER TABLE "mail_messages" ADD COLUMN "kind" text;--> statement-breakpoint
ALTER TABLE "mail_messages" ADD COLUMN "ref_id" uuid;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "session_version" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "pending_uploads" ADD CONSTRAINT "pending_uploads_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pending_uploads" ADD CONSTRAINT "pending_uploads_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "pending_uploads_channel_idx" ON "pending_uploads" USING btree ("channel_id","purpose");--> statement-breakpoint
CREATE INDEX "mail_messages_channel_idx" ON "mail_messages" USING btree ("channel_id","kind");