CREATE TABLE `job_run` (
	`name` varchar(64) NOT NULL,
	`last_run_at` datetime(3),
	`locked_until` datetime(3),
	`locked_by` varchar(120),
	`last_error` varchar(1000),
	CONSTRAINT `job_run_name` PRIMARY KEY(`name`)
);
