CREATE TABLE `level_annotation_history` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`annotation_id` text NOT NULL,
	`project_id` text NOT NULL,
	`entry_id` text NOT NULL,
	`level_key` text NOT NULL,
	`observed_energy` real,
	`observed_energy_text` text,
	`uncertainty` real,
	`uncertainty_text` text,
	`status` text NOT NULL,
	`comment` text DEFAULT '' NOT NULL,
	`detached` integer DEFAULT false NOT NULL,
	`detached_from` text,
	`version` integer NOT NULL,
	`proposed_by` text,
	`change` text NOT NULL,
	`actor_id` text,
	`actor_name` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`entry_id`) REFERENCES `shelf_entries`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`proposed_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `annotation_history_note_idx` ON `level_annotation_history` (`annotation_id`,`id`);--> statement-breakpoint
CREATE INDEX `annotation_history_project_idx` ON `level_annotation_history` (`project_id`,`id`);--> statement-breakpoint
-- Written by hand: drizzle-kit leaves out the ON DELETE of a column added with ALTER TABLE, and
-- without it deleting an account that proposed a note would fail (schema.ts says set null).
ALTER TABLE `level_annotations` ADD `proposed_by` text REFERENCES users(id) ON DELETE set null;--> statement-breakpoint
-- Existing notes: their proposer is taken to be the last person who changed them.
UPDATE `level_annotations` SET `proposed_by` = `updated_by`;--> statement-breakpoint
-- Each existing note's history starts with its state now, as recorded before history was kept.
INSERT INTO `level_annotation_history` (`annotation_id`, `project_id`, `entry_id`, `level_key`, `observed_energy`, `observed_energy_text`,
	`uncertainty`, `uncertainty_text`, `status`, `comment`, `detached`, `detached_from`, `version`, `proposed_by`, `change`, `actor_id`,
	`actor_name`, `created_at`)
SELECT a.`id`, e.`project_id`, a.`entry_id`, a.`level_key`, a.`observed_energy`, a.`observed_energy_text`, a.`uncertainty`,
	a.`uncertainty_text`, a.`status`, a.`comment`, a.`detached`, a.`detached_from`, a.`version`, a.`proposed_by`, 'recorded', a.`updated_by`,
	coalesce(u.`name`, 'someone'), a.`updated_at`
FROM `level_annotations` a
JOIN `shelf_entries` e ON e.`id` = a.`entry_id`
LEFT JOIN `users` u ON u.`id` = a.`updated_by`
ORDER BY a.`updated_at`, a.`rowid`;