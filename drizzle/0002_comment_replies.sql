ALTER TABLE `comments` ADD `parent_id` integer REFERENCES comments(id);--> statement-breakpoint
CREATE INDEX `comments_parent_idx` ON `comments` (`parent_id`);