CREATE TABLE `bench_attempt` (
	`challenge_id` varchar(24) NOT NULL,
	`user_id` varchar(32) NOT NULL,
	`readings` json NOT NULL,
	`result` json,
	`created_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	`finished_at` datetime,
	CONSTRAINT `bench_attempt_challenge_id_user_id_pk` PRIMARY KEY(`challenge_id`,`user_id`)
);
--> statement-breakpoint
ALTER TABLE `bench_attempt` ADD CONSTRAINT `bench_attempt_challenge_id_bench_challenge_id_fk` FOREIGN KEY (`challenge_id`) REFERENCES `bench_challenge`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `bench_attempt` ADD CONSTRAINT `bench_attempt_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;