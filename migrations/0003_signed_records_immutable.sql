-- Hand-written: once a study is signed, the database itself refuses to change it, its rows, its
-- analyses, its uploads or its signatures, whatever the application does. The only change allowed
-- on a signed study is recording which amendment supersedes it. Signatures are append-only.
CREATE OR REPLACE FUNCTION parallax_refuse_signed_study_change() RETURNS trigger AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    IF OLD.state = 'signed' THEN
      RAISE EXCEPTION 'study % is signed and cannot be deleted', OLD.id USING ERRCODE = 'insufficient_privilege';
    END IF;
    RETURN OLD;
  END IF;
  IF OLD.state = 'signed' AND (to_jsonb(NEW) - 'superseded_by_id') IS DISTINCT FROM (to_jsonb(OLD) - 'superseded_by_id') THEN
    RAISE EXCEPTION 'study % is signed and cannot be changed', OLD.id USING ERRCODE = 'insufficient_privilege';
  END IF;
  RETURN NEW;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER studies_signed_immutable BEFORE UPDATE OR DELETE ON studies
  FOR EACH ROW EXECUTE FUNCTION parallax_refuse_signed_study_change();
--> statement-breakpoint
CREATE OR REPLACE FUNCTION parallax_refuse_child_of_signed() RETURNS trigger AS $$
DECLARE
  sid integer;
BEGIN
  IF TG_OP = 'DELETE' THEN sid := OLD.study_id; ELSE sid := NEW.study_id; END IF;
  IF EXISTS (SELECT 1 FROM studies WHERE id = sid AND state = 'signed')
     OR (TG_OP <> 'INSERT' AND EXISTS (SELECT 1 FROM studies WHERE id = OLD.study_id AND state = 'signed')) THEN
    RAISE EXCEPTION '% of signed study % refused on %', TG_OP, sid, TG_TABLE_NAME USING ERRCODE = 'insufficient_privilege';
  END IF;
  IF TG_OP = 'DELETE' THEN RETURN OLD; END IF;
  RETURN NEW;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER specimens_signed_immutable BEFORE INSERT OR UPDATE OR DELETE ON specimens
  FOR EACH ROW EXECUTE FUNCTION parallax_refuse_child_of_signed();
--> statement-breakpoint
CREATE TRIGGER analyses_signed_immutable BEFORE INSERT OR UPDATE OR DELETE ON analyses
  FOR EACH ROW EXECUTE FUNCTION parallax_refuse_child_of_signed();
--> statement-breakpoint
CREATE TRIGGER uploads_signed_immutable BEFORE UPDATE OR DELETE ON uploads
  FOR EACH ROW EXECUTE FUNCTION parallax_refuse_child_of_signed();
--> statement-breakpoint
CREATE OR REPLACE FUNCTION parallax_refuse_signature_change() RETURNS trigger AS $$
BEGIN
  RAISE EXCEPTION 'signatures are permanent: % refused', TG_OP USING ERRCODE = 'insufficient_privilege';
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER signatures_append_only BEFORE UPDATE OR DELETE ON signatures
  FOR EACH ROW EXECUTE FUNCTION parallax_refuse_signature_change();
