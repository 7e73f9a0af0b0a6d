-- Hand-written: the input hash stored on a study (0006) can never outlive the rows and settings it
-- summarises. Any change to a study's rows, settings or kind that does not write a new hash clears it,
-- whatever code made the change; a cleared hash is computed again from the rows on the next read.
CREATE OR REPLACE FUNCTION parallax_forget_input_hash_of_rows() RETURNS trigger AS $$
BEGIN
  IF TG_OP IN ('UPDATE', 'DELETE') THEN
    UPDATE studies SET input_hash = NULL, included_count = NULL
     WHERE input_hash IS NOT NULL AND id IN (SELECT DISTINCT study_id FROM old_rows);
  END IF;
  IF TG_OP IN ('UPDATE', 'INSERT') THEN
    UPDATE studies SET input_hash = NULL, included_count = NULL
     WHERE input_hash IS NOT NULL AND id IN (SELECT DISTINCT study_id FROM new_rows);
  END IF;
  RETURN NULL;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER specimens_forget_input_hash_insert AFTER INSERT ON specimens
  REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION parallax_forget_input_hash_of_rows();
--> statement-breakpoint
CREATE TRIGGER specimens_forget_input_hash_update AFTER UPDATE ON specimens
  REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION parallax_forget_input_hash_of_rows();
--> statement-breakpoint
CREATE TRIGGER specimens_forget_input_hash_delete AFTER DELETE ON specimens
  REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION parallax_forget_input_hash_of_rows();
--> statement-breakpoint
CREATE OR REPLACE FUNCTION parallax_forget_input_hash_of_settings() RETURNS trigger AS $$
BEGIN
  IF (NEW.settings IS DISTINCT FROM OLD.settings OR NEW.kind IS DISTINCT FROM OLD.kind)
     AND NEW.input_hash IS NOT DISTINCT FROM OLD.input_hash THEN
    NEW.input_hash := NULL;
    NEW.included_count := NULL;
  END IF;
  RETURN NEW;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER studies_forget_input_hash BEFORE UPDATE ON studies
  FOR EACH ROW EXECUTE FUNCTION parallax_forget_input_hash_of_settings();
--> statement-breakpoint
-- A signed study stays unchangeable, but its input hash may be filled in once where it was not yet known.
CREATE OR REPLACE FUNCTION parallax_refuse_signed_study_change() RETURNS trigger AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    IF OLD.state = 'signed' THEN
      RAISE EXCEPTION 'study % is signed and cannot be deleted', OLD.id USING ERRCODE = 'insufficient_privilege';
    END IF;
    RETURN OLD;
  END IF;
  IF OLD.state = 'signed' AND (
       (to_jsonb(NEW) - 'superseded_by_id' - 'input_hash' - 'included_count') IS DISTINCT FROM (to_jsonb(OLD) - 'superseded_by_id' - 'input_hash' - 'included_count')
       OR (OLD.input_hash IS NOT NULL AND (NEW.input_hash IS DISTINCT FROM OLD.input_hash OR NEW.included_count IS DISTINCT FROM OLD.included_count))) THEN
    RAISE EXCEPTION 'study % is signed and cannot be changed', OLD.id USING ERRCODE = 'insufficient_privilege';
  END IF;
  RETURN NEW;
END;
$$ LANGUAGE plpgsql;
