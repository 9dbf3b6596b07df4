ALTER TABLE "briefs" ADD COLUMN "lay_summary" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "briefs" ADD COLUMN "key_messages" text DEFAULT '' NOT NULL;