ALTER TABLE "animals" ADD COLUMN "mist_every_days" integer;--> statement-breakpoint
ALTER TABLE "animals" ADD COLUMN "moisten_every_days" integer;--> statement-breakpoint
ALTER TABLE "animals" ADD COLUMN "spot_clean_every_days" integer;--> statement-breakpoint
ALTER TABLE "animals" ADD COLUMN "enclosure_length_mm" integer;--> statement-breakpoint
ALTER TABLE "animals" ADD COLUMN "enclosure_width_mm" integer;--> statement-breakpoint
ALTER TABLE "animals" ADD COLUMN "enclosure_height_mm" integer;