-- Hand-written: history checkpoints are append-only, like the events they mark. UPDATE, DELETE and
-- TRUNCATE are refused by the database; an owner who disables the trigger still cannot forge the
-- key-signed mark, and the copy kept in the server's key folder shows a removed one.
CREATE TRIGGER audit_checkpoints_no_update BEFORE UPDATE OR DELETE ON audit_checkpoints
  FOR EACH ROW EXECUTE FUNCTION parallax_refuse_audit_change();
--> statement-breakpoint
CREATE TRIGGER audit_checkpoints_no_truncate BEFORE TRUNCATE ON audit_checkpoints
  FOR EACH STATEMENT EXECUTE FUNCTION parallax_refuse_audit_change();
