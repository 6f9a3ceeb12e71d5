ALTER TABLE "cover_reports" DROP CONSTRAINT "cover_reports_collection_day";--> statement-breakpoint
ALTER TABLE "cover_reports" ADD COLUMN "cover_id" uuid;--> statement-breakpoint
ALTER TABLE "invites" ADD COLUMN "revoked_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "cover_reports" ADD CONSTRAINT "cover_reports_cover_id_invites_id_fk" FOREIGN KEY ("cover_id") REFERENCES "public"."invites"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "cover_reports_collection_day" ON "cover_reports" USING btree ("collection_id","local_date") WHERE "cover_reports"."cover_id" is null;--> statement-breakpoint
CREATE UNIQUE INDEX "cover_reports_cover" ON "cover_reports" USING btree ("cover_id");