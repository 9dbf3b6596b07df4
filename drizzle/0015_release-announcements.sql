-- The time zone of a person's e-mails, and each version's release announced once.
CREATE TABLE "release_announcements" (
	"version_id" uuid PRIMARY KEY NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "people" ADD COLUMN "time_zone" text DEFAULT 'UTC' NOT NULL;--> statement-breakpoint
ALTER TABLE "release_announcements" ADD CONSTRAINT "release_announcements_version_id_brief_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."brief_versions"("id") ON DELETE no action ON UPDATE no action;
