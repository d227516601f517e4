-- Revisions stay immutable (0002), with one exception: a large chip's revision is saved with a pending summary
-- (`"pending": true`, the cheap parts only) that the revision-summary job fills in once. A summary that is not
-- pending never changes, and the filled-in one may not be pending again.
CREATE OR REPLACE FUNCTION revisions_immutable() RETURNS trigger AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    IF pg_trigger_depth() > 1 THEN RETURN OLD; END IF; -- a cascade from deleting the design or lab
    RAISE EXCEPTION 'revision % is immutable and cannot be deleted', OLD.id USING ERRCODE = 'integrity_constraint_violation';
  END IF;
  IF NEW.document IS DISTINCT FROM OLD.document OR NEW.message IS DISTINCT FROM OLD.message
     OR NEW.number IS DISTINCT FROM OLD.number OR NEW.parent_id IS DISTINCT FROM OLD.parent_id
     OR NEW.author_id IS DISTINCT FROM OLD.author_id OR NEW.design_id IS DISTINCT FROM OLD.design_id
     OR NEW.lab_id IS DISTINCT FROM OLD.lab_id
     OR (NEW.summary IS DISTINCT FROM OLD.summary AND (NOT (OLD.summary ? 'pending') OR NEW.summary ? 'pending'))
     OR NEW.created_at IS DISTINCT FROM OLD.created_at THEN
    RAISE EXCEPTION 'revision % is immutable: save a new revision instead', OLD.id USING ERRCODE = 'integrity_constraint_violation';
  END IF;
  RETURN NEW;
END;
$$ LANGUAGE plpgsql;
