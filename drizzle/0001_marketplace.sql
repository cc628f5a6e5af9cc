CREATE TABLE `drummer_profiles` (
	`user_id` text PRIMARY KEY NOT NULL,
	`headline` text DEFAULT '' NOT NULL,
	`bio` text DEFAULT '' NOT NULL,
	`styles` text DEFAULT '[]' NOT NULL,
	`tags` text DEFAULT '[]' NOT NULL,
	`kit` text DEFAULT '' NOT NULL,
	`base_rate_minor` integer DEFAULT 0 NOT NULL,
	`currency` text DEFAULT 'USD' NOT NULL,
	`turnaround_days` integer DEFAULT 7 NOT NULL,
	`revisions_included` integer DEFAULT 2 NOT NULL,
	`taking_work` integer DEFAULT true NOT NULL,
	`town` text DEFAULT '' NOT NULL,
	`country` text DEFAULT '' NOT NULL,
	`time_zone` text DEFAULT 'UTC' NOT NULL,
	`utc_offset_minutes` integer DEFAULT 0 NOT NULL,
	`rating_avg` real,
	`rating_count` integer DEFAULT 0 NOT NULL,
	`published` integer DEFAULT false NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `drummer_profiles_rate_idx` ON `drummer_profiles` (`base_rate_minor`);--> statement-breakpoint
CREATE INDEX `drummer_profiles_offset_idx` ON `drummer_profiles` (`utc_offset_minutes`);--> statement-breakpoint
CREATE TABLE `engineer_profiles` (
	`user_id` text PRIMARY KEY NOT NULL,
	`headline` text DEFAULT '' NOT NULL,
	`bio` text DEFAULT '' NOT NULL,
	`services` text DEFAULT '[]' NOT NULL,
	`town` text DEFAULT '' NOT NULL,
	`country` text DEFAULT '' NOT NULL,
	`time_zone` text DEFAULT 'UTC' NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `reel_tracks` (
	`id` text PRIMARY KEY NOT NULL,
	`drummer_id` text NOT NULL,
	`title` text NOT NULL,
	`style` text DEFAULT '' NOT NULL,
	`tempo_bpm` integer,
	`audio_key` text NOT NULL,
	`peaks_key` text,
	`mime` text NOT NULL,
	`size_bytes` integer NOT NULL,
	`duration_sec` real,
	`position` integer DEFAULT 0 NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`drummer_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `reel_tracks_drummer_idx` ON `reel_tracks` (`drummer_id`,`position`);--> statement-breakpoint
CREATE TABLE `bookings` (
	`id` text PRIMARY KEY NOT NULL,
	`brief_id` text NOT NULL,
	`quote_id` text NOT NULL,
	`songwriter_id` text NOT NULL,
	`drummer_id` text NOT NULL,
	`engineer_id` text,
	`status` text DEFAULT 'awaiting_payment' NOT NULL,
	`terms` text NOT NULL,
	`total_minor` integer NOT NULL,
	`currency` text NOT NULL,
	`drummer_share_minor` integer NOT NULL,
	`engineer_share_minor` integer DEFAULT 0 NOT NULL,
	`input_list` text,
	`version` integer DEFAULT 1 NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`brief_id`) REFERENCES `briefs`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`quote_id`) REFERENCES `quotes`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`songwriter_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`drummer_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`engineer_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `bookings_quoteId_unique` ON `bookings` (`quote_id`);--> statement-breakpoint
CREATE INDEX `bookings_songwriter_idx` ON `bookings` (`songwriter_id`);--> statement-breakpoint
CREATE INDEX `bookings_drummer_idx` ON `bookings` (`drummer_id`);--> statement-breakpoint
CREATE INDEX `bookings_engineer_idx` ON `bookings` (`engineer_id`);--> statement-breakpoint
CREATE TABLE `brief_invites` (
	`brief_id` text NOT NULL,
	`drummer_id` text NOT NULL,
	`created_at` integer NOT NULL,
	PRIMARY KEY(`brief_id`, `drummer_id`),
	FOREIGN KEY (`brief_id`) REFERENCES `briefs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`drummer_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `briefs` (
	`id` text PRIMARY KEY NOT NULL,
	`songwriter_id` text NOT NULL,
	`status` text DEFAULT 'draft' NOT NULL,
	`song_title` text NOT NULL,
	`description` text DEFAULT '' NOT NULL,
	`drum_notes` text DEFAULT '' NOT NULL,
	`style` text DEFAULT '' NOT NULL,
	`tempo_bpm` real NOT NULL,
	`time_signature` text DEFAULT '4/4' NOT NULL,
	`musical_key` text DEFAULT '' NOT NULL,
	`length_bars` integer,
	`length_seconds` integer,
	`song_count` integer DEFAULT 1 NOT NULL,
	`guide_audio_key` text,
	`guide_peaks_key` text,
	`guide_mime` text,
	`guide_name` text,
	`guide_duration_sec` real,
	`reference_notes` text DEFAULT '' NOT NULL,
	`sample_rate` integer DEFAULT 48000 NOT NULL,
	`bit_depth` text DEFAULT '24' NOT NULL,
	`stem_mode` text DEFAULT 'every_mic' NOT NULL,
	`stem_list` text DEFAULT '[]' NOT NULL,
	`rough_mix` integer DEFAULT false NOT NULL,
	`budget_min_minor` integer NOT NULL,
	`budget_max_minor` integer NOT NULL,
	`currency` text NOT NULL,
	`deadline` text NOT NULL,
	`time_zone` text DEFAULT 'UTC' NOT NULL,
	`needs_room` integer DEFAULT false NOT NULL,
	`published_at` integer,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`songwriter_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `briefs_status_idx` ON `briefs` (`status`,`published_at`);--> statement-breakpoint
CREATE INDEX `briefs_owner_idx` ON `briefs` (`songwriter_id`);--> statement-breakpoint
CREATE TABLE `quotes` (
	`id` text PRIMARY KEY NOT NULL,
	`brief_id` text NOT NULL,
	`drummer_id` text NOT NULL,
	`status` text DEFAULT 'sent' NOT NULL,
	`line_items` text NOT NULL,
	`total_minor` integer NOT NULL,
	`currency` text NOT NULL,
	`revisions_included` integer NOT NULL,
	`extra_revision_minor` integer DEFAULT 0 NOT NULL,
	`turnaround_days` integer NOT NULL,
	`recording_date` text,
	`rights_terms` text NOT NULL,
	`royalty_points` real,
	`message` text DEFAULT '' NOT NULL,
	`valid_until` integer NOT NULL,
	`package_id` text,
	`engineer_id` text,
	`engineer_share_minor` integer DEFAULT 0 NOT NULL,
	`engineer_status` text DEFAULT 'none' NOT NULL,
	`decline_reason` text,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`brief_id`) REFERENCES `briefs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`drummer_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`engineer_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `quotes_brief_drummer_uq` ON `quotes` (`brief_id`,`drummer_id`);--> statement-breakpoint
CREATE INDEX `quotes_drummer_idx` ON `quotes` (`drummer_id`);--> statement-breakpoint
CREATE TABLE `messages` (
	`id` text PRIMARY KEY NOT NULL,
	`thread_id` text NOT NULL,
	`sender_id` text NOT NULL,
	`body` text NOT NULL,
	`attachment_key` text,
	`attachment_name` text,
	`attachment_mime` text,
	`attachment_size` integer,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`thread_id`) REFERENCES `threads`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`sender_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `messages_thread_idx` ON `messages` (`thread_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `notification_mutes` (
	`user_id` text NOT NULL,
	`kind` text NOT NULL,
	PRIMARY KEY(`user_id`, `kind`),
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `notifications` (
	`id` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`kind` text NOT NULL,
	`title` text NOT NULL,
	`body` text DEFAULT '' NOT NULL,
	`link` text NOT NULL,
	`read_at` integer,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `notifications_user_idx` ON `notifications` (`user_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `thread_participants` (
	`thread_id` text NOT NULL,
	`user_id` text NOT NULL,
	`last_read_at` integer,
	PRIMARY KEY(`thread_id`, `user_id`),
	FOREIGN KEY (`thread_id`) REFERENCES `threads`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `thread_participants_user_idx` ON `thread_participants` (`user_id`);--> statement-breakpoint
CREATE TABLE `threads` (
	`id` text PRIMARY KEY NOT NULL,
	`kind` text NOT NULL,
	`brief_id` text,
	`drummer_id` text,
	`booking_id` text,
	`subject` text NOT NULL,
	`last_message_at` integer,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`brief_id`) REFERENCES `briefs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`drummer_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`booking_id`) REFERENCES `bookings`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `threads_brief_drummer_uq` ON `threads` (`brief_id`,`drummer_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `threads_booking_uq` ON `threads` (`booking_id`);