CREATE TABLE `fit_reports` (
	`id` text PRIMARY KEY NOT NULL,
	`entry_id` text NOT NULL,
	`parameter_set_id` text,
	`notation` text NOT NULL,
	`request` text NOT NULL,
	`result` text NOT NULL,
	`rms` real NOT NULL,
	`degrees_of_freedom` integer NOT NULL,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	FOREIGN KEY (`entry_id`) REFERENCES `shelf_entries`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`parameter_set_id`) REFERENCES `parameter_sets`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `fit_reports_entry_idx` ON `fit_reports` (`entry_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `parameter_sets` (
	`id` text PRIMARY KEY NOT NULL,
	`entry_id` text NOT NULL,
	`name` text NOT NULL,
	`notation` text NOT NULL,
	`parameters` text NOT NULL,
	`comment` text DEFAULT '' NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	`updated_by` text,
	`updated_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	FOREIGN KEY (`entry_id`) REFERENCES `shelf_entries`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`updated_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `parameter_sets_entry_idx` ON `parameter_sets` (`entry_id`,`updated_at`);