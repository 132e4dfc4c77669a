CREATE TABLE `activity_log` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`project_id` text NOT NULL,
	`actor_id` text,
	`actor_name` text NOT NULL,
	`kind` text NOT NULL,
	`summary` text NOT NULL,
	`subject` text,
	`created_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `activity_project_idx` ON `activity_log` (`project_id`,`id`);--> statement-breakpoint
CREATE INDEX `activity_project_actor_idx` ON `activity_log` (`project_id`,`actor_id`,`id`);--> statement-breakpoint
CREATE INDEX `activity_project_kind_idx` ON `activity_log` (`project_id`,`kind`,`id`);