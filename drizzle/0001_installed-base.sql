CREATE TABLE `kits` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`code` text NOT NULL,
	`name` text NOT NULL,
	`price` text NOT NULL,
	`currency` text NOT NULL,
	`sensing` text DEFAULT 'encoder' NOT NULL,
	`motor_id` integer,
	`max_current_peak_a` real,
	`bus_voltage_v` real,
	`efficiency_pct` real DEFAULT 92 NOT NULL,
	`standby_w` real DEFAULT 3 NOT NULL,
	`encoder_w` real,
	`min_current_pct` real DEFAULT 10 NOT NULL,
	`sensorless_min_rpm` real DEFAULT 60 NOT NULL,
	`active` integer DEFAULT true NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`motor_id`) REFERENCES `motors`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE UNIQUE INDEX `kits_code_unique` ON `kits` (`code`);--> statement-breakpoint
CREATE TABLE `motors` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`code` text NOT NULL,
	`name` text NOT NULL,
	`frame_size` integer NOT NULL,
	`rotor_teeth` integer DEFAULT 50 NOT NULL,
	`holding_torque_nm` real NOT NULL,
	`rated_current_a` real NOT NULL,
	`phase_resistance_ohm` real NOT NULL,
	`phase_inductance_mh` real NOT NULL,
	`thermal_resistance_k_per_w` real,
	`rated_temp_rise_k` real DEFAULT 80 NOT NULL,
	`insulation_class` text DEFAULT 'B' NOT NULL,
	`hysteresis_w_per_hz` real DEFAULT 0 NOT NULL,
	`eddy_w_per_hz2` real DEFAULT 0 NOT NULL,
	`active` integer DEFAULT true NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `motors_code_unique` ON `motors` (`code`);--> statement-breakpoint
CREATE TABLE `axes` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`site_id` integer NOT NULL,
	`machine_id` integer NOT NULL,
	`label` text NOT NULL,
	`quantity` integer DEFAULT 1 NOT NULL,
	`reference_motor_id` integer,
	`rotor_teeth` integer DEFAULT 50 NOT NULL,
	`holding_torque_nm` real NOT NULL,
	`rated_current_a` real NOT NULL,
	`phase_resistance_ohm` real NOT NULL,
	`phase_inductance_mh` real NOT NULL,
	`thermal_resistance_k_per_w` real,
	`rated_temp_rise_k` real DEFAULT 80 NOT NULL,
	`insulation_class` text DEFAULT 'B' NOT NULL,
	`hysteresis_w_per_hz` real DEFAULT 0 NOT NULL,
	`eddy_w_per_hz2` real DEFAULT 0 NOT NULL,
	`pull_out_curve` text,
	`bus_voltage_v` real NOT NULL,
	`current_setting_a` real NOT NULL,
	`current_convention` text DEFAULT 'peak' NOT NULL,
	`step_mode` text DEFAULT 'micro' NOT NULL,
	`microsteps` integer DEFAULT 16 NOT NULL,
	`idle_current_pct` real DEFAULT 50 NOT NULL,
	`drive_efficiency_pct` real DEFAULT 90 NOT NULL,
	`drive_standby_w` real DEFAULT 2 NOT NULL,
	`hours_per_year` real NOT NULL,
	`move_pct` real NOT NULL,
	`hold_pct` real NOT NULL,
	`speed_rpm` real NOT NULL,
	`load_torque_nm` real NOT NULL,
	`peak_torque_nm` real NOT NULL,
	`hold_torque_nm` real DEFAULT 0 NOT NULL,
	`ambient_c` real DEFAULT 40 NOT NULL,
	`step_loss_events_per_year` real DEFAULT 0 NOT NULL,
	`cost_per_event` text DEFAULT '0' NOT NULL,
	`avoided_pct` real DEFAULT 90 NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`site_id`) REFERENCES `sites`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`machine_id`) REFERENCES `machines`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`reference_motor_id`) REFERENCES `motors`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `axes_site_label_idx` ON `axes` (`site_id`,`label`);--> statement-breakpoint
CREATE INDEX `axes_machine_idx` ON `axes` (`machine_id`);--> statement-breakpoint
CREATE TABLE `machines` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`site_id` integer NOT NULL,
	`name` text NOT NULL,
	`line` text,
	`downtime_hours` real DEFAULT 0 NOT NULL,
	`throughput_gain_pct` real DEFAULT 0 NOT NULL,
	`margin_per_output_hour` text DEFAULT '0' NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`site_id`) REFERENCES `sites`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `machines_site_name_idx` ON `machines` (`site_id`,`name`);--> statement-breakpoint
CREATE TABLE `sites` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`account_id` integer NOT NULL,
	`name` text NOT NULL,
	`currency` text NOT NULL,
	`tariff_per_kwh` text NOT NULL,
	`grid_kg_co2_per_kwh` real DEFAULT 0 NOT NULL,
	`ambient_c` real DEFAULT 40 NOT NULL,
	`hours_per_year` real NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`account_id`) REFERENCES `accounts`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `sites_account_name_idx` ON `sites` (`account_id`,`name`);--> statement-breakpoint
CREATE TABLE `imports` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`site_id` integer NOT NULL,
	`user_id` integer,
	`file_name` text NOT NULL,
	`size_bytes` integer NOT NULL,
	`rows_read` integer NOT NULL,
	`rows_imported` integer NOT NULL,
	`error_count` integer NOT NULL,
	`machines_created` integer DEFAULT 0 NOT NULL,
	`at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`site_id`) REFERENCES `sites`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `imports_site_idx` ON `imports` (`site_id`,`at`);