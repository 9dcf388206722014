ALTER TABLE "users" ADD COLUMN "session_version" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "rate_limits" ADD COLUMN "blocked_until" timestamp with time zone;