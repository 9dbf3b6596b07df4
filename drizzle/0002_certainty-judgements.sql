CREATE TABLE "certainty_judgements" (
	"outcome_id" uuid NOT NULL,
	"treatment" text NOT NULL,
	"comparator" text NOT NULL,
	"judgement" jsonb NOT NULL,
	"updated_by" uuid,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "certainty_judgements_outcome_id_treatment_comparator_pk" PRIMARY KEY("outcome_id","treatment","comparator")
);
--> statement-breakpoint
ALTER TABLE "certainty_judgements" ADD CONSTRAINT "certainty_judgements_outcome_id_outcomes_id_fk" FOREIGN KEY ("outcome_id") REFERENCES "public"."outcomes"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "certainty_judgements" ADD CONSTRAINT "certainty_judgements_updated_by_people_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."people"("id") ON DELETE no action ON UPDATE no action;