ALTER TABLE `runs` ADD `idempotency_key` text;--> statement-breakpoint
CREATE UNIQUE INDEX `runs_idempotency_idx` ON `runs` (`team_id`,`idempotency_key`);