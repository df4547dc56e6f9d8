CREATE TABLE `brief_spec_version` (
	`id` text PRIMARY KEY NOT NULL,
	`brief_id` text NOT NULL,
	`number` integer NOT NULL,
	`spec` text NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`brief_id`) REFERENCES `brief`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `brief_spec_version_number_idx` ON `brief_spec_version` (`brief_id`,`number`);--> statement-breakpoint
-- Briefs submitted before versions were kept start with their stored spec as version 1.
INSERT INTO `brief_spec_version` (`id`, `brief_id`, `number`, `spec`, `created_at`)
SELECT lower(hex(randomblob(16))), `id`, 1, `spec`, `submitted_at` FROM `brief` WHERE `submitted_at` IS NOT NULL;
