CREATE TABLE `checklist_step_changes` (
	`id` text PRIMARY KEY NOT NULL,
	`team_id` text NOT NULL,
	`checklist_id` text NOT NULL,
	`step_id` text NOT NULL,
	`idempotency_key` text,
	`body` text NOT NULL,
	`applied` integer NOT NULL,
	`by` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`checklist_id`) REFERENCES `checklists`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `checklist_change_key_idx` ON `checklist_step_changes` (`team_id`,`idempotency_key`);--> statement-breakpoint
CREATE INDEX `checklist_change_idx` ON `checklist_step_changes` (`checklist_id`,`step_id`);--> statement-breakpoint
CREATE TABLE `checklist_steps` (
	`checklist_id` text NOT NULL,
	`step_id` text NOT NULL,
	`team_id` text NOT NULL,
	`status` text NOT NULL,
	`reason` text,
	`torque_applied` text,
	`bolts_in_order` text,
	`order_deviation` integer DEFAULT false NOT NULL,
	`value` real,
	`value_unit` text,
	`note` text,
	`by` text NOT NULL,
	`at` integer NOT NULL,
	`received_at` integer NOT NULL,
	PRIMARY KEY(`checklist_id`, `step_id`),
	FOREIGN KEY (`checklist_id`) REFERENCES `checklists`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `checklists` (
	`id` text PRIMARY KEY NOT NULL,
	`team_id` text NOT NULL,
	`procedure_id` text NOT NULL,
	`procedure_version_id` text NOT NULL,
	`assembly_id` text,
	`gear_set_id` text,
	`status` text DEFAULT 'in-progress' NOT NULL,
	`started_by` text NOT NULL,
	`started_at` integer NOT NULL,
	`completed_by` text,
	`completed_at` integer,
	`signed_off_by` text,
	`signed_off_at` integer,
	`sign_off_note` text,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`procedure_id`) REFERENCES `procedures`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`procedure_version_id`) REFERENCES `procedure_versions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`assembly_id`) REFERENCES `assemblies`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`gear_set_id`) REFERENCES `parts`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`started_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`completed_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`signed_off_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `checklists_team_idx` ON `checklists` (`team_id`,`status`);--> statement-breakpoint
CREATE INDEX `checklists_assembly_idx` ON `checklists` (`assembly_id`);--> statement-breakpoint
CREATE INDEX `checklists_gear_set_idx` ON `checklists` (`gear_set_id`);--> statement-breakpoint
CREATE INDEX `checklists_procedure_idx` ON `checklists` (`procedure_id`);--> statement-breakpoint
CREATE TABLE `procedure_versions` (
	`id` text PRIMARY KEY NOT NULL,
	`team_id` text NOT NULL,
	`procedure_id` text NOT NULL,
	`version` integer NOT NULL,
	`name` text NOT NULL,
	`purpose` text,
	`applies_to` text,
	`notes` text,
	`sections` text NOT NULL,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`procedure_id`) REFERENCES `procedures`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `procedure_version_idx` ON `procedure_versions` (`procedure_id`,`version`);--> statement-breakpoint
CREATE TABLE `procedures` (
	`id` text PRIMARY KEY NOT NULL,
	`team_id` text NOT NULL,
	`current_version` integer DEFAULT 1 NOT NULL,
	`archived_at` integer,
	`example` integer DEFAULT false NOT NULL,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `procedures_team_idx` ON `procedures` (`team_id`);--> statement-breakpoint
CREATE TABLE `step_photos` (
	`id` text PRIMARY KEY NOT NULL,
	`team_id` text NOT NULL,
	`procedure_id` text,
	`checklist_id` text,
	`step_id` text NOT NULL,
	`storage_key` text NOT NULL,
	`thumbnail_key` text NOT NULL,
	`content_type` text NOT NULL,
	`width` integer NOT NULL,
	`height` integer NOT NULL,
	`bytes` integer NOT NULL,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`procedure_id`) REFERENCES `procedures`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`checklist_id`) REFERENCES `checklists`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `step_photos_procedure_idx` ON `step_photos` (`procedure_id`,`step_id`);--> statement-breakpoint
CREATE INDEX `step_photos_checklist_idx` ON `step_photos` (`checklist_id`,`step_id`);