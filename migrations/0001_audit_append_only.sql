-- Hand-written: audit events are append-only. UPDATE, DELETE and TRUNCATE are refused by the database
-- itself, so no code path (and no hand-typed SQL short of disabling the trigger as the owner) can
-- rewrite history. The hash chain makes even that detectable.
CREATE OR REPLACE FUNCTION parallax_refuse_audit_change() RETURNS trigger AS $$
BEGIN
  RAISE EXCEPTION 'audit events are append-only: % refused', TG_OP USING ERRCODE = 'insufficient_privilege';
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER audit_events_no_update BEFORE UPDATE OR DELETE ON audit_events
  FOR EACH ROW EXECUTE FUNCTION parallax_refuse_audit_change();
--> statement-breakpoint
CREATE TRIGGER audit_events_no_truncate BEFORE TRUNCATE ON audit_events
  FOR EACH STATEMENT EXECUTE FUNCTION parallax_refuse_audit_change();
