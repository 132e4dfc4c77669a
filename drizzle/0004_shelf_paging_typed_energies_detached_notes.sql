DROP INDEX `shelf_project_idx`;--> statement-breakpoint
CREATE INDEX `shelf_project_updated_idx` ON `shelf_entries` (`project_id`,`updated_at`,`id`);--> statement-breakpoint
DROP INDEX `annotation_entry_level_idx`;--> statement-breakpoint
ALTER TABLE `level_annotations` ADD `observed_energy_text` text;--> statement-breakpoint
ALTER TABLE `level_annotations` ADD `uncertainty_text` text;--> statement-breakpoint
ALTER TABLE `level_annotations` ADD `detached` integer DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE `level_annotations` ADD `detached_from` text;--> statement-breakpoint
CREATE INDEX `annotation_entry_idx` ON `level_annotations` (`entry_id`,`detached`);--> statement-breakpoint
CREATE UNIQUE INDEX `annotation_entry_level_idx` ON `level_annotations` (`entry_id`,`level_key`) WHERE "level_annotations"."detached" = 0;