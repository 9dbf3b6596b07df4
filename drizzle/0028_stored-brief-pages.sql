-- The parts of a version's page rendered once per language and build (server/web/pages/stored-brief.ts).
CREATE TABLE "version_renderings" (
	"version_id" uuid NOT NULL,
	"locale" text NOT NULL,
	"build" text NOT NULL,
	"state" text NOT NULL,
	"page" json NOT NULL,
	"outcomes_html" text NOT NULL,
	"rendered_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "version_renderings_version_id_locale_pk" PRIMARY KEY("version_id","locale")
);
--> statement-breakpoint
ALTER TABLE "version_renderings" ADD CONSTRAINT "version_renderings_version_id_brief_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."brief_versions"("id") ON DELETE cascade ON UPDATE no action;