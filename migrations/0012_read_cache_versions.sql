-- Hand-written: each laboratory's change counter (laboratory_versions, 0011) moves forward with every
-- committed change to a row of that laboratory, whatever code (or hand-typed SQL) made it. The API's read
-- cache (server/http/read-cache.ts) keys answers by it, so an answer is never served after a change it
-- does not show.
--
-- How: on every covered table, statement-level AFTER triggers (immediate, no lock) note which laboratories
-- the statement touched in a transaction-local setting; a row-level constraint trigger, DEFERRABLE INITIALLY
-- DEFERRED, runs at commit and moves the noted laboratories' counters forward, in laboratory order, once.
--
-- Why at commit: the counter row is locked from its update to the end of the transaction. Taken at commit,
-- it is the last lock a writing transaction takes, and the holder waits for nothing after it, so it cannot
-- close a cycle with the locks the code takes before (the audit chain's advisory lock 7001, a study's row
-- lock, the outbox's row lock): a writer that waits for it holds its other locks only until the holder
-- commits, which it always does. Two laboratories in one transaction are moved in id order, so two such
-- transactions cannot deadlock on each other either. Had the counter been moved by the first write instead,
-- a transaction holding it and then asking for the chain lock (a change followed by recordAudit) could
-- deadlock with one holding the chain lock and then writing its event (recordAudit first).
--
-- Covered: every table whose rows an answer can show. A row maps to its laboratory by laboratory_id, by its
-- study (specimens, analyses, signatures), by its user (password_links), by the accounts of its recipients
-- (mail_messages), or is the laboratory (laboratories). Not covered, on purpose (the schema test
-- server/http/read-cache.spec.ts lists them with these reasons): session (read afresh by every
-- request before the cache is asked), sign_in_limits (keyed by address text, shown by no answer) and
-- laboratory_versions itself.
CREATE OR REPLACE FUNCTION parallax_note_laboratories(labs integer[]) RETURNS void AS $$
DECLARE
  noted text := coalesce(current_setting('parallax.changed_laboratories', true), '');
BEGIN
  IF labs IS NULL OR cardinality(labs) = 0 THEN RETURN; END IF;
  PERFORM set_config('parallax.changed_laboratories',
    array_to_string(ARRAY(SELECT DISTINCT x FROM unnest(labs || string_to_array(nullif(noted, ''), ',')::int[]) x WHERE x IS NOT NULL ORDER BY x), ','),
    true);
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
-- Moves the noted laboratories' counters forward (in id order) and forgets them.
CREATE OR REPLACE FUNCTION parallax_bump_noted_laboratories() RETURNS void AS $$
DECLARE
  noted text := current_setting('parallax.changed_laboratories', true);
BEGIN
  IF noted IS NULL OR noted = '' THEN RETURN; END IF;
  PERFORM set_config('parallax.changed_laboratories', '', true);
  INSERT INTO laboratory_versions AS v (laboratory_id, version)
    SELECT x, 1 FROM unnest(string_to_array(noted, ',')::int[]) x ORDER BY x
    ON CONFLICT (laboratory_id) DO UPDATE SET version = v.version + 1;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION parallax_bump_at_commit() RETURNS trigger AS $$
BEGIN
  PERFORM parallax_bump_noted_laboratories();
  RETURN NULL;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
-- TRUNCATE has no rows to map: every laboratory moves, at once.
CREATE OR REPLACE FUNCTION parallax_bump_all_laboratories() RETURNS trigger AS $$
BEGIN
  PERFORM parallax_note_laboratories(ARRAY(SELECT id FROM laboratories));
  PERFORM parallax_bump_noted_laboratories();
  RETURN NULL;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION parallax_note_by_laboratory_id() RETURNS trigger AS $$
BEGIN
  IF TG_OP IN ('UPDATE', 'DELETE') THEN
    PERFORM parallax_note_laboratories(ARRAY(SELECT DISTINCT laboratory_id FROM old_rows));
  END IF;
  IF TG_OP IN ('UPDATE', 'INSERT') THEN
    PERFORM parallax_note_laboratories(ARRAY(SELECT DISTINCT laboratory_id FROM new_rows));
  END IF;
  RETURN NULL;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION parallax_note_by_id() RETURNS trigger AS $$
BEGIN
  IF TG_OP IN ('UPDATE', 'DELETE') THEN
    PERFORM parallax_note_laboratories(ARRAY(SELECT id FROM old_rows));
  END IF;
  IF TG_OP IN ('UPDATE', 'INSERT') THEN
    PERFORM parallax_note_laboratories(ARRAY(SELECT id FROM new_rows));
  END IF;
  RETURN NULL;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION parallax_note_by_study() RETURNS trigger AS $$
BEGIN
  IF TG_OP IN ('UPDATE', 'DELETE') THEN
    PERFORM parallax_note_laboratories(ARRAY(SELECT DISTINCT s.laboratory_id FROM studies s WHERE s.id IN (SELECT study_id FROM old_rows)));
  END IF;
  IF TG_OP IN ('UPDATE', 'INSERT') THEN
    PERFORM parallax_note_laboratories(ARRAY(SELECT DISTINCT s.laboratory_id FROM studies s WHERE s.id IN (SELECT study_id FROM new_rows)));
  END IF;
  RETURN NULL;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION parallax_note_by_user() RETURNS trigger AS $$
BEGIN
  IF TG_OP IN ('UPDATE', 'DELETE') THEN
    PERFORM parallax_note_laboratories(ARRAY(SELECT DISTINCT u.laboratory_id FROM users u WHERE u.id IN (SELECT user_id FROM old_rows)));
  END IF;
  IF TG_OP IN ('UPDATE', 'INSERT') THEN
    PERFORM parallax_note_laboratories(ARRAY(SELECT DISTINCT u.laboratory_id FROM users u WHERE u.id IN (SELECT user_id FROM new_rows)));
  END IF;
  RETURN NULL;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION parallax_note_by_recipients() RETURNS trigger AS $$
BEGIN
  IF TG_OP IN ('UPDATE', 'DELETE') THEN
    PERFORM parallax_note_laboratories(ARRAY(SELECT DISTINCT u.laboratory_id FROM users u WHERE u.email IN (SELECT unnest("to") FROM old_rows)));
  END IF;
  IF TG_OP IN ('UPDATE', 'INSERT') THEN
    PERFORM parallax_note_laboratories(ARRAY(SELECT DISTINCT u.laboratory_id FROM users u WHERE u.email IN (SELECT unnest("to") FROM new_rows)));
  END IF;
  RETURN NULL;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
-- The triggers of one covered table: three statement triggers that note (transition tables allow one event
-- each), one deferred row trigger that moves the counters at commit, one for TRUNCATE.
CREATE OR REPLACE FUNCTION parallax_version_triggers(tbl text, note text) RETURNS void AS $$
BEGIN
  EXECUTE format('CREATE TRIGGER %I AFTER INSERT ON %I REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION %I()',
                 tbl || '_note_version_insert', tbl, note);
  EXECUTE format('CREATE TRIGGER %I AFTER UPDATE ON %I REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION %I()',
                 tbl || '_note_version_update', tbl, note);
  EXECUTE format('CREATE TRIGGER %I AFTER DELETE ON %I REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION %I()',
                 tbl || '_note_version_delete', tbl, note);
  EXECUTE format('CREATE CONSTRAINT TRIGGER %I AFTER INSERT OR UPDATE OR DELETE ON %I DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION parallax_bump_at_commit()',
                 tbl || '_bump_version', tbl);
  EXECUTE format('CREATE TRIGGER %I AFTER TRUNCATE ON %I FOR EACH STATEMENT EXECUTE FUNCTION parallax_bump_all_laboratories()',
                 tbl || '_bump_version_truncate', tbl);
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
SELECT parallax_version_triggers('laboratories', 'parallax_note_by_id');
--> statement-breakpoint
SELECT parallax_version_triggers(t, 'parallax_note_by_laboratory_id')
  FROM unnest(ARRAY['users', 'analytes', 'instruments', 'studies', 'uploads', 'audit_events', 'audit_chain_heads', 'audit_checkpoints', 'mail_outbox']) t;
--> statement-breakpoint
SELECT parallax_version_triggers(t, 'parallax_note_by_study') FROM unnest(ARRAY['specimens', 'analyses', 'signatures']) t;
--> statement-breakpoint
SELECT parallax_version_triggers('password_links', 'parallax_note_by_user');
--> statement-breakpoint
SELECT parallax_version_triggers('mail_messages', 'parallax_note_by_recipients');
--> statement-breakpoint
INSERT INTO laboratory_versions (laboratory_id, version) SELECT id, 1 FROM laboratories ON CONFLICT DO NOTHING;
--> statement-breakpoint
-- A counter only grows: a version once used never names other content. Lowering, deleting or emptying
-- it is refused (a row is added by the first change of a new laboratory).
CREATE OR REPLACE FUNCTION parallax_refuse_version_rewind() RETURNS trigger AS $$
BEGIN
  IF TG_OP = 'UPDATE' THEN
    IF NEW.laboratory_id = OLD.laboratory_id AND NEW.version > OLD.version THEN
      RETURN NEW;
    END IF;
  END IF;
  RAISE EXCEPTION 'laboratory versions only grow: % refused', TG_OP USING ERRCODE = 'insufficient_privilege';
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER laboratory_versions_only_grow BEFORE UPDATE OR DELETE ON laboratory_versions
  FOR EACH ROW EXECUTE FUNCTION parallax_refuse_version_rewind();
--> statement-breakpoint
CREATE TRIGGER laboratory_versions_no_truncate BEFORE TRUNCATE ON laboratory_versions
  FOR EACH STATEMENT EXECUTE FUNCTION parallax_refuse_version_rewind();
