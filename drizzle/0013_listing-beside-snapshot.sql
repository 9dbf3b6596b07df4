-- Lists, search and the feed read the brief's description and treatments beside each frozen snapshot
-- instead of the snapshot itself (docs/decisions/0019-listing-beside-the-snapshot.md). PostgreSQL
-- computes them from the snapshot, for existing versions too; a table rewrite fires no trigger, so the
-- versions stay frozen.
ALTER TABLE "brief_versions" ADD COLUMN "listed_brief" jsonb GENERATED ALWAYS AS (snapshot -> 'brief') STORED NOT NULL;--> statement-breakpoint
ALTER TABLE "brief_versions" ADD COLUMN "listed_treatments" jsonb GENERATED ALWAYS AS (snapshot -> 'treatments') STORED NOT NULL;
