ALTER TABLE `quote` ADD `client_note` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `quote` ADD `infeasible_reason` text;