ALTER TABLE "cover_reports" ADD COLUMN "sent_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "cover_reports" ADD COLUMN "sent_to" text[] DEFAULT '{}' NOT NULL;--> statement-breakpoint
-- Reports made before this migration were e-mailed as they were made: not sent again.
UPDATE "cover_reports" SET "sent_at" = "created_at" WHERE "subject" <> '';
