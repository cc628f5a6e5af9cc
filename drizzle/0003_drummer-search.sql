-- Drummer search (issue 3). Only LISTED drummers are in the search tables: published, with a headline,
-- account enabled and still holding the drummer role. Triggers rebuild a drummer's rows on every change of
-- their profile or account, so each write path (service, seed, bulk seed, reviews) keeps search right in
-- its own transaction.
--
-- drummer_search_rows holds every column a filter or sort reads, with styles as a bit mask, keyed by an
-- INTEGER PRIMARY KEY that is also the FTS rowid: a search then touches one narrow table by rowid and
-- no joins until the page is known (a join per match cost more than the full-text match itself).
CREATE TABLE `drummer_style_bits` (
	`style` text PRIMARY KEY NOT NULL,
	`bit` integer NOT NULL UNIQUE
);
--> statement-breakpoint
-- The same list and order as DRUM_STYLES in shared/schemas/profiles.ts (a unit test compares them).
INSERT INTO `drummer_style_bits` (`style`, `bit`) VALUES
	('rock', 0),
	('pop', 1),
	('funk', 2),
	('soul', 3),
	('jazz', 4),
	('metal', 5),
	('punk', 6),
	('indie', 7),
	('country', 8),
	('folk', 9),
	('hip-hop', 10),
	('r-and-b', 11),
	('latin', 12),
	('reggae', 13),
	('gospel', 14),
	('electronic', 15),
	('singer-songwriter', 16),
	('blues', 17),
	('fusion', 18),
	('world', 19);
--> statement-breakpoint
CREATE TABLE `drummer_search_rows` (
	`rowid` integer PRIMARY KEY,
	`user_id` text NOT NULL UNIQUE,
	`style_mask` integer NOT NULL,
	`currency` text NOT NULL,
	`base_rate_minor` integer NOT NULL,
	`turnaround_days` integer NOT NULL,
	`taking_work` integer NOT NULL,
	`utc_offset_minutes` integer NOT NULL,
	`rating_avg` real,
	`rating_count` integer NOT NULL,
	`updated_at` integer NOT NULL
);
--> statement-breakpoint
-- One index per sort order, column for column as search.repository.ts writes its ORDER BY, so a page of a
-- lightly filtered search stops after its first rows instead of sorting every listed drummer.
CREATE INDEX `drummer_search_rows_rate_idx` ON `drummer_search_rows` (`currency`, `base_rate_minor`, `turnaround_days`, `user_id`);
--> statement-breakpoint
CREATE INDEX `drummer_search_rows_turnaround_idx` ON `drummer_search_rows` (`turnaround_days`, `taking_work` DESC, (`rating_avg` IS NULL), `rating_avg` DESC, `rating_count` DESC, `updated_at` DESC, `user_id`);
--> statement-breakpoint
CREATE INDEX `drummer_search_rows_best_idx` ON `drummer_search_rows` (`taking_work` DESC, (`rating_avg` IS NULL), `rating_avg` DESC, `rating_count` DESC, `updated_at` DESC, `user_id`);
--> statement-breakpoint
CREATE INDEX `drummer_search_rows_rating_idx` ON `drummer_search_rows` ((`rating_avg` IS NULL), `rating_avg` DESC, `rating_count` DESC, `taking_work` DESC, `user_id`);
--> statement-breakpoint
-- Prefix indexes make the prefix terms of every query cheap (fts5 "prefix" option).
CREATE VIRTUAL TABLE `drummer_fts` USING fts5(
	name, headline, bio, styles, tags, kit,
	tokenize = 'unicode61 remove_diacritics 2',
	prefix = '2 3'
);
--> statement-breakpoint
CREATE TRIGGER `drummer_profiles_search_ai` AFTER INSERT ON `drummer_profiles` BEGIN
	DELETE FROM `drummer_fts` WHERE rowid = (SELECT `rowid` FROM `drummer_search_rows` WHERE `user_id` = new.`user_id`);
	DELETE FROM `drummer_search_rows` WHERE `user_id` = new.`user_id`;
	INSERT INTO `drummer_search_rows` (`user_id`, `style_mask`, `currency`, `base_rate_minor`, `turnaround_days`, `taking_work`, `utc_offset_minutes`, `rating_avg`, `rating_count`, `updated_at`)
		SELECT p.`user_id`,
			(SELECT coalesce(sum(1 << b.`bit`), 0) FROM (SELECT DISTINCT value FROM json_each(p.`styles`)) j JOIN `drummer_style_bits` b ON b.`style` = j.value),
			p.`currency`, p.`base_rate_minor`, p.`turnaround_days`, p.`taking_work`, p.`utc_offset_minutes`, p.`rating_avg`, p.`rating_count`, p.`updated_at`
		FROM `drummer_profiles` p JOIN `users` u ON u.`id` = p.`user_id`
		WHERE p.`user_id` = new.`user_id` AND p.`published` = 1 AND trim(p.`headline`) <> '' AND u.`disabled_at` IS NULL
			AND EXISTS (SELECT 1 FROM json_each(u.`roles`) WHERE value = 'drummer');
	INSERT INTO `drummer_fts` (rowid, name, headline, bio, styles, tags, kit)
		SELECT r.`rowid`, u.`display_name`, p.`headline`, p.`bio`,
			(SELECT coalesce(group_concat(value, ' '), '') FROM json_each(p.`styles`)),
			(SELECT coalesce(group_concat(value, ' '), '') FROM json_each(p.`tags`)),
			p.`kit`
		FROM `drummer_search_rows` r JOIN `drummer_profiles` p ON p.`user_id` = r.`user_id` JOIN `users` u ON u.`id` = r.`user_id`
		WHERE r.`user_id` = new.`user_id`;
END;
--> statement-breakpoint
CREATE TRIGGER `drummer_profiles_search_au` AFTER UPDATE ON `drummer_profiles` BEGIN
	DELETE FROM `drummer_fts` WHERE rowid = (SELECT `rowid` FROM `drummer_search_rows` WHERE `user_id` = new.`user_id`);
	DELETE FROM `drummer_search_rows` WHERE `user_id` = new.`user_id`;
	INSERT INTO `drummer_search_rows` (`user_id`, `style_mask`, `currency`, `base_rate_minor`, `turnaround_days`, `taking_work`, `utc_offset_minutes`, `rating_avg`, `rating_count`, `updated_at`)
		SELECT p.`user_id`,
			(SELECT coalesce(sum(1 << b.`bit`), 0) FROM (SELECT DISTINCT value FROM json_each(p.`styles`)) j JOIN `drummer_style_bits` b ON b.`style` = j.value),
			p.`currency`, p.`base_rate_minor`, p.`turnaround_days`, p.`taking_work`, p.`utc_offset_minutes`, p.`rating_avg`, p.`rating_count`, p.`updated_at`
		FROM `drummer_profiles` p JOIN `users` u ON u.`id` = p.`user_id`
		WHERE p.`user_id` = new.`user_id` AND p.`published` = 1 AND trim(p.`headline`) <> '' AND u.`disabled_at` IS NULL
			AND EXISTS (SELECT 1 FROM json_each(u.`roles`) WHERE value = 'drummer');
	INSERT INTO `drummer_fts` (rowid, name, headline, bio, styles, tags, kit)
		SELECT r.`rowid`, u.`display_name`, p.`headline`, p.`bio`,
			(SELECT coalesce(group_concat(value, ' '), '') FROM json_each(p.`styles`)),
			(SELECT coalesce(group_concat(value, ' '), '') FROM json_each(p.`tags`)),
			p.`kit`
		FROM `drummer_search_rows` r JOIN `drummer_profiles` p ON p.`user_id` = r.`user_id` JOIN `users` u ON u.`id` = r.`user_id`
		WHERE r.`user_id` = new.`user_id`;
END;
--> statement-breakpoint
CREATE TRIGGER `drummer_profiles_search_ad` AFTER DELETE ON `drummer_profiles` BEGIN
	DELETE FROM `drummer_fts` WHERE rowid = (SELECT `rowid` FROM `drummer_search_rows` WHERE `user_id` = old.`user_id`);
	DELETE FROM `drummer_search_rows` WHERE `user_id` = old.`user_id`;
END;
--> statement-breakpoint
CREATE TRIGGER `users_drummer_search_au` AFTER UPDATE OF `display_name`, `roles`, `disabled_at` ON `users` BEGIN
	DELETE FROM `drummer_fts` WHERE rowid = (SELECT `rowid` FROM `drummer_search_rows` WHERE `user_id` = new.`id`);
	DELETE FROM `drummer_search_rows` WHERE `user_id` = new.`id`;
	INSERT INTO `drummer_search_rows` (`user_id`, `style_mask`, `currency`, `base_rate_minor`, `turnaround_days`, `taking_work`, `utc_offset_minutes`, `rating_avg`, `rating_count`, `updated_at`)
		SELECT p.`user_id`,
			(SELECT coalesce(sum(1 << b.`bit`), 0) FROM (SELECT DISTINCT value FROM json_each(p.`styles`)) j JOIN `drummer_style_bits` b ON b.`style` = j.value),
			p.`currency`, p.`base_rate_minor`, p.`turnaround_days`, p.`taking_work`, p.`utc_offset_minutes`, p.`rating_avg`, p.`rating_count`, p.`updated_at`
		FROM `drummer_profiles` p JOIN `users` u ON u.`id` = p.`user_id`
		WHERE p.`user_id` = new.`id` AND p.`published` = 1 AND trim(p.`headline`) <> '' AND u.`disabled_at` IS NULL
			AND EXISTS (SELECT 1 FROM json_each(u.`roles`) WHERE value = 'drummer');
	INSERT INTO `drummer_fts` (rowid, name, headline, bio, styles, tags, kit)
		SELECT r.`rowid`, u.`display_name`, p.`headline`, p.`bio`,
			(SELECT coalesce(group_concat(value, ' '), '') FROM json_each(p.`styles`)),
			(SELECT coalesce(group_concat(value, ' '), '') FROM json_each(p.`tags`)),
			p.`kit`
		FROM `drummer_search_rows` r JOIN `drummer_profiles` p ON p.`user_id` = r.`user_id` JOIN `users` u ON u.`id` = r.`user_id`
		WHERE r.`user_id` = new.`id`;
END;
