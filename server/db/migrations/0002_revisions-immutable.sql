-- Revisions are immutable: their content never changes and they are never deleted one by one.
-- Only the workflow status (who moved it, when) may change. Deleting a whole design or lab still cascades.
CREATE OR REPLACE FUNCTION revisions_immutable() RETURNS trigger AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    IF pg_trigger_depth() > 1 THEN RETURN OLD; END IF; -- a cascade from deleting the design or lab
    RAISE EXCEPTION 'revision % is immutable and cannot be deleted', OLD.id USING ERRCODE = 'integrity_constraint_violation';
  END IF;
  IF NEW.document IS DISTINCT FROM OLD.document OR NEW.message IS DISTINCT FROM OLD.message
     OR NEW.number IS DISTINCT FROM OLD.number OR NEW.parent_id IS DISTINCT FROM OLD.parent_id
     OR NEW.author_id IS DISTINCT FROM OLD.author_id OR NEW.design_id IS DISTINCT FROM OLD.design_id
     OR NEW.lab_id IS DISTINCT FROM OLD.lab_id OR NEW.summary IS DISTINCT FROM OLD.summary
     OR NEW.created_at IS DISTINCT FROM OLD.created_at THEN
    RAISE EXCEPTION 'revision % is immutable: save a new revision instead', OLD.id USING ERRCODE = 'integrity_constraint_violation';
  END IF;
  RETURN NEW;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER revisions_immutable BEFORE UPDATE OR DELETE ON revisions
  FOR EACH ROW EXECUTE FUNCTION revisions_immutable();
