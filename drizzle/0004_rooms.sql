CREATE TABLE `mic_packages` (
	`id` text PRIMARY KEY NOT NULL,
	`room_id` text NOT NULL,
	`engineer_id` text NOT NULL,
	`name` text NOT NULL,
	`price_minor` integer NOT NULL,
	`currency` text NOT NULL,
	`channels` text NOT NULL,
	`archived_at` integer,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`room_id`) REFERENCES `rooms`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`engineer_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `mic_packages_room_idx` ON `mic_packages` (`room_id`);--> statement-breakpoint
CREATE INDEX `mic_packages_engineer_idx` ON `mic_packages` (`engineer_id`);--> statement-breakpoint
CREATE TABLE `room_blocked_dates` (
	`room_id` text NOT NULL,
	`date` text NOT NULL,
	PRIMARY KEY(`room_id`, `date`),
	FOREIGN KEY (`room_id`) REFERENCES `rooms`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `room_photos` (
	`id` text PRIMARY KEY NOT NULL,
	`room_id` text NOT NULL,
	`large_key` text NOT NULL,
	`thumb_key` text NOT NULL,
	`width` integer NOT NULL,
	`height` integer NOT NULL,
	`caption` text DEFAULT '' NOT NULL,
	`position` integer DEFAULT 0 NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`room_id`) REFERENCES `rooms`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `room_photos_room_idx` ON `room_photos` (`room_id`,`position`);--> statement-breakpoint
CREATE TABLE `rooms` (
	`id` text PRIMARY KEY NOT NULL,
	`engineer_id` text NOT NULL,
	`name` text NOT NULL,
	`town` text NOT NULL,
	`time_zone` text NOT NULL,
	`utc_offset_minutes` integer NOT NULL,
	`description` text DEFAULT '' NOT NULL,
	`day_rate_minor` integer NOT NULL,
	`half_day_rate_minor` integer NOT NULL,
	`currency` text NOT NULL,
	`inputs` integer NOT NULL,
	`dimensions` text NOT NULL,
	`surfaces` text NOT NULL,
	`panels` text NOT NULL,
	`openings` text NOT NULL,
	`volume_m_3` real NOT NULL,
	`floor_area_m_2` real NOT NULL,
	`mid_rt60_sec` real NOT NULL,
	`reading` text NOT NULL,
	`archived_at` integer,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`engineer_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `rooms_engineer_idx` ON `rooms` (`engineer_id`);--> statement-breakpoint
CREATE INDEX `rooms_rate_idx` ON `rooms` (`currency`,`day_rate_minor`);--> statement-breakpoint
CREATE INDEX `rooms_rt_idx` ON `rooms` (`mid_rt60_sec`);--> statement-breakpoint
CREATE INDEX `rooms_offset_idx` ON `rooms` (`utc_offset_minutes`);--> statement-breakpoint
CREATE TABLE `session_prep_events` (
	`id` text PRIMARY KEY NOT NULL,
	`booking_id` text NOT NULL,
	`item_id` text NOT NULL,
	`done` integer NOT NULL,
	`user_id` text NOT NULL,
	`at` integer NOT NULL,
	FOREIGN KEY (`booking_id`) REFERENCES `bookings`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `session_prep_events_booking_idx` ON `session_prep_events` (`booking_id`,`at`);