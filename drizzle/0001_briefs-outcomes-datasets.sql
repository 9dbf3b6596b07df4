CREATE TYPE "public"."brief_status" AS ENUM('draft', 'in_review', 'scheduled', 'published', 'corrected', 'withdrawn');--> statement-breakpoint
CREATE TYPE "public"."dataset_format" AS ENUM('arm-binary', 'arm-continuous', 'contrast');--> statement-breakpoint
CREATE TYPE "public"."direction" AS ENUM('higher', 'lower');--> statement-breakpoint
CREATE TYPE "public"."effect_measure" AS ENUM('OR', 'RR', 'RD', 'MD');--> statement-breakpoint
CREATE TYPE "public"."model_kind" AS ENUM('fixed', 'random');--> statement-breakpoint
CREATE TYPE "public"."outcome_kind" AS ENUM('binary', 'continuous');--> statement-breakpoint
CREATE TABLE "analysis_results" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"outcome_id" uuid NOT NULL,
	"dataset_id" uuid NOT NULL,
	"engine_version" text NOT NULL,
	"input_checksum" text NOT NULL,
	"settings" jsonb NOT NULL,
	"result" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "briefs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"slug" text NOT NULL,
	"title" text NOT NULL,
	"topic" text NOT NULL,
	"condition" text NOT NULL,
	"population" text NOT NULL,
	"status" "brief_status" DEFAULT 'draft' NOT NULL,
	"row_version" integer DEFAULT 1 NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "briefs_slug_unique" UNIQUE("slug")
);
--> statement-breakpoint
CREATE TABLE "datasets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"outcome_id" uuid NOT NULL,
	"format" "dataset_format" NOT NULL,
	"file_name" text NOT NULL,
	"original" "bytea" NOT NULL,
	"sha256" text NOT NULL,
	"parsed" jsonb NOT NULL,
	"uploaded_by" uuid,
	"uploaded_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "outcomes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"brief_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"name" text NOT NULL,
	"kind" "outcome_kind" NOT NULL,
	"measure" "effect_measure" NOT NULL,
	"model" "model_kind" NOT NULL,
	"reference_treatment" text NOT NULL,
	"direction" "direction" NOT NULL,
	"baseline_risk" double precision,
	"unit" text,
	"threshold_small" double precision,
	"threshold_moderate" double precision,
	"threshold_large" double precision,
	"row_version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "treatment_names" (
	"brief_id" uuid NOT NULL,
	"label" text NOT NULL,
	"display_name" text NOT NULL,
	CONSTRAINT "treatment_names_brief_id_label_pk" PRIMARY KEY("brief_id","label")
);
--> statement-breakpoint
ALTER TABLE "analysis_results" ADD CONSTRAINT "analysis_results_outcome_id_outcomes_id_fk" FOREIGN KEY ("outcome_id") REFERENCES "public"."outcomes"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analysis_results" ADD CONSTRAINT "analysis_results_dataset_id_datasets_id_fk" FOREIGN KEY ("dataset_id") REFERENCES "public"."datasets"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "briefs" ADD CONSTRAINT "briefs_created_by_people_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."people"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "datasets" ADD CONSTRAINT "datasets_outcome_id_outcomes_id_fk" FOREIGN KEY ("outcome_id") REFERENCES "public"."outcomes"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "datasets" ADD CONSTRAINT "datasets_uploaded_by_people_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."people"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outcomes" ADD CONSTRAINT "outcomes_brief_id_briefs_id_fk" FOREIGN KEY ("brief_id") REFERENCES "public"."briefs"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "treatment_names" ADD CONSTRAINT "treatment_names_brief_id_briefs_id_fk" FOREIGN KEY ("brief_id") REFERENCES "public"."briefs"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "analysis_results_outcome_idx" ON "analysis_results" USING btree ("outcome_id","created_at");--> statement-breakpoint
CREATE INDEX "datasets_outcome_idx" ON "datasets" USING btree ("outcome_id","uploaded_at");