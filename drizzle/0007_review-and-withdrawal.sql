CREATE TYPE "public"."review_decision" AS ENUM('submitted', 'returned', 'approved');--> statement-breakpoint
CREATE TABLE "brief_reviews" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"brief_id" uuid NOT NULL,
	"decision" "review_decision" NOT NULL,
	"comment" text,
	"content_sha256" text NOT NULL,
	"actor_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "briefs" ADD COLUMN "withdrawn_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "briefs" ADD COLUMN "withdrawal_reason" text;--> statement-breakpoint
ALTER TABLE "brief_reviews" ADD CONSTRAINT "brief_reviews_brief_id_briefs_id_fk" FOREIGN KEY ("brief_id") REFERENCES "public"."briefs"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "brief_reviews" ADD CONSTRAINT "brief_reviews_actor_id_people_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."people"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "brief_reviews_brief_idx" ON "brief_reviews" USING btree ("brief_id","created_at");