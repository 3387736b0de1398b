CREATE TABLE `case_removed_axes` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`case_id` integer NOT NULL,
	`axis_label` text NOT NULL,
	`machine_name` text NOT NULL,
	`removed_with` text NOT NULL,
	`removed_by_id` integer,
	`removed_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`case_id`) REFERENCES `cases`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`removed_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `case_removed_axes_case_idx` ON `case_removed_axes` (`case_id`);--> statement-breakpoint
CREATE TABLE `deletion_undo` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`user_id` integer NOT NULL,
	`kind` text NOT NULL,
	`label` text NOT NULL,
	`payload` text NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`expires_at` text NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `deletion_undo_user_idx` ON `deletion_undo` (`user_id`);--> statement-breakpoint
ALTER TABLE `accounts` ADD `archived_at` text;--> statement-breakpoint
ALTER TABLE `cases` ADD `notes` text;