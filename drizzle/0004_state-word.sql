ALTER TABLE `brief` RENAME COLUMN "status" TO "state";--> statement-breakpoint
ALTER TABLE `mail_log` RENAME COLUMN "status" TO "state";--> statement-breakpoint
ALTER TABLE `payment` RENAME COLUMN "status" TO "state";--> statement-breakpoint
ALTER TABLE `quote` RENAME COLUMN "status" TO "state";--> statement-breakpoint
ALTER TABLE `state_change` RENAME COLUMN "from_status" TO "from_state";--> statement-breakpoint
ALTER TABLE `state_change` RENAME COLUMN "to_status" TO "to_state";--> statement-breakpoint
DROP INDEX `brief_status_idx`;--> statement-breakpoint
CREATE INDEX `brief_state_idx` ON `brief` (`state`,`submitted_at`);--> statement-breakpoint
DROP INDEX `quote_status_valid_until_idx`;--> statement-breakpoint
CREATE INDEX `quote_state_valid_until_idx` ON `quote` (`state`,`valid_until`);