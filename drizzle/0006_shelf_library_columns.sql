ALTER TABLE `shelf_entries` ADD `parity` text;--> statement-breakpoint
ALTER TABLE `shelf_entries` ADD `open_subshells` text;--> statement-breakpoint
CREATE INDEX `shelf_project_title_idx` ON `shelf_entries` (`project_id`,"title" collate nocase,`id`);