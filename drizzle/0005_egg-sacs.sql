CREATE TABLE "egg_sacs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"collection_id" uuid NOT NULL,
	"female_id" uuid NOT NULL,
	"clutch" text NOT NULL,
	"laid_on" date NOT NULL,
	"pulled_on" date,
	"hatched_on" date,
	"egg_count" integer,
	"eggs_with_legs" integer,
	"sling_count" integer,
	"incubation_min_days" integer NOT NULL,
	"incubation_max_days" integer NOT NULL,
	"notes" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "collections" ADD COLUMN "incubation_min_days" integer DEFAULT 42 NOT NULL;--> statement-breakpoint
ALTER TABLE "collections" ADD COLUMN "incubation_max_days" integer DEFAULT 56 NOT NULL;--> statement-breakpoint
ALTER TABLE "egg_sacs" ADD CONSTRAINT "egg_sacs_collection_id_collections_id_fk" FOREIGN KEY ("collection_id") REFERENCES "public"."collections"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "egg_sacs" ADD CONSTRAINT "egg_sacs_female_id_animals_id_fk" FOREIGN KEY ("female_id") REFERENCES "public"."animals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "egg_sacs_collection_idx" ON "egg_sacs" USING btree ("collection_id","laid_on");