-- The pulse count stored with the checksum is part of what was approved: an approved
-- row keeps it unchanged, like every other column (same function as 0001, one more column).
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
       AND NEW.pulse_count IS NOT DISTINCT FROM OLD.pulse_count
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
