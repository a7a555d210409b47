-- A frozen layout version is the record of what a customer approved and what
-- was cut: no route may change it, and neither may a mistaken query.
CREATE FUNCTION refuse_frozen_version_change() RETURNS trigger AS $$
BEGIN
  RAISE EXCEPTION 'layout version % is frozen and cannot be changed', OLD.id
    USING ERRCODE = 'integrity_constraint_violation';
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER layout_versions_frozen
  BEFORE UPDATE ON layout_versions
  FOR EACH ROW EXECUTE FUNCTION refuse_frozen_version_change();
