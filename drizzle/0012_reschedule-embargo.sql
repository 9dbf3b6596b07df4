-- A version stays frozen, with one exception: while it is still embargoed, an editor may move its
-- release time to another time in the future (docs/decisions/0007-frozen-versions.md). Nothing else
-- of the row may change, and the snapshot may differ only in its releaseAt.
CREATE OR REPLACE FUNCTION refuse_frozen_version_change() RETURNS trigger AS $$
BEGIN
  IF TG_OP = 'UPDATE'
    AND OLD.release_at > now() AND NEW.release_at > now()
    AND NEW.id = OLD.id AND NEW.brief_id = OLD.brief_id AND NEW.number = OLD.number
    AND NEW.note IS NOT DISTINCT FROM OLD.note AND NEW.created_by IS NOT DISTINCT FROM OLD.created_by
    AND NEW.created_at = OLD.created_at
    AND (NEW.snapshot - 'releaseAt') = (OLD.snapshot - 'releaseAt') THEN
    RETURN NEW;
  END IF;
  RAISE EXCEPTION 'version % of brief % is frozen and cannot be changed', OLD.number, OLD.brief_id
    USING ERRCODE = 'integrity_constraint_violation';
END
$$ LANGUAGE plpgsql;
