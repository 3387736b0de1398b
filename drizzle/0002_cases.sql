CREATE TABLE `case_axes` (
	`case_id` integer NOT NULL,
	`axis_id` integer NOT NULL,
	`kit_id` integer NOT NULL,
	`discount_pct` real DEFAULT 0 NOT NULL,
	`install_hours` real DEFAULT 0 NOT NULL,
	`commissioning_cost` text DEFAULT '0' NOT NULL,
	`maintenance_saving_per_year` text DEFAULT '0' NOT NULL,
	PRIMARY KEY(`case_id`, `axis_id`),
	FOREIGN KEY (`case_id`) REFERENCES `cases`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`axis_id`) REFERENCES `axes`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`kit_id`) REFERENCES `kits`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `case_axes_axis_idx` ON `case_axes` (`axis_id`);--> statement-breakpoint
CREATE INDEX `case_axes_kit_idx` ON `case_axes` (`kit_id`);--> statement-breakpoint
CREATE TABLE `cases` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`account_id` integer NOT NULL,
	`site_id` integer NOT NULL,
	`owner_id` integer NOT NULL,
	`name` text NOT NULL,
	`stage` text DEFAULT 'draft' NOT NULL,
	`assumptions` text NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`account_id`) REFERENCES `accounts`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`site_id`) REFERENCES `sites`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`owner_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `cases_account_idx` ON `cases` (`account_id`);--> statement-breakpoint
CREATE INDEX `cases_site_idx` ON `cases` (`site_id`);--> statement-breakpoint
CREATE TABLE `proposals` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`case_id` integer NOT NULL,
	`version` integer NOT NULL,
	`input` text NOT NULL,
	`result` text NOT NULL,
	`engine_version` text NOT NULL,
	`created_by_id` integer NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`case_id`) REFERENCES `cases`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `proposals_case_version_idx` ON `proposals` (`case_id`,`version`);--> statement-breakpoint
-- A frozen proposal is what the customer was sent: no statement may change it afterwards.
CREATE TRIGGER `proposals_immutable` BEFORE UPDATE ON `proposals`
BEGIN
	SELECT RAISE(ABORT, 'proposals are immutable once frozen');
END;
