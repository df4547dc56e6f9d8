CREATE TABLE `brief_read` (
	`user_id` text NOT NULL,
	`brief_id` text NOT NULL,
	`read_at` integer NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`brief_id`) REFERENCES `brief`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `brief_read_user_brief_idx` ON `brief_read` (`user_id`,`brief_id`);--> statement-breakpoint
ALTER TABLE `brief_file` ADD `message_id` text REFERENCES brief_message(id);--> statement-breakpoint
CREATE INDEX `brief_file_message_idx` ON `brief_file` (`message_id`);--> statement-breakpoint
ALTER TABLE `payment` ADD `refund_of` text REFERENCES payment(id);--> statement-breakpoint
ALTER TABLE `payment` ADD `refunded_by` text REFERENCES user(id);--> statement-breakpoint
ALTER TABLE `payment` ADD `refund_reason` text;