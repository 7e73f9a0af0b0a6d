-- Hand-written: a release's signatures and waivers are permanent (as study signatures are, 0003), and every
-- release table moves its laboratory's change counter (0012), so no cached answer outlives a change to them.
CREATE TRIGGER release_signatures_append_only BEFORE UPDATE OR DELETE ON release_signatures
  FOR EACH ROW EXECUTE FUNCTION parallax_refuse_signature_change();
--> statement-breakpoint
CREATE OR REPLACE FUNCTION parallax_refuse_waiver_change() RETURNS trigger AS $$
BEGIN
  RAISE EXCEPTION 'waivers are permanent: % refused', TG_OP USING ERRCODE = 'insufficient_privilege';
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER release_waivers_append_only BEFORE UPDATE OR DELETE ON release_waivers
  FOR EACH ROW EXECUTE FUNCTION parallax_refuse_waiver_change();
--> statement-breakpoint
SELECT parallax_version_triggers(t, 'parallax_note_by_laboratory_id')
  FROM unnest(ARRAY['release_templates', 'releases', 'release_studies', 'release_waivers', 'release_signatures', 'due_items', 'due_reminders']) t;
