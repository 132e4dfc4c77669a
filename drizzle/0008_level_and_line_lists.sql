CREATE TABLE `identifications` (
	`id` text PRIMARY KEY NOT NULL,
	`project_id` text NOT NULL,
	`line_id` integer NOT NULL,
	`upper_level_id` integer NOT NULL,
	`lower_level_id` integer NOT NULL,
	`type` text NOT NULL,
	`residual` real,
	`status` text NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`updated_by` text,
	`updated_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`line_id`) REFERENCES `line_list_rows`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`upper_level_id`) REFERENCES `level_list_rows`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`lower_level_id`) REFERENCES `level_list_rows`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`updated_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `identification_pair_idx` ON `identifications` (`line_id`,`upper_level_id`,`lower_level_id`);--> statement-breakpoint
CREATE INDEX `identification_project_idx` ON `identifications` (`project_id`,`line_id`);--> statement-breakpoint
CREATE TABLE `level_list_rows` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`list_id` text NOT NULL,
	`position` integer NOT NULL,
	`energy` real NOT NULL,
	`energy_text` text NOT NULL,
	`uncertainty` real,
	`j` text NOT NULL,
	`parity` text NOT NULL,
	`configuration` text DEFAULT '' NOT NULL,
	`term` text DEFAULT '' NOT NULL,
	`g` real,
	FOREIGN KEY (`list_id`) REFERENCES `level_lists`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `level_list_rows_list_idx` ON `level_list_rows` (`list_id`,`position`);--> statement-breakpoint
CREATE TABLE `level_lists` (
	`id` text PRIMARY KEY NOT NULL,
	`project_id` text NOT NULL,
	`name` text NOT NULL,
	`source` text NOT NULL,
	`source_entries` text DEFAULT '[]' NOT NULL,
	`row_count` integer DEFAULT 0 NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `level_lists_project_idx` ON `level_lists` (`project_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `line_list_rows` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`list_id` text NOT NULL,
	`position` integer NOT NULL,
	`wavelength` real NOT NULL,
	`wavelength_text` text NOT NULL,
	`unit` text NOT NULL,
	`medium` text NOT NULL,
	`uncertainty` real,
	`intensity` real,
	`comment` text DEFAULT '' NOT NULL,
	FOREIGN KEY (`list_id`) REFERENCES `line_lists`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `line_list_rows_list_idx` ON `line_list_rows` (`list_id`,`position`);--> statement-breakpoint
CREATE TABLE `line_lists` (
	`id` text PRIMARY KEY NOT NULL,
	`project_id` text NOT NULL,
	`name` text NOT NULL,
	`source` text DEFAULT 'upload' NOT NULL,
	`row_count` integer DEFAULT 0 NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `line_lists_project_idx` ON `line_lists` (`project_id`,`created_at`);