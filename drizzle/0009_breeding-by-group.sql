CREATE TYPE "public"."breeding_record" AS ENUM('egg_sac', 'egg_case', 'brood');--> statement-breakpoint
ALTER TABLE "egg_sacs" ADD COLUMN "kind" "breeding_record" DEFAULT 'egg_sac' NOT NULL;--> statement-breakpoint
ALTER TABLE "egg_sacs" ADD COLUMN "dispersed_on" date;--> statement-breakpoint
-- Records made before kinds existed follow their female's group (breedingModeOf).
UPDATE "egg_sacs" SET "kind" = CASE a."group" WHEN 'mantis' THEN 'egg_case'::"breeding_record" WHEN 'scorpion' THEN 'brood'::"breeding_record" WHEN 'centipede' THEN 'brood'::"breeding_record" ELSE 'egg_sac'::"breeding_record" END FROM "animals" a WHERE a."id" = "egg_sacs"."female_id";
