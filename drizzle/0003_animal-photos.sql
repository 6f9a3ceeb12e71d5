ALTER TABLE "animals" ADD COLUMN "photo_key" text;--> statement-breakpoint
ALTER TABLE "animals" ADD COLUMN "photo_updated_at" timestamp with time zone;