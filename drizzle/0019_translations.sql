-- A version's texts per language, beside its frozen snapshot (docs/decisions/0025-translations-of-frozen-versions.md).
CREATE TABLE "version_translations" (
	"version_id" uuid NOT NULL,
	"locale" text NOT NULL,
	"state" text NOT NULL,
	"fields" jsonb NOT NULL,
	"published_fields" jsonb,
	"published_at" timestamp with time zone,
	"updated_by" uuid,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "version_translations_version_id_locale_pk" PRIMARY KEY("version_id","locale"),
	CONSTRAINT "version_translations_locale" CHECK ("version_translations"."locale" in ('es', 'fr', 'ar')),
	CONSTRAINT "version_translations_state" CHECK ("version_translations"."state" in ('draft', 'ready', 'published'))
);
--> statement-breakpoint
ALTER TABLE "version_translations" ADD CONSTRAINT "version_translations_version_id_brief_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."brief_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "version_translations" ADD CONSTRAINT "version_translations_updated_by_people_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."people"("id") ON DELETE no action ON UPDATE no action;