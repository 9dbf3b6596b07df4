-- How a sentence names each treatment and its grammatical number, so that statements agree with real
-- names (server/core/languages/grammar.ts). Existing names keep reading as before: no phrase, singular.
ALTER TABLE "treatment_names" ADD COLUMN "phrase" text;--> statement-breakpoint
ALTER TABLE "treatment_names" ADD COLUMN "number" text DEFAULT 'singular' NOT NULL;--> statement-breakpoint
ALTER TABLE "treatment_names" ADD CONSTRAINT "treatment_names_number" CHECK ("treatment_names"."number" in ('singular', 'plural'));