CREATE TABLE "animal_states" (
	"animal_id" uuid PRIMARY KEY NOT NULL,
	"collection_id" uuid NOT NULL,
	"state" jsonb NOT NULL,
	"last_event_at" timestamp with time zone,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "round_items" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"round_id" uuid NOT NULL,
	"animal_id" uuid NOT NULL,
	"sort_index" integer NOT NULL,
	"tasks" jsonb NOT NULL,
	"notes" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"carried_over_days" integer DEFAULT 0 NOT NULL,
	"added_during_day" boolean DEFAULT false NOT NULL,
	CONSTRAINT "round_items_round_animal" UNIQUE("round_id","animal_id")
);
--> statement-breakpoint
CREATE TABLE "rounds" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"collection_id" uuid NOT NULL,
	"local_date" date NOT NULL,
	"built_at" timestamp with time zone DEFAULT now() NOT NULL,
	"prep_list" jsonb DEFAULT '[]'::jsonb NOT NULL,
	CONSTRAINT "rounds_collection_date" UNIQUE("collection_id","local_date")
);
--> statement-breakpoint
ALTER TABLE "animal_states" ADD CONSTRAINT "animal_states_animal_id_animals_id_fk" FOREIGN KEY ("animal_id") REFERENCES "public"."animals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "animal_states" ADD CONSTRAINT "animal_states_collection_id_collections_id_fk" FOREIGN KEY ("collection_id") REFERENCES "public"."collections"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "round_items" ADD CONSTRAINT "round_items_round_id_rounds_id_fk" FOREIGN KEY ("round_id") REFERENCES "public"."rounds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "round_items" ADD CONSTRAINT "round_items_animal_id_animals_id_fk" FOREIGN KEY ("animal_id") REFERENCES "public"."animals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rounds" ADD CONSTRAINT "rounds_collection_id_collections_id_fk" FOREIGN KEY ("collection_id") REFERENCES "public"."collections"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "animal_states_collection_idx" ON "animal_states" USING btree ("collection_id");--> statement-breakpoint
CREATE INDEX "round_items_round_idx" ON "round_items" USING btree ("round_id","sort_index");