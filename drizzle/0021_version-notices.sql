-- Every server process keeps released pages in memory and checks each against its version's public
-- state (newer versions, withdrawal, translations). A change to that state is announced on the
-- channel fairweigh_versions with the brief's slug, so that every process forgets what it remembered
-- at once, whichever process made the change (server/db/notices.ts). Notices are delivered on commit.
CREATE FUNCTION fairweigh_announce_version_change() RETURNS trigger AS $$
DECLARE
  changed_slug text;
BEGIN
  IF TG_TABLE_NAME = 'briefs' THEN
    changed_slug := NEW.slug;
  ELSIF TG_TABLE_NAME = 'brief_versions' THEN
    SELECT slug INTO changed_slug FROM briefs WHERE id = NEW.brief_id;
  ELSE
    SELECT b.slug INTO changed_slug FROM brief_versions v JOIN briefs b ON b.id = v.brief_id WHERE v.id = NEW.version_id;
  END IF;
  PERFORM pg_notify('fairweigh_versions', changed_slug);
  RETURN NULL;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER briefs_announce_withdrawal AFTER UPDATE OF withdrawn_at ON briefs
  FOR EACH ROW WHEN (OLD.withdrawn_at IS DISTINCT FROM NEW.withdrawn_at) EXECUTE FUNCTION fairweigh_announce_version_change();
--> statement-breakpoint
CREATE TRIGGER brief_versions_announce AFTER INSERT OR UPDATE ON brief_versions
  FOR EACH ROW EXECUTE FUNCTION fairweigh_announce_version_change();
--> statement-breakpoint
CREATE TRIGGER version_translations_announce AFTER UPDATE OF published_at ON version_translations
  FOR EACH ROW WHEN (OLD.published_at IS DISTINCT FROM NEW.published_at) EXECUTE FUNCTION fairweigh_announce_version_change();
