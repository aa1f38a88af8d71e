CREATE TABLE `inspection_photos` (
	`id` text PRIMARY KEY NOT NULL,
	`team_id` text NOT NULL,
	`inspection_id` text NOT NULL,
	`side` text NOT NULL,
	`storage_key` text NOT NULL,
	`thumbnail_key` text NOT NULL,
	`content_type` text NOT NULL,
	`width` integer NOT NULL,
	`height` integer NOT NULL,
	`bytes` integer NOT NULL,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`inspection_id`) REFERENCES `inspections`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `photos_inspection_idx` ON `inspection_photos` (`inspection_id`);--> statement-breakpoint
CREATE TABLE `inspections` (
	`id` text PRIMARY KEY NOT NULL,
	`team_id` text NOT NULL,
	`gear_set_id` text NOT NULL,
	`assembly_id` text,
	`status` text DEFAULT 'draft' NOT NULL,
	`inspected_at` integer NOT NULL,
	`runs_at_inspection` integer NOT NULL,
	`data` text NOT NULL,
	`profile_version_id` text,
	`technician_id` text,
	`created_by` text NOT NULL,
	`idempotency_key` text,
	`submitted_at` integer,
	`submitted_by` text,
	`revision` integer DEFAULT 1 NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`gear_set_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`assembly_id`) REFERENCES `assemblies`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`profile_version_id`) REFERENCES `tolerance_profile_versions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`technician_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`submitted_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `inspections_gear_set_idx` ON `inspections` (`gear_set_id`,`inspected_at`);--> statement-breakpoint
CREATE INDEX `inspections_team_idx` ON `inspections` (`team_id`,`inspected_at`);--> statement-breakpoint
CREATE UNIQUE INDEX `inspections_idempotency_idx` ON `inspections` (`team_id`,`idempotency_key`);--> statement-breakpoint
CREATE TABLE `tolerance_profile_versions` (
	`id` text PRIMARY KEY NOT NULL,
	`team_id` text NOT NULL,
	`profile_id` text NOT NULL,
	`version` integer NOT NULL,
	`name` text NOT NULL,
	`values` text NOT NULL,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `profile_version_idx` ON `tolerance_profile_versions` (`profile_id`,`version`);--> statement-breakpoint
CREATE INDEX `profile_team_idx` ON `tolerance_profile_versions` (`team_id`);--> statement-breakpoint
ALTER TABLE `parts` ADD `tolerance_profile_id` text;