-- A published version is frozen: no route may change it, and neither may anything else.
CREATE FUNCTION refuse_frozen_version_change() RETURNS trigger AS $$
BEGIN
  RAISE EXCEPTION 'version % of brief % is frozen and cannot be changed', OLD.number, OLD.brief_id
    USING ERRCODE = 'integrity_constraint_violation';
END
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER brief_versions_frozen
  BEFORE UPDATE OR DELETE ON brief_versions
  FOR EACH ROW EXECUTE FUNCTION refuse_frozen_version_change();
