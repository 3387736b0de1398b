ALTER TABLE `quotes` ADD `vendor_revenue` text;--> statement-breakpoint
ALTER TABLE `quotes` ADD `revenue_kits_at_list_price` text;--> statement-breakpoint
ALTER TABLE `quotes` ADD `revenue_discounts` text;--> statement-breakpoint
ALTER TABLE `quotes` ADD `revenue_installation` text;--> statement-breakpoint
ALTER TABLE `quotes` ADD `revenue_commissioning` text;