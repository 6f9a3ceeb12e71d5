CREATE TYPE "public"."animal_diet" AS ENUM('live_prey', 'fruit_jelly', 'plant', 'detritus');--> statement-breakpoint
ALTER TYPE "public"."life_stage" ADD VALUE 'first_instar' BEFORE 'sling';--> statement-breakpoint
ALTER TYPE "public"."life_stage" ADD VALUE 'larva' BEFORE 'juvenile';--> statement-breakpoint
ALTER TYPE "public"."life_stage" ADD VALUE 'pupa' BEFORE 'adult';--> statement-breakpoint
ALTER TABLE "animals" ADD COLUMN "diet" "animal_diet";