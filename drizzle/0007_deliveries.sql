CREATE TABLE `deliveries` (
	`id` text PRIMARY KEY NOT NULL,
	`booking_id` text NOT NULL,
	`number` integer NOT NULL,
	`status` text DEFAULT 'uploading' NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`created_by_id` text NOT NULL,
	`check_run` integer DEFAULT 0 NOT NULL,
	`check_status` text DEFAULT 'waiting' NOT NULL,
	`check_progress` real DEFAULT 0 NOT NULL,
	`check_label` text DEFAULT '' NOT NULL,
	`check_error` text,
	`submitted_at` integer,
	`decision` text,
	`decided_at` integer,
	`decided_by_id` text,
	`change_message` text,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`booking_id`) REFERENCES `bookings`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`decided_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `deliveries_booking_number_uq` ON `deliveries` (`booking_id`,`number`);--> statement-breakpoint
CREATE TABLE `delivery_checks` (
	`id` text PRIMARY KEY NOT NULL,
	`delivery_id` text NOT NULL,
	`run` integer NOT NULL,
	`report` text NOT NULL,
	`level` text NOT NULL,
	`summary` text NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`delivery_id`) REFERENCES `deliveries`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `delivery_checks_run_uq` ON `delivery_checks` (`delivery_id`,`run`);--> statement-breakpoint
CREATE TABLE `delivery_files` (
	`id` text PRIMARY KEY NOT NULL,
	`delivery_id` text NOT NULL,
	`name` text NOT NULL,
	`part` text,
	`size_bytes` integer NOT NULL,
	`status` text DEFAULT 'uploading' NOT NULL,
	`sha256` text,
	`storage_key` text,
	`preview_key` text,
	`preview_status` text DEFAULT 'pending' NOT NULL,
	`peaks_key` text,
	`position` integer NOT NULL,
	`created_at` integer NOT NULL,
	`uploaded_at` integer,
	FOREIGN KEY (`delivery_id`) REFERENCES `deliveries`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `delivery_files_name_uq` ON `delivery_files` (`delivery_id`,`name`);--> statement-breakpoint
CREATE INDEX `delivery_files_delivery_idx` ON `delivery_files` (`delivery_id`);--> statement-breakpoint
CREATE TABLE `delivery_notes` (
	`id` text PRIMARY KEY NOT NULL,
	`delivery_id` text NOT NULL,
	`author_id` text NOT NULL,
	`at_sec` real NOT NULL,
	`file_id` text,
	`body` text NOT NULL,
	`requested_at` integer,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`delivery_id`) REFERENCES `deliveries`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`file_id`) REFERENCES `delivery_files`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `delivery_notes_delivery_idx` ON `delivery_notes` (`delivery_id`,`at_sec`);