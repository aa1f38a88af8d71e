CREATE TABLE `assemblies` (
	`id` text PRIMARY KEY NOT NULL,
	`team_id` text NOT NULL,
	`serial` text NOT NULL,
	`name` text NOT NULL,
	`housing` text,
	`notes` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `assemblies_team_serial_idx` ON `assemblies` (`team_id`,`serial`);--> statement-breakpoint
CREATE TABLE `cars` (
	`id` text PRIMARY KEY NOT NULL,
	`team_id` text NOT NULL,
	`name` text NOT NULL,
	`car_class` text,
	`notes` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `cars_team_name_idx` ON `cars` (`team_id`,`name`);--> statement-breakpoint
CREATE TABLE `installation_events` (
	`seq` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`id` text NOT NULL,
	`team_id` text NOT NULL,
	`action` text NOT NULL,
	`subject_type` text NOT NULL,
	`subject_id` text NOT NULL,
	`target_type` text NOT NULL,
	`target_id` text NOT NULL,
	`at` integer NOT NULL,
	`actor_id` text,
	`notes` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `installation_events_id_unique` ON `installation_events` (`id`);--> statement-breakpoint
CREATE INDEX `installation_subject_idx` ON `installation_events` (`subject_type`,`subject_id`,`seq`);--> statement-breakpoint
CREATE INDEX `installation_target_idx` ON `installation_events` (`target_type`,`target_id`,`at`);--> statement-breakpoint
CREATE INDEX `installation_team_idx` ON `installation_events` (`team_id`,`at`);--> statement-breakpoint
CREATE TABLE `parts` (
	`id` text PRIMARY KEY NOT NULL,
	`team_id` text NOT NULL,
	`kind` text NOT NULL,
	`serial` text NOT NULL,
	`status` text DEFAULT 'spare' NOT NULL,
	`life_limit_runs` integer,
	`maker` text,
	`model` text,
	`material` text,
	`notes` text,
	`ring_teeth` integer,
	`pinion_teeth` integer,
	`pressure_angle_deg` real,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `parts_team_kind_serial_idx` ON `parts` (`team_id`,`kind`,`serial`);--> statement-breakpoint
CREATE INDEX `parts_team_status_idx` ON `parts` (`team_id`,`status`);--> statement-breakpoint
CREATE TABLE `runs` (
	`id` text PRIMARY KEY NOT NULL,
	`team_id` text NOT NULL,
	`car_id` text NOT NULL,
	`at` integer NOT NULL,
	`event` text,
	`round` text,
	`lane` text,
	`notes` text,
	`elapsed_seconds` real,
	`speed_mph` real,
	`recorded_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`car_id`) REFERENCES `cars`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `runs_car_at_idx` ON `runs` (`car_id`,`at`);--> statement-breakpoint
CREATE INDEX `runs_team_at_idx` ON `runs` (`team_id`,`at`);--> statement-breakpoint
CREATE TABLE `team_settings` (
	`team_id` text PRIMARY KEY NOT NULL,
	`values` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade
);
