-- Two fields take the product's own names (docs/decisions/0034-product-names.md): the brief's author
-- is its author team, and the editor's short text is the short take. The data stay as they were.
ALTER TABLE "briefs" RENAME COLUMN "review_group" TO "author_team";
--> statement-breakpoint
ALTER TABLE "briefs" RENAME COLUMN "key_messages" TO "short_take";
--> statement-breakpoint
-- Translations name their fields; the short take's translation moves to its new name, in the
-- translator's working copy and in what readers see.
UPDATE "version_translations" SET "fields" = ("fields" - 'keyMessages') || jsonb_build_object('shortTake', "fields" -> 'keyMessages')
  WHERE "fields" ? 'keyMessages';
--> statement-breakpoint
UPDATE "version_translations" SET "published_fields" = ("published_fields" - 'keyMessages') || jsonb_build_object('shortTake', "published_fields" -> 'keyMessages')
  WHERE "published_fields" ? 'keyMessages';
