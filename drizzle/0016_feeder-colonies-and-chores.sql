CREATE TABLE "chores" (
	"id" uuid PRIMARY KEY NOT NULL,
	"collection_id" uuid NOT NULL,
	"subject_kind" text NOT NULL,
	"subject_id" text NOT NULL,
	"kind" text NOT NULL,
	"payload" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"recorded_by" uuid,
	"device_id" text,
	"client_recorded_at" timestamp with time zone NOT NULL,
	"server_received_at" timestamp with time zone DEFAULT now() NOT NULL,
	"effective_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
CREATE TABLE "colonies" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"collection_id" uuid NOT NULL,
	"name" text NOT NULL,
	"species" text DEFAULT '' NOT NULL,
	"prey_type" text NOT NULL,
	"feed_every" integer,
	"water_gel_every" integer,
	"clean_every" integer,
	"split_every" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "colonies_collection_name" UNIQUE("collection_id","name")
);
--> statement-breakpoint
CREATE TABLE "colony_stock" (
	"colony_id" uuid NOT NULL,
	"prey_size" text NOT NULL,
	"count" integer DEFAULT 0 NOT NULL,
	"position" integer DEFAULT 0 NOT NULL,
	CONSTRAINT "colony_stock_colony_id_prey_size_pk" PRIMARY KEY("colony_id","prey_size"),
	CONSTRAINT "colony_stock_not_negative" CHECK ("colony_stock"."count" >= 0)
);
--> statement-breakpoint
CREATE TABLE "colony_stock_changes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"seq" bigserial NOT NULL,
	"colony_id" uuid NOT NULL,
	"prey_size" text NOT NULL,
	"delta" integer NOT NULL,
	"after" integer NOT NULL,
	"reason" text NOT NULL,
	"source_event_id" uuid,
	"note" text,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "colony_stock_changes_once" UNIQUE("source_event_id","colony_id","prey_size")
);
--> statement-breakpoint
ALTER TABLE "chores" ADD CONSTRAINT "chores_collection_id_collections_id_fk" FOREIGN KEY ("collection_id") REFERENCES "public"."collections"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "chores" ADD CONSTRAINT "chores_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "colonies" ADD CONSTRAINT "colonies_collection_id_collections_id_fk" FOREIGN KEY ("collection_id") REFERENCES "public"."collections"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "colony_stock" ADD CONSTRAINT "colony_stock_colony_id_colonies_id_fk" FOREIGN KEY ("colony_id") REFERENCES "public"."colonies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "colony_stock_changes" ADD CONSTRAINT "colony_stock_changes_colony_id_colonies_id_fk" FOREIGN KEY ("colony_id") REFERENCES "public"."colonies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "chores_subject_idx" ON "chores" USING btree ("collection_id","subject_kind","subject_id","kind");--> statement-breakpoint
CREATE INDEX "colonies_collection_idx" ON "colonies" USING btree ("collection_id");--> statement-breakpoint
CREATE INDEX "colony_stock_changes_colony_time_idx" ON "colony_stock_changes" USING btree ("colony_id","at");--> statement-breakpoint
CREATE INDEX "colony_stock_changes_source_idx" ON "colony_stock_changes" USING btree ("source_event_id");