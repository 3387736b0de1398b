ALTER TABLE `axes` ADD `resonance` text;--> statement-breakpoint
ALTER TABLE `axes` ADD `motion` text;--> statement-breakpoint
ALTER TABLE `axes` ADD `step_loss_event` text;