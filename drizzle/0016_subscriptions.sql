-- Readers' topic subscriptions: double opt-in, one-click unsubscribe (docs/decisions/0022-subscriptions.md).
CREATE TABLE "subscriptions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"topic_slug" text NOT NULL,
	"locale" text DEFAULT 'en' NOT NULL,
	"confirm_token_hash" text,
	"confirm_by" timestamp with time zone,
	"unsubscribe_token" text NOT NULL,
	"confirmed_at" timestamp with time zone,
	"unsubscribed_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "subscriptions_confirm_token_hash_unique" UNIQUE("confirm_token_hash"),
	CONSTRAINT "subscriptions_unsubscribe_token_unique" UNIQUE("unsubscribe_token")
);
--> statement-breakpoint
CREATE UNIQUE INDEX "subscriptions_email_topic_idx" ON "subscriptions" USING btree ("email","topic_slug");
