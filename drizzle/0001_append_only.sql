-- Versions are append-only: the document, the result and their fingerprints never change,
-- and an approval is recorded once.
CREATE TRIGGER `budget_versions_no_rewrite` BEFORE UPDATE ON `budget_versions`
WHEN OLD.document IS NOT NEW.document OR OLD.result IS NOT NEW.result
  OR OLD.document_sha256 IS NOT NEW.document_sha256 OR OLD.engine_version IS NOT NEW.engine_version
  OR OLD.seed IS NOT NEW.seed OR OLD.number IS NOT NEW.number OR OLD.budget_id IS NOT NEW.budget_id
  OR OLD.author_id IS NOT NEW.author_id OR OLD.created_at IS NOT NEW.created_at OR OLD.note IS NOT NEW.note
  OR (OLD.approved_at IS NOT NULL AND (OLD.approved_at IS NOT NEW.approved_at OR OLD.approved_by IS NOT NEW.approved_by))
BEGIN
  SELECT RAISE(ABORT, 'budget versions are append-only');
END;
--> statement-breakpoint
CREATE TRIGGER `budget_versions_no_delete` BEFORE DELETE ON `budget_versions`
BEGIN
  SELECT RAISE(ABORT, 'budget versions are append-only');
END;
--> statement-breakpoint
CREATE TRIGGER `audit_events_no_update` BEFORE UPDATE ON `audit_events`
BEGIN
  SELECT RAISE(ABORT, 'the audit trail is append-only');
END;
--> statement-breakpoint
CREATE TRIGGER `audit_events_no_delete` BEFORE DELETE ON `audit_events`
BEGIN
  SELECT RAISE(ABORT, 'the audit trail is append-only');
END;
