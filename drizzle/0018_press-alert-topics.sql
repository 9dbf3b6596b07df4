-- The topics a reporter wants alerts for (none chosen: every topic).
ALTER TABLE "people" ADD COLUMN "alert_topics" text[] DEFAULT '{}'::text[] NOT NULL;
