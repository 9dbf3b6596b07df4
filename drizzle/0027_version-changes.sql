-- What changed since the version before, computed when a version is frozen (server/core/snapshot/changes.ts).
ALTER TABLE "brief_versions" ADD COLUMN "changes" jsonb;
--> statement-breakpoint
-- A version stays frozen. Two exceptions: while embargoed, its release time may move (migration 0012);
-- and a version frozen before this column existed may have its changes filled in once, nothing else.
CREATE OR REPLACE FUNCTION refuse_frozen_version_change() RETURNS trigger AS $$
BEGIN
  IF TG_OP = 'UPDATE'
    AND NEW.id = OLD.id AND NEW.brief_id = OLD.brief_id AND NEW.number = OLD.number
    AND NEW.note IS NOT DISTINCT FROM OLD.note AND NEW.created_by IS NOT DISTINCT FROM OLD.created_by
    AND NEW.created_at = OLD.created_at THEN
    IF OLD.release_at > now() AND NEW.release_at > now()
      AND NEW.changes IS NOT DISTINCT FROM OLD.changes
      AND (NEW.snapshot - 'releaseAt') = (OLD.snapshot - 'releaseAt') THEN
      RETURN NEW;
    END IF;
    IF OLD.changes IS NULL AND NEW.changes IS NOT NULL
      AND NEW.release_at = OLD.release_at AND NEW.snapshot = OLD.snapshot THEN
      RETURN NEW;
    END IF;
  END IF;
  RAISE EXCEPTION 'version % of brief % is frozen and cannot be changed', OLD.number, OLD.brief_id
    USING ERRCODE = 'integrity_constraint_violation';
END
$$ LANGUAGE plpgsql;
