-- Drummer search (issue 3): an FTS5 index over name, headline, bio, styles, tags and kit, and a style
-- table for the style filter, both kept in step with drummer_profiles (and users.display_name) by
-- triggers, so every write path — service, seed, bulk seed — keeps them right in its own transaction.
--
-- The FTS rowid comes from drummer_search_keys, an INTEGER PRIMARY KEY of our own: drummer_profiles
-- has a text key, and the implicit rowid of such a table may change on VACUUM.
CREATE TABLE `drummer_search_keys` (
	`rowid` integer PRIMARY KEY,
	`user_id` text NOT NULL UNIQUE
);
--> statement-breakpoint
CREATE TABLE `drummer_styles` (
	`user_id` text NOT NULL,
	`style` text NOT NULL,
	PRIMARY KEY (`style`, `user_id`)
) WITHOUT ROWID;
--> statement-breakpoint
CREATE INDEX `drummer_styles_user_idx` ON `drummer_styles` (`user_id`);
--> statement-breakpoint
-- Prefix indexes make the search-as-you-type prefix queries cheap (fts5 "prefix" option).
CREATE VIRTUAL TABLE `drummer_fts` USING fts5(
	name, headline, bio, styles, tags, kit,
	tokenize = 'unicode61 remove_diacritics 2',
	prefix = '2 3'
);
--> statement-breakpoint
CREATE TRIGGER `drummer_profiles_search_ai` AFTER INSERT ON `drummer_profiles` BEGIN
	INSERT INTO `drummer_search_keys` (`user_id`) VALUES (new.`user_id`);
	INSERT INTO `drummer_fts` (rowid, name, headline, bio, styles, tags, kit)
		SELECT k.`rowid`, u.`display_name`, new.`headline`, new.`bio`,
			(SELECT coalesce(group_concat(value, ' '), '') FROM json_each(new.`styles`)),
			(SELECT coalesce(group_concat(value, ' '), '') FROM json_each(new.`tags`)),
			new.`kit`
		FROM `drummer_search_keys` k JOIN `users` u ON u.`id` = new.`user_id`
		WHERE k.`user_id` = new.`user_id`;
	INSERT INTO `drummer_styles` (`user_id`, `style`) SELECT DISTINCT new.`user_id`, value FROM json_each(new.`styles`);
END;
--> statement-breakpoint
CREATE TRIGGER `drummer_profiles_search_au` AFTER UPDATE OF `headline`, `bio`, `styles`, `tags`, `kit` ON `drummer_profiles` BEGIN
	DELETE FROM `drummer_fts` WHERE rowid = (SELECT `rowid` FROM `drummer_search_keys` WHERE `user_id` = old.`user_id`);
	INSERT INTO `drummer_fts` (rowid, name, headline, bio, styles, tags, kit)
		SELECT k.`rowid`, u.`display_name`, new.`headline`, new.`bio`,
			(SELECT coalesce(group_concat(value, ' '), '') FROM json_each(new.`styles`)),
			(SELECT coalesce(group_concat(value, ' '), '') FROM json_each(new.`tags`)),
			new.`kit`
		FROM `drummer_search_keys` k JOIN `users` u ON u.`id` = new.`user_id`
		WHERE k.`user_id` = new.`user_id`;
	DELETE FROM `drummer_styles` WHERE `user_id` = old.`user_id`;
	INSERT INTO `drummer_styles` (`user_id`, `style`) SELECT DISTINCT new.`user_id`, value FROM json_each(new.`styles`);
END;
--> statement-breakpoint
CREATE TRIGGER `drummer_profiles_search_ad` AFTER DELETE ON `drummer_profiles` BEGIN
	DELETE FROM `drummer_fts` WHERE rowid = (SELECT `rowid` FROM `drummer_search_keys` WHERE `user_id` = old.`user_id`);
	DELETE FROM `drummer_search_keys` WHERE `user_id` = old.`user_id`;
	DELETE FROM `drummer_styles` WHERE `user_id` = old.`user_id`;
END;
--> statement-breakpoint
CREATE TRIGGER `users_drummer_search_name_au` AFTER UPDATE OF `display_name` ON `users` BEGIN
	UPDATE `drummer_fts` SET name = new.`display_name`
		WHERE rowid = (SELECT `rowid` FROM `drummer_search_keys` WHERE `user_id` = new.`id`);
END;
--> statement-breakpoint
-- What search reads for every query: listed profiles (published with a headline), by the columns it sorts on.
CREATE INDEX `drummer_profiles_listed_rate_idx` ON `drummer_profiles` (`currency`, `base_rate_minor`) WHERE `published` = 1 AND `headline` <> '';
