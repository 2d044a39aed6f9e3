-- Approved protocol versions are immutable, enforced here so that no code path (or psql
-- session) can change what a safety officer signed off. The only allowed change of an
-- approved row is withdrawing it, with every other column untouched.
CREATE OR REPLACE FUNCTION pulseloom_guard_protocol_version() RETURNS trigger AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    IF OLD.status IN ('approved', 'in_review', 'withdrawn') THEN
      RAISE EXCEPTION 'protocol version % is % and cannot be deleted', OLD.id, OLD.status
        USING ERRCODE = 'integrity_constraint_violation';
    END IF;
    RETURN OLD;
  END IF;

  IF OLD.status = 'approved' THEN
    IF NEW.status = 'withdrawn'
       AND NEW.spec = OLD.spec
       AND NEW.lab_id = OLD.lab_id
       AND NEW.protocol_id = OLD.protocol_id
       AND NEW.number = OLD.number
       AND NEW.rig_id IS NOT DISTINCT FROM OLD.rig_id
       AND NEW.checksum IS NOT DISTINCT FROM OLD.checksum
       AND NEW.approved_checksum IS NOT DISTINCT FROM OLD.approved_checksum
       AND NEW.decided_by IS NOT DISTINCT FROM OLD.decided_by
       AND NEW.decided_at IS NOT DISTINCT FROM OLD.decided_at
       AND NEW.author_id IS NOT DISTINCT FROM OLD.author_id THEN
      RETURN NEW;
    END IF;
    RAISE EXCEPTION 'protocol version % is approved and immutable', OLD.id
      USING ERRCODE = 'integrity_constraint_violation';
  END IF;

  IF OLD.status = 'withdrawn' THEN
    RAISE EXCEPTION 'protocol version % is withdrawn and immutable', OLD.id
      USING ERRCODE = 'integrity_constraint_violation';
  END IF;

  -- Submitting freezes the spec: only drafts may change what they would deliver.
  IF OLD.status <> 'draft' AND (NEW.spec <> OLD.spec OR NEW.rig_id IS DISTINCT FROM OLD.rig_id) THEN
    RAISE EXCEPTION 'protocol version % is % and its spec is frozen', OLD.id, OLD.status
      USING ERRCODE = 'integrity_constraint_violation';
  END IF;

  -- An approval must carry the checksum it approved.
  IF NEW.status = 'approved' AND (NEW.approved_checksum IS NULL OR NEW.approved_checksum IS DISTINCT FROM NEW.checksum) THEN
    RAISE EXCEPTION 'approval of % must record the schedule checksum', OLD.id
      USING ERRCODE = 'integrity_constraint_violation';
  END IF;

  RETURN NEW;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER protocol_versions_guard
  BEFORE UPDATE OR DELETE ON protocol_versions
  FOR EACH ROW EXECUTE FUNCTION pulseloom_guard_protocol_version();
--> statement-breakpoint
-- The audit log is append-only.
CREATE OR REPLACE FUNCTION pulseloom_audit_append_only() RETURNS trigger AS $$
BEGIN
  RAISE EXCEPTION 'audit_log is append-only (% refused)', TG_OP
    USING ERRCODE = 'integrity_constraint_violation';
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER audit_log_no_update_delete
  BEFORE UPDATE OR DELETE ON audit_log
  FOR EACH ROW EXECUTE FUNCTION pulseloom_audit_append_only();
--> statement-breakpoint
CREATE TRIGGER audit_log_no_truncate
  BEFORE TRUNCATE ON audit_log
  FOR EACH STATEMENT EXECUTE FUNCTION pulseloom_audit_append_only();
