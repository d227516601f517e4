-- Revisions are immutable (0002): a TRUNCATE skips row triggers, so it gets its own statement-level trigger.
-- It also fires when revisions are truncated through a CASCADE from designs or labs. Deleting a design or lab
-- row by row still cascades as before.
CREATE OR REPLACE FUNCTION revisions_no_truncate() RETURNS trigger AS $$
BEGIN
  RAISE EXCEPTION 'revisions are immutable and cannot be truncated: delete the designs or labs they belong to instead'
    USING ERRCODE = 'integrity_constraint_violation';
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER revisions_no_truncate BEFORE TRUNCATE ON revisions
  FOR EACH STATEMENT EXECUTE FUNCTION revisions_no_truncate();
