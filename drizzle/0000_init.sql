CREATE TABLE `school` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`name` varchar(200) NOT NULL,
	`created_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `school_id` PRIMARY KEY(`id`),
	CONSTRAINT `school_name_unique` UNIQUE(`name`)
);
--> statement-breakpoint
CREATE TABLE `user` (
	`id` varchar(32) NOT NULL,
	`email` varchar(254) NOT NULL,
	`name` varchar(120) NOT NULL,
	`password_hash` varchar(255) NOT NULL,
	`time_zone` varchar(64) NOT NULL DEFAULT 'UTC',
	`school_id` bigint unsigned,
	`email_verified_at` datetime,
	`created_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `user_id` PRIMARY KEY(`id`),
	CONSTRAINT `user_email_unique` UNIQUE(`email`)
);
--> statement-breakpoint
CREATE TABLE `user_role` (
	`user_id` varchar(32) NOT NULL,
	`role` enum('learner','instructor','author','reviewer','school_admin','site_admin') NOT NULL,
	`granted_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `user_role_user_id_role_pk` PRIMARY KEY(`user_id`,`role`)
);
--> statement-breakpoint
CREATE TABLE `session` (
	`id` varchar(255) NOT NULL,
	`user_id` varchar(32) NOT NULL,
	`expires_at` datetime NOT NULL,
	CONSTRAINT `session_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `sign_in_throttle` (
	`scope` enum('account','client') NOT NULL,
	`subject` varchar(254) NOT NULL,
	`failures` int unsigned NOT NULL DEFAULT 0,
	`window_started_at` datetime NOT NULL,
	`locked_until` datetime,
	CONSTRAINT `sign_in_throttle_scope_subject_pk` PRIMARY KEY(`scope`,`subject`)
);
--> statement-breakpoint
ALTER TABLE `user` ADD CONSTRAINT `user_school_id_school_id_fk` FOREIGN KEY (`school_id`) REFERENCES `school`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `user_role` ADD CONSTRAINT `user_role_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `session` ADD CONSTRAINT `session_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;