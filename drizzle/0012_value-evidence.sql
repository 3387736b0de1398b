CREATE TABLE `value_evidence` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`account_id` integer NOT NULL,
	`subject_type` text NOT NULL,
	`subject_id` integer NOT NULL,
	`field` text NOT NULL,
	`note` text NOT NULL,
	`given_on` text NOT NULL,
	`given_by` text NOT NULL,
	`updated_by_id` integer,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`account_id`) REFERENCES `accounts`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`updated_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `value_evidence_subject_field_idx` ON `value_evidence` (`subject_type`,`subject_id`,`field`);--> statement-breakpoint
CREATE INDEX `value_evidence_account_idx` ON `value_evidence` (`account_id`);