CREATE TABLE "climate_readings" (
	"id" uuid PRIMARY KEY NOT NULL,
	"collection_id" uuid NOT NULL,
	"room" text NOT NULL,
	"taken_at" timestamp with time zone NOT NULL,
	"current_celsius" double precision,
	"min_celsius" double precision,
	"max_celsius" double precision,
	"humidity" double precision,
	"source" text NOT NULL,
	"recorded_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "climate_readings_humidity" CHECK ("climate_readings"."humidity" is null or "climate_readings"."humidity" between 0 and 100)
);
--> statement-breakpoint
CREATE TABLE "daily_mails" (
	"collection_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"local_date" date NOT NULL,
	"sent_at" timestamp with time zone,
	CONSTRAINT "daily_mails_collection_id_user_id_local_date_pk" PRIMARY KEY("collection_id","user_id","local_date")
);
--> statement-breakpoint
CREATE TABLE "room_targets" (
	"collection_id" uuid NOT NULL,
	"room" text NOT NULL,
	"min_celsius" double precision,
	"max_celsius" double precision,
	"min_humidity" double precision,
	"max_humidity" double precision,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "room_targets_collection_id_room_pk" PRIMARY KEY("collection_id","room")
);
--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "temperature_unit" text DEFAULT 'C' NOT NULL;--> statement-breakpoint
ALTER TABLE "climate_readings" ADD CONSTRAINT "climate_readings_collection_id_collections_id_fk" FOREIGN KEY ("collection_id") REFERENCES "public"."collections"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "climate_readings" ADD CONSTRAINT "climate_readings_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "daily_mails" ADD CONSTRAINT "daily_mails_collection_id_collections_id_fk" FOREIGN KEY ("collection_id") REFERENCES "public"."collections"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "daily_mails" ADD CONSTRAINT "daily_mails_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "room_targets" ADD CONSTRAINT "room_targets_collection_id_collections_id_fk" FOREIGN KEY ("collection_id") REFERENCES "public"."collections"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "climate_readings_room_idx" ON "climate_readings" USING btree ("collection_id","room","taken_at");--> statement-breakpoint
CREATE UNIQUE INDEX "climate_readings_logger_instant" ON "climate_readings" USING btree ("collection_id","room","taken_at") WHERE "climate_readings"."source" = 'logger';