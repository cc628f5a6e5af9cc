CREATE TABLE `ledger_entries` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`transaction_id` text NOT NULL,
	`account` text NOT NULL,
	`currency` text NOT NULL,
	`amount` integer NOT NULL,
	FOREIGN KEY (`transaction_id`) REFERENCES `ledger_transactions`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `ledger_entries_account_idx` ON `ledger_entries` (`account`,`currency`);--> statement-breakpoint
CREATE INDEX `ledger_entries_transaction_idx` ON `ledger_entries` (`transaction_id`);--> statement-breakpoint
CREATE TABLE `ledger_transactions` (
	`id` text PRIMARY KEY NOT NULL,
	`key` text,
	`booking_id` text,
	`currency` text NOT NULL,
	`memo` text NOT NULL,
	`external_id` text,
	`created_at` integer NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `ledger_transactions_key_unique` ON `ledger_transactions` (`key`);--> statement-breakpoint
CREATE INDEX `ledger_transactions_booking_idx` ON `ledger_transactions` (`booking_id`);--> statement-breakpoint
CREATE TABLE `auto_accepts` (
	`booking_id` text PRIMARY KEY NOT NULL,
	`delivered_at` integer NOT NULL,
	`due_at` integer NOT NULL,
	`status` text NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`booking_id`) REFERENCES `bookings`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `booking_money` (
	`booking_id` text PRIMARY KEY NOT NULL,
	`change_requests` integer DEFAULT 0 NOT NULL,
	`add_ons_paid` integer DEFAULT 0 NOT NULL,
	`cancel_requested_by` text NOT NULL,
	`outcome` text,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`booking_id`) REFERENCES `bookings`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `booking_payments` (
	`id` text PRIMARY KEY NOT NULL,
	`booking_id` text NOT NULL,
	`kind` text NOT NULL,
	`idempotency_key` text NOT NULL,
	`session_id` text,
	`url` text,
	`work_minor` integer NOT NULL,
	`units` integer DEFAULT 1 NOT NULL,
	`fee_minor` integer NOT NULL,
	`amount_minor` integer NOT NULL,
	`currency` text NOT NULL,
	`status` text NOT NULL,
	`payment_intent_id` text,
	`charge_id` text,
	`refunded_minor` integer DEFAULT 0 NOT NULL,
	`transferred_minor` integer DEFAULT 0 NOT NULL,
	`last_error` text,
	`created_at` integer NOT NULL,
	`paid_at` integer,
	FOREIGN KEY (`booking_id`) REFERENCES `bookings`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `booking_payments_idempotencyKey_unique` ON `booking_payments` (`idempotency_key`);--> statement-breakpoint
CREATE UNIQUE INDEX `booking_payments_sessionId_unique` ON `booking_payments` (`session_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `booking_payments_chargeId_unique` ON `booking_payments` (`charge_id`);--> statement-breakpoint
CREATE INDEX `booking_payments_booking_idx` ON `booking_payments` (`booking_id`);--> statement-breakpoint
CREATE TABLE `money_intents` (
	`id` text PRIMARY KEY NOT NULL,
	`booking_id` text NOT NULL,
	`kind` text NOT NULL,
	`idempotency_key` text NOT NULL,
	`payee_id` text,
	`charge_id` text NOT NULL,
	`amount_minor` integer NOT NULL,
	`currency` text NOT NULL,
	`from_account` text NOT NULL,
	`status` text NOT NULL,
	`processor_id` text,
	`reason` text NOT NULL,
	`attempts` integer DEFAULT 0 NOT NULL,
	`last_error` text,
	`created_at` integer NOT NULL,
	`done_at` integer,
	FOREIGN KEY (`booking_id`) REFERENCES `bookings`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`payee_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `money_intents_idempotencyKey_unique` ON `money_intents` (`idempotency_key`);--> statement-breakpoint
CREATE INDEX `money_intents_booking_idx` ON `money_intents` (`booking_id`);--> statement-breakpoint
CREATE INDEX `money_intents_status_idx` ON `money_intents` (`status`);--> statement-breakpoint
CREATE TABLE `payout_accounts` (
	`user_id` text PRIMARY KEY NOT NULL,
	`stripe_account_id` text NOT NULL,
	`charges_enabled` integer DEFAULT false NOT NULL,
	`payouts_enabled` integer DEFAULT false NOT NULL,
	`transfers_active` integer DEFAULT false NOT NULL,
	`details_submitted` integer DEFAULT false NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `payout_accounts_stripeAccountId_unique` ON `payout_accounts` (`stripe_account_id`);--> statement-breakpoint
CREATE TABLE `processed_events` (
	`event_id` text PRIMARY KEY NOT NULL,
	`type` text NOT NULL,
	`processed_at` integer NOT NULL
);
