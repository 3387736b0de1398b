CREATE TABLE `sign_in_throttle` (
	`key` text PRIMARY KEY NOT NULL,
	`failures` integer NOT NULL,
	`last_failure_at` integer NOT NULL,
	`blocked_until` integer NOT NULL
);
