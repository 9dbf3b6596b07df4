-- Whether an outcome measures a harm, so that its groups speak of harm (METHODS.md §10). Existing
-- outcomes read as before: benefits.
ALTER TABLE "outcomes" ADD COLUMN "measures_harm" boolean DEFAULT false NOT NULL;