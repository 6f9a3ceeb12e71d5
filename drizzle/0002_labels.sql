ALTER TABLE "animals" ADD COLUMN "clutch" text;--> statement-breakpoint
ALTER TABLE "collections" ADD COLUMN "label_tag" text;--> statement-breakpoint
-- Existing collections get a tag from the label alphabet (no O/0, I/1); md5 of the id keeps
-- it stable and a clash is vanishingly rare at this size (the unique constraint would say so).
UPDATE "collections" SET "label_tag" = (
  SELECT string_agg(substr('23456789ABCDEFGHJKLMNPQRSTUVWXYZ', 1 + (get_byte(decode(md5("id"::text), 'hex'), i) % 32), 1), '' ORDER BY i)
  FROM generate_series(0, 3) AS i
);--> statement-breakpoint
ALTER TABLE "collections" ALTER COLUMN "label_tag" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "collections" ADD CONSTRAINT "collections_label_tag" UNIQUE("label_tag");
