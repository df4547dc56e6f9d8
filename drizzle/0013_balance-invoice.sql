CREATE TABLE `invoice` (
	`id` text PRIMARY KEY NOT NULL,
	`quote_id` text NOT NULL,
	`number` text NOT NULL,
	`year` integer NOT NULL,
	`sequence` integer NOT NULL,
	`state` text DEFAULT 'issued' NOT NULL,
	`currency` text NOT NULL,
	`tax_rate_bp` integer NOT NULL,
	`net_minor` integer NOT NULL,
	`tax_minor` integer NOT NULL,
	`gross_minor` integer NOT NULL,
	`deposit_paid_minor` integer NOT NULL,
	`balance_minor` integer NOT NULL,
	`purchase_order` text,
	`billing_address` text DEFAULT '' NOT NULL,
	`registration_number` text DEFAULT '' NOT NULL,
	`tax_id` text DEFAULT '' NOT NULL,
	`issued_at` integer NOT NULL,
	`paid_at` integer,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`quote_id`) REFERENCES `quote`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `invoice_quote_id_unique` ON `invoice` (`quote_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `invoice_number_unique` ON `invoice` (`number`);--> statement-breakpoint
CREATE UNIQUE INDEX `invoice_year_sequence_idx` ON `invoice` (`year`,`sequence`);--> statement-breakpoint
ALTER TABLE `client_profile` ADD `billing_address` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `rate_card` ADD `registration_number` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `rate_card` ADD `tax_id` text DEFAULT '' NOT NULL;--> statement-breakpoint
CREATE UNIQUE INDEX `payment_one_paid_balance_idx` ON `payment` (`quote_id`) WHERE kind = 'balance' and state = 'paid';