ALTER TABLE `audit_events` ADD `hash` text;--> statement-breakpoint
-- Every new event carries its chain hash; the hash of an event written before the chain existed
-- may be set once (the server seals them at start), and nothing else of an event ever changes.
DROP TRIGGER IF EXISTS `audit_events_no_update`;
--> statement-breakpoint
CREATE TRIGGER `audit_events_no_update` BEFORE UPDATE ON `audit_events`
WHEN OLD.hash IS NOT NULL OR NEW.hash IS NULL OR NEW.id IS NOT OLD.id OR NEW.at IS NOT OLD.at
  OR NEW.actor_id IS NOT OLD.actor_id OR NEW.action IS NOT OLD.action OR NEW.budget_id IS NOT OLD.budget_id
  OR NEW.version_number IS NOT OLD.version_number OR NEW.detail IS NOT OLD.detail
BEGIN
  SELECT RAISE(ABORT, 'the audit trail is append-only');
END;
--> statement-breakpoint
CREATE TRIGGER `audit_events_hash_required` BEFORE INSERT ON `audit_events`
WHEN NEW.hash IS NULL
BEGIN
  SELECT RAISE(ABORT, 'an audit event is written with its chain hash');
END;
