CREATE TABLE `quotes` (
	`proposal_id` integer PRIMARY KEY NOT NULL,
	`stage` text DEFAULT 'ready' NOT NULL,
	`owner_id` integer NOT NULL,
	`value` text NOT NULL,
	`currency` text NOT NULL,
	`payback_years` real,
	`max_discount_pct` real DEFAULT 0 NOT NULL,
	`expected_close_on` text NOT NULL,
	`sent_at` text,
	`sent_to_id` integer,
	`decided_at` text,
	`discount_approved_by_id` integer,
	`discount_approved_at` text,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`proposal_id`) REFERENCES `proposals`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`owner_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`sent_to_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`discount_approved_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `quotes_stage_idx` ON `quotes` (`stage`);--> statement-breakpoint
CREATE INDEX `quotes_owner_idx` ON `quotes` (`owner_id`);--> statement-breakpoint
CREATE INDEX `quotes_close_idx` ON `quotes` (`expected_close_on`);--> statement-breakpoint
CREATE TABLE `sales_settings` (
	`id` integer PRIMARY KEY NOT NULL,
	`discount_threshold_pct` real NOT NULL,
	`stage_probabilities` text NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	CONSTRAINT "sales_settings_one_row" CHECK("sales_settings"."id" = 1)
);
--> statement-breakpoint
CREATE TABLE `invitations` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`user_id` integer NOT NULL,
	`proposal_id` integer,
	`token_hash` text NOT NULL,
	`expires_at` text NOT NULL,
	`used_at` text,
	`revoked_at` text,
	`created_by_id` integer,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`proposal_id`) REFERENCES `proposals`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `invitations_token_hash_unique` ON `invitations` (`token_hash`);--> statement-breakpoint
CREATE INDEX `invitations_user_idx` ON `invitations` (`user_id`);--> statement-breakpoint
CREATE TABLE `proposal_comments` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`proposal_id` integer NOT NULL,
	`author_id` integer NOT NULL,
	`body` text NOT NULL,
	`decision` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`proposal_id`) REFERENCES `proposals`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `proposal_comments_proposal_idx` ON `proposal_comments` (`proposal_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `mail_queue` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`to_address` text NOT NULL,
	`to_name` text,
	`subject` text NOT NULL,
	`text` text NOT NULL,
	`html` text NOT NULL,
	`status` text DEFAULT 'pending' NOT NULL,
	`attempts` integer DEFAULT 0 NOT NULL,
	`last_error` text,
	`next_attempt_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`sent_at` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL
);
--> statement-breakpoint
CREATE INDEX `mail_queue_due_idx` ON `mail_queue` (`status`,`next_attempt_at`);--> statement-breakpoint
CREATE TABLE `outbox` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`message_id` text,
	`from_address` text,
	`to` text NOT NULL,
	`subject` text NOT NULL,
	`text` text NOT NULL,
	`html` text NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL
);
--> statement-breakpoint
CREATE INDEX `outbox_created_idx` ON `outbox` (`created_at`);--> statement-breakpoint
-- Proposals frozen before quotes existed become quotes: the newest version of each case ready to
-- send, older ones replaced by it; the figures copied from the frozen result, a close date two
-- months after freezing (an estimate the manager replaces).
INSERT INTO `quotes` (`proposal_id`, `stage`, `owner_id`, `value`, `currency`, `payback_years`, `max_discount_pct`, `expected_close_on`)
SELECT p.`id`,
	CASE WHEN p.`version` < (SELECT max(o.`version`) FROM `proposals` o WHERE o.`case_id` = p.`case_id`) THEN 'replaced' ELSE 'ready' END,
	c.`owner_id`,
	json_extract(p.`result`, '$.totals.capex'),
	json_extract(p.`result`, '$.currency'),
	json_extract(p.`result`, '$.scenarios.physics.paybackYears'),
	coalesce((SELECT max(json_extract(a.`value`, '$.retrofit.discountPct')) FROM json_each(p.`input`, '$.axes') a), 0),
	date(p.`created_at`, '+60 days')
FROM `proposals` p INNER JOIN `cases` c ON c.`id` = p.`case_id`;
