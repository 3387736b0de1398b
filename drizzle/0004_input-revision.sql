CREATE TABLE `input_revision` (
	`id` integer PRIMARY KEY NOT NULL,
	`revision` integer DEFAULT 0 NOT NULL
);
--> statement-breakpoint
-- The counter's one row; every write to a table the engine input is built from bumps it.
INSERT INTO `input_revision` (`id`, `revision`) VALUES (1, 0);
--> statement-breakpoint
CREATE TRIGGER `cases_insert_input_revision` AFTER INSERT ON `cases`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `cases_update_input_revision` AFTER UPDATE ON `cases`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `cases_delete_input_revision` AFTER DELETE ON `cases`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `case_axes_insert_input_revision` AFTER INSERT ON `case_axes`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `case_axes_update_input_revision` AFTER UPDATE ON `case_axes`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `case_axes_delete_input_revision` AFTER DELETE ON `case_axes`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `axes_insert_input_revision` AFTER INSERT ON `axes`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `axes_update_input_revision` AFTER UPDATE ON `axes`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `axes_delete_input_revision` AFTER DELETE ON `axes`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `machines_insert_input_revision` AFTER INSERT ON `machines`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `machines_update_input_revision` AFTER UPDATE ON `machines`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `machines_delete_input_revision` AFTER DELETE ON `machines`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `sites_insert_input_revision` AFTER INSERT ON `sites`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `sites_update_input_revision` AFTER UPDATE ON `sites`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `sites_delete_input_revision` AFTER DELETE ON `sites`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `kits_insert_input_revision` AFTER INSERT ON `kits`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `kits_update_input_revision` AFTER UPDATE ON `kits`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `kits_delete_input_revision` AFTER DELETE ON `kits`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `motors_insert_input_revision` AFTER INSERT ON `motors`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `motors_update_input_revision` AFTER UPDATE ON `motors`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `motors_delete_input_revision` AFTER DELETE ON `motors`
BEGIN
	UPDATE `input_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
