CREATE TABLE `disputes` (
	`id` text PRIMARY KEY NOT NULL,
	`booking_id` text NOT NULL,
	`opened_by` text NOT NULL,
	`reason` text NOT NULL,
	`text` text NOT NULL,
	`status` text DEFAULT 'open' NOT NULL,
	`booking_status_before` text NOT NULL,
	`outcome` text,
	`currency` text NOT NULL,
	`held_minor` integer,
	`songwriter_minor` integer,
	`payees_minor` integer,
	`fee_refund_minor` integer,
	`decided_by` text,
	`decision_note` text,
	`decided_at` integer,
	`settled_at` integer,
	`last_error` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`booking_id`) REFERENCES `bookings`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`opened_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`decided_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `disputes_status_idx` ON `disputes` (`status`,`created_at`);--> statement-breakpoint
CREATE INDEX `disputes_booking_idx` ON `disputes` (`booking_id`);--> statement-breakpoint
CREATE TABLE `audit_log` (
	`id` text PRIMARY KEY NOT NULL,
	`actor_id` text,
	`action` text NOT NULL,
	`target_type` text NOT NULL,
	`target_id` text NOT NULL,
	`amounts` text,
	`note` text DEFAULT '' NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `audit_log_created_idx` ON `audit_log` (`created_at`);--> statement-breakpoint
CREATE INDEX `audit_log_target_idx` ON `audit_log` (`target_type`,`target_id`);--> statement-breakpoint
CREATE TABLE `reviews` (
	`id` text PRIMARY KEY NOT NULL,
	`booking_id` text NOT NULL,
	`reviewer_id` text NOT NULL,
	`subject_id` text NOT NULL,
	`subject_role` text NOT NULL,
	`rating` integer NOT NULL,
	`text` text NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`booking_id`) REFERENCES `bookings`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`reviewer_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`subject_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `reviews_booking_subject_uq` ON `reviews` (`booking_id`,`subject_id`);--> statement-breakpoint
CREATE INDEX `reviews_subject_idx` ON `reviews` (`subject_id`,`created_at`);