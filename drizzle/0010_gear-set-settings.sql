ALTER TABLE `parts` ADD `cut_method` text DEFAULT 'unknown' NOT NULL;--> statement-breakpoint
ALTER TABLE `parts` ADD `spiral_angle_deg` real;--> statement-breakpoint
ALTER TABLE `parts` ADD `runout_k` real;