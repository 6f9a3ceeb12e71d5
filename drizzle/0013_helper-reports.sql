CREATE TABLE "helper_reports" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"collection_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"animal_id" uuid,
	"animal_text" text DEFAULT '' NOT NULL,
	"note" text NOT NULL,
	"reported_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"sent_at" timestamp with time zone,
	"sent_to" text[] DEFAULT '{}' NOT NULL
);
--> statement-breakpoint
ALTER TABLE "helper_reports" ADD CONSTRAINT "helper_reports_collection_id_collections_id_fk" FOREIGN KEY ("collection_id") REFERENCES "public"."collections"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "helper_reports" ADD CONSTRAINT "helper_reports_animal_id_animals_id_fk" FOREIGN KEY ("animal_id") REFERENCES "public"."animals"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "helper_reports" ADD CONSTRAINT "helper_reports_reported_by_users_id_fk" FOREIGN KEY ("reported_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "helper_reports_collection_idx" ON "helper_reports" USING btree ("collection_id","created_at");