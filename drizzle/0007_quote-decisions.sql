ALTER TABLE `quote` ADD `purchase_order` text;--> statement-breakpoint
ALTER TABLE `quote` ADD `decline_reason` text;