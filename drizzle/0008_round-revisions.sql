CREATE TABLE "collection_revisions" (
	"collection_id" uuid PRIMARY KEY NOT NULL,
	"records" bigint DEFAULT 0 NOT NULL,
	"events" bigint DEFAULT 0 NOT NULL
);
--> statement-breakpoint
-- Change counters for the round cache (schema/rounds.ts): statement-level triggers with
-- transition tables, so a statement bumps each collection it touched once, however many rows.
CREATE FUNCTION bump_records_by_collection() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  -- Ordered, so two transactions bumping several collections lock them in the same order.
  INSERT INTO collection_revisions AS r (collection_id, records)
  SELECT DISTINCT collection_id, 1 FROM (SELECT collection_id FROM changed) touched WHERE collection_id IS NOT NULL ORDER BY collection_id
  ON CONFLICT (collection_id) DO UPDATE SET records = r.records + 1;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE FUNCTION bump_events_by_collection() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  -- Ordered, so two transactions bumping several collections lock them in the same order.
  INSERT INTO collection_revisions AS r (collection_id, events)
  SELECT DISTINCT collection_id, 1 FROM (SELECT collection_id FROM changed) touched WHERE collection_id IS NOT NULL ORDER BY collection_id
  ON CONFLICT (collection_id) DO UPDATE SET events = r.events + 1;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE FUNCTION bump_records_by_round() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  -- Ordered, so two transactions bumping several collections lock them in the same order.
  INSERT INTO collection_revisions AS r (collection_id, records)
  SELECT DISTINCT collection_id, 1 FROM (SELECT rounds.collection_id FROM changed JOIN rounds ON rounds.id = changed.round_id) touched WHERE collection_id IS NOT NULL ORDER BY collection_id
  ON CONFLICT (collection_id) DO UPDATE SET records = r.records + 1;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE FUNCTION bump_records_by_id() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  -- Ordered, so two transactions bumping several collections lock them in the same order.
  INSERT INTO collection_revisions AS r (collection_id, records)
  SELECT DISTINCT collection_id, 1 FROM (SELECT id AS collection_id FROM changed) touched WHERE collection_id IS NOT NULL ORDER BY collection_id
  ON CONFLICT (collection_id) DO UPDATE SET records = r.records + 1;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE FUNCTION bump_events_by_user() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  -- Ordered, so two transactions bumping several collections lock them in the same order.
  INSERT INTO collection_revisions AS r (collection_id, events)
  SELECT DISTINCT collection_id, 1 FROM (SELECT memberships.collection_id FROM changed JOIN memberships ON memberships.user_id = changed.id) touched WHERE collection_id IS NOT NULL ORDER BY collection_id
  ON CONFLICT (collection_id) DO UPDATE SET events = r.events + 1;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE TRIGGER animals_revision_insert AFTER INSERT ON animals REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_records_by_collection();
--> statement-breakpoint
CREATE TRIGGER animals_revision_update AFTER UPDATE ON animals REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_records_by_collection();
--> statement-breakpoint
CREATE TRIGGER animals_revision_delete AFTER DELETE ON animals REFERENCING OLD TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_records_by_collection();
--> statement-breakpoint
CREATE TRIGGER locations_revision_insert AFTER INSERT ON locations REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_records_by_collection();
--> statement-breakpoint
CREATE TRIGGER locations_revision_update AFTER UPDATE ON locations REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_records_by_collection();
--> statement-breakpoint
CREATE TRIGGER locations_revision_delete AFTER DELETE ON locations REFERENCING OLD TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_records_by_collection();
--> statement-breakpoint
CREATE TRIGGER rounds_revision_insert AFTER INSERT ON rounds REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_records_by_collection();
--> statement-breakpoint
CREATE TRIGGER rounds_revision_update AFTER UPDATE ON rounds REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_records_by_collection();
--> statement-breakpoint
CREATE TRIGGER rounds_revision_delete AFTER DELETE ON rounds REFERENCING OLD TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_records_by_collection();
--> statement-breakpoint
CREATE TRIGGER handover_notes_revision_insert AFTER INSERT ON handover_notes REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_records_by_collection();
--> statement-breakpoint
CREATE TRIGGER handover_notes_revision_update AFTER UPDATE ON handover_notes REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_records_by_collection();
--> statement-breakpoint
CREATE TRIGGER handover_notes_revision_delete AFTER DELETE ON handover_notes REFERENCING OLD TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_records_by_collection();
--> statement-breakpoint
CREATE TRIGGER round_items_revision_insert AFTER INSERT ON round_items REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_records_by_round();
--> statement-breakpoint
CREATE TRIGGER round_items_revision_update AFTER UPDATE ON round_items REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_records_by_round();
--> statement-breakpoint
CREATE TRIGGER round_items_revision_delete AFTER DELETE ON round_items REFERENCING OLD TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_records_by_round();
--> statement-breakpoint
CREATE TRIGGER collections_revision_update AFTER UPDATE ON collections REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_records_by_id();
--> statement-breakpoint
CREATE TRIGGER events_revision_insert AFTER INSERT ON events REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_events_by_collection();
--> statement-breakpoint
CREATE TRIGGER events_revision_update AFTER UPDATE ON events REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_events_by_collection();
--> statement-breakpoint
CREATE TRIGGER events_revision_delete AFTER DELETE ON events REFERENCING OLD TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_events_by_collection();
--> statement-breakpoint
CREATE TRIGGER users_revision_update AFTER UPDATE ON users REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_events_by_user();
