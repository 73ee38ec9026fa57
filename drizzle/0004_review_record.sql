CREATE TABLE `review_decisions` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`budget_id` integer NOT NULL,
	`version_number` integer NOT NULL,
	`decision` text NOT NULL,
	`actor_id` integer NOT NULL,
	`reason` text,
	`open_threads` integer DEFAULT 0 NOT NULL,
	`validation_verdict` text,
	`at` integer DEFAULT (CAST(unixepoch('subsec') * 1000 AS INTEGER)) NOT NULL,
	FOREIGN KEY (`budget_id`) REFERENCES `budgets`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `review_decisions_budget_idx` ON `review_decisions` (`budget_id`,`version_number`);--> statement-breakpoint
ALTER TABLE `attachments` ADD `version_number` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
-- Review decisions are part of the record: written once, never changed or removed.
CREATE TRIGGER `review_decisions_no_update` BEFORE UPDATE ON `review_decisions`
BEGIN
  SELECT RAISE(ABORT, 'review decisions are append-only');
END;
--> statement-breakpoint
CREATE TRIGGER `review_decisions_no_delete` BEFORE DELETE ON `review_decisions`
BEGIN
  SELECT RAISE(ABORT, 'review decisions are append-only');
END;
--> statement-breakpoint
-- Evidence is part of the record too: an attachment row is never changed or removed.
CREATE TRIGGER `attachments_no_update` BEFORE UPDATE ON `attachments`
BEGIN
  SELECT RAISE(ABORT, 'attachments are append-only');
END;
--> statement-breakpoint
CREATE TRIGGER `attachments_no_delete` BEFORE DELETE ON `attachments`
BEGIN
  SELECT RAISE(ABORT, 'attachments are append-only');
END;
