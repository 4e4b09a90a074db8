CREATE TABLE `item` (
	`id` varchar(160) NOT NULL,
	`area` varchar(48) NOT NULL,
	`skill` varchar(64) NOT NULL,
	`kind` varchar(24) NOT NULL,
	`family_id` varchar(64),
	`author_id` varchar(32),
	`status` enum('draft','in_review','changes_requested','published','retired') NOT NULL DEFAULT 'draft',
	`published_version_id` bigint unsigned,
	`latest_version_id` bigint unsigned,
	`created_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	`updated_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `item_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `item_family` (
	`id` varchar(64) NOT NULL,
	`title` varchar(200) NOT NULL,
	`source_hash` varchar(64) NOT NULL,
	`status` enum('in_review','approved','retired') NOT NULL DEFAULT 'in_review',
	`approved_hash` varchar(64),
	`approved_by` varchar(32),
	`approved_at` datetime,
	`updated_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `item_family_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `item_version` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`item_id` varchar(160) NOT NULL,
	`version` varchar(64) NOT NULL,
	`content_hash` varchar(64) NOT NULL,
	`key_hash` varchar(64) NOT NULL,
	`source` mediumtext,
	`circuit_text` mediumtext NOT NULL,
	`circuit_ref` varchar(200) NOT NULL,
	`stem_html` mediumtext NOT NULL,
	`explanation_html` mediumtext NOT NULL,
	`ask` json NOT NULL,
	`question` json NOT NULL,
	`answer_key` json NOT NULL,
	`distractors` json NOT NULL,
	`cautions` json NOT NULL,
	`feedback` json NOT NULL,
	`tags` json NOT NULL,
	`difficulty` double NOT NULL DEFAULT 0,
	`status` enum('draft','in_review','changes_requested','published','retired') NOT NULL DEFAULT 'draft',
	`created_by` varchar(32),
	`created_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	`published_at` datetime,
	CONSTRAINT `item_version_id` PRIMARY KEY(`id`),
	CONSTRAINT `item_version_item_version_uq` UNIQUE(`item_id`,`version`)
);
--> statement-breakpoint
CREATE TABLE `response` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`user_id` varchar(32) NOT NULL,
	`item_id` varchar(160) NOT NULL,
	`item_version_id` bigint unsigned NOT NULL,
	`idempotency_key` varchar(64) NOT NULL,
	`context` enum('placement','daily','mock','practice') NOT NULL,
	`context_id` bigint unsigned,
	`answer` json NOT NULL,
	`score` double NOT NULL,
	`correct` boolean NOT NULL,
	`ms` int unsigned NOT NULL,
	`ability_before` double NOT NULL DEFAULT 0,
	`created_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `response_id` PRIMARY KEY(`id`),
	CONSTRAINT `response_user_idem_uq` UNIQUE(`user_id`,`idempotency_key`)
);
--> statement-breakpoint
CREATE TABLE `review` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`item_version_id` bigint unsigned,
	`family_id` varchar(64),
	`reviewer_id` varchar(32),
	`decision` enum('approve','request_changes','retire','submit') NOT NULL,
	`comment` text,
	`created_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `review_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `ability_snapshot` (
	`user_id` varchar(32) NOT NULL,
	`area` varchar(48) NOT NULL,
	`day` date NOT NULL,
	`theta` double NOT NULL,
	CONSTRAINT `ability_snapshot_user_id_area_day_pk` PRIMARY KEY(`user_id`,`area`,`day`)
);
--> statement-breakpoint
CREATE TABLE `area_ability` (
	`user_id` varchar(32) NOT NULL,
	`area` varchar(48) NOT NULL,
	`theta` double NOT NULL DEFAULT 0,
	`n` int unsigned NOT NULL DEFAULT 0,
	`updated_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `area_ability_user_id_area_pk` PRIMARY KEY(`user_id`,`area`)
);
--> statement-breakpoint
CREATE TABLE `bench_challenge` (
	`id` varchar(24) NOT NULL,
	`circuit_ref` varchar(200) NOT NULL,
	`fault` varchar(120) NOT NULL,
	`created_by` varchar(32),
	`created_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `bench_challenge_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `item_stat` (
	`item_id` varchar(160) NOT NULL,
	`n` int unsigned NOT NULL DEFAULT 0,
	`sum_score` double NOT NULL DEFAULT 0,
	`sum_correct` int unsigned NOT NULL DEFAULT 0,
	`sum_theta` double NOT NULL DEFAULT 0,
	`sum_theta2` double NOT NULL DEFAULT 0,
	`sum_theta_correct` double NOT NULL DEFAULT 0,
	`sum_ms` double NOT NULL DEFAULT 0,
	CONSTRAINT `item_stat_item_id` PRIMARY KEY(`item_id`)
);
--> statement-breakpoint
CREATE TABLE `learner_profile` (
	`user_id` varchar(32) NOT NULL,
	`exam_date` date,
	`daily_items` int unsigned NOT NULL DEFAULT 15,
	`daily_minutes` int unsigned NOT NULL DEFAULT 10,
	`placement_done_at` datetime,
	`updated_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `learner_profile_user_id` PRIMARY KEY(`user_id`)
);
--> statement-breakpoint
CREATE TABLE `mock_exam` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`user_id` varchar(32) NOT NULL,
	`item_ids` json NOT NULL,
	`minutes` int unsigned NOT NULL,
	`started_at` datetime NOT NULL,
	`ends_at` datetime NOT NULL,
	`finished_at` datetime,
	`report` json,
	CONSTRAINT `mock_exam_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `practice_set` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`user_id` varchar(32) NOT NULL,
	`kind` enum('placement','daily') NOT NULL,
	`day` date NOT NULL,
	`entries` json NOT NULL,
	`position` int unsigned NOT NULL DEFAULT 0,
	`created_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	`finished_at` datetime,
	CONSTRAINT `practice_set_id` PRIMARY KEY(`id`),
	CONSTRAINT `practice_set_user_kind_day_uq` UNIQUE(`user_id`,`kind`,`day`)
);
--> statement-breakpoint
CREATE TABLE `skill_card` (
	`user_id` varchar(32) NOT NULL,
	`skill` varchar(64) NOT NULL,
	`card` json NOT NULL,
	`due` datetime NOT NULL,
	`last_item_id` varchar(160),
	`updated_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `skill_card_user_id_skill_pk` PRIMARY KEY(`user_id`,`skill`)
);
--> statement-breakpoint
CREATE TABLE `skill_difficulty` (
	`skill` varchar(64) NOT NULL,
	`beta` double NOT NULL,
	`n` int unsigned NOT NULL DEFAULT 0,
	CONSTRAINT `skill_difficulty_skill` PRIMARY KEY(`skill`)
);
--> statement-breakpoint
ALTER TABLE `item` ADD CONSTRAINT `item_family_id_item_family_id_fk` FOREIGN KEY (`family_id`) REFERENCES `item_family`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `item` ADD CONSTRAINT `item_author_id_user_id_fk` FOREIGN KEY (`author_id`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `item_family` ADD CONSTRAINT `item_family_approved_by_user_id_fk` FOREIGN KEY (`approved_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `item_version` ADD CONSTRAINT `item_version_item_id_item_id_fk` FOREIGN KEY (`item_id`) REFERENCES `item`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `item_version` ADD CONSTRAINT `item_version_created_by_user_id_fk` FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `response` ADD CONSTRAINT `response_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `response` ADD CONSTRAINT `response_item_id_item_id_fk` FOREIGN KEY (`item_id`) REFERENCES `item`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `response` ADD CONSTRAINT `response_item_version_id_item_version_id_fk` FOREIGN KEY (`item_version_id`) REFERENCES `item_version`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `review` ADD CONSTRAINT `review_item_version_id_item_version_id_fk` FOREIGN KEY (`item_version_id`) REFERENCES `item_version`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `review` ADD CONSTRAINT `review_family_id_item_family_id_fk` FOREIGN KEY (`family_id`) REFERENCES `item_family`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `review` ADD CONSTRAINT `review_reviewer_id_user_id_fk` FOREIGN KEY (`reviewer_id`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `ability_snapshot` ADD CONSTRAINT `ability_snapshot_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `area_ability` ADD CONSTRAINT `area_ability_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `bench_challenge` ADD CONSTRAINT `bench_challenge_created_by_user_id_fk` FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `learner_profile` ADD CONSTRAINT `learner_profile_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `mock_exam` ADD CONSTRAINT `mock_exam_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `practice_set` ADD CONSTRAINT `practice_set_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `skill_card` ADD CONSTRAINT `skill_card_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `item_status_area_idx` ON `item` (`status`,`area`);--> statement-breakpoint
CREATE INDEX `item_skill_idx` ON `item` (`skill`);--> statement-breakpoint
CREATE INDEX `item_author_idx` ON `item` (`author_id`);--> statement-breakpoint
CREATE INDEX `item_version_status_idx` ON `item_version` (`status`);--> statement-breakpoint
CREATE INDEX `response_user_time_idx` ON `response` (`user_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `response_item_idx` ON `response` (`item_id`);--> statement-breakpoint
CREATE INDEX `review_version_idx` ON `review` (`item_version_id`);--> statement-breakpoint
CREATE INDEX `review_family_idx` ON `review` (`family_id`);