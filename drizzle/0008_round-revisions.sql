CREATE TABLE "collection_revisions" (
	"collection_id" uuid PRIMARY KEY NOT NULL,
	"records" bigint DEFAULT 0 NOT NULL,
	"events" bigint DEFAULT 0 NOT NULL
);
--> statement-breakpoint
-- Change counters for the round cache (schema/rounds.ts): statement-level triggers with
-- transition tables, so a statement bumps each collection it touched once, however many rows.
-- Arguments: the counter to bump, and a query over the transition table "changed" that yields
-- the touched collection ids. Ordered, so two transactions lock their rows in the same order.
CREATE FUNCTION bump_collection_revision() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  EXECUTE format(
    'INSERT INTO collection_revisions AS r (collection_id, %1$I)
     SELECT DISTINCT collection_id, 1 FROM (%2$s) touched WHERE collection_id IS NOT NULL ORDER BY collection_id
     ON CONFLICT (collection_id) DO UPDATE SET %1$I = r.%1$I + 1',
    TG_ARGV[0], TG_ARGV[1]);
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE TRIGGER animals_revision_insert AFTER INSERT ON animals REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('records', 'SELECT collection_id FROM changed');
--> statement-breakpoint
CREATE TRIGGER animals_revision_update AFTER UPDATE ON animals REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('records', 'SELECT collection_id FROM changed');
--> statement-breakpoint
CREATE TRIGGER animals_revision_delete AFTER DELETE ON animals REFERENCING OLD TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('records', 'SELECT collection_id FROM changed');
--> statement-breakpoint
CREATE TRIGGER locations_revision_insert AFTER INSERT ON locations REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('records', 'SELECT collection_id FROM changed');
--> statement-breakpoint
CREATE TRIGGER locations_revision_update AFTER UPDATE ON locations REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('records', 'SELECT collection_id FROM changed');
--> statement-breakpoint
CREATE TRIGGER locations_revision_delete AFTER DELETE ON locations REFERENCING OLD TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('records', 'SELECT collection_id FROM changed');
--> statement-breakpoint
CREATE TRIGGER rounds_revision_insert AFTER INSERT ON rounds REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('records', 'SELECT collection_id FROM changed');
--> statement-breakpoint
CREATE TRIGGER rounds_revision_update AFTER UPDATE ON rounds REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('records', 'SELECT collection_id FROM changed');
--> statement-breakpoint
CREATE TRIGGER rounds_revision_delete AFTER DELETE ON rounds REFERENCING OLD TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('records', 'SELECT collection_id FROM changed');
--> statement-breakpoint
CREATE TRIGGER handover_notes_revision_insert AFTER INSERT ON handover_notes REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('records', 'SELECT collection_id FROM changed');
--> statement-breakpoint
CREATE TRIGGER handover_notes_revision_update AFTER UPDATE ON handover_notes REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('records', 'SELECT collection_id FROM changed');
--> statement-breakpoint
CREATE TRIGGER handover_notes_revision_delete AFTER DELETE ON handover_notes REFERENCING OLD TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('records', 'SELECT collection_id FROM changed');
--> statement-breakpoint
CREATE TRIGGER round_items_revision_insert AFTER INSERT ON round_items REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('records', 'SELECT rounds.collection_id FROM changed JOIN rounds ON rounds.id = changed.round_id');
--> statement-breakpoint
CREATE TRIGGER round_items_revision_update AFTER UPDATE ON round_items REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('records', 'SELECT rounds.collection_id FROM changed JOIN rounds ON rounds.id = changed.round_id');
--> statement-breakpoint
CREATE TRIGGER round_items_revision_delete AFTER DELETE ON round_items REFERENCING OLD TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('records', 'SELECT rounds.collection_id FROM changed JOIN rounds ON rounds.id = changed.round_id');
--> statement-breakpoint
CREATE TRIGGER collections_revision_update AFTER UPDATE ON collections REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('records', 'SELECT id AS collection_id FROM changed');
--> statement-breakpoint
CREATE TRIGGER events_revision_insert AFTER INSERT ON events REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('events', 'SELECT collection_id FROM changed');
--> statement-breakpoint
CREATE TRIGGER events_revision_update AFTER UPDATE ON events REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('events', 'SELECT collection_id FROM changed');
--> statement-breakpoint
CREATE TRIGGER events_revision_delete AFTER DELETE ON events REFERENCING OLD TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('events', 'SELECT collection_id FROM changed');
--> statement-breakpoint
CREATE TRIGGER users_revision_update AFTER UPDATE ON users REFERENCING NEW TABLE AS changed FOR EACH STATEMENT EXECUTE FUNCTION bump_collection_revision('events', 'SELECT memberships.collection_id FROM changed JOIN memberships ON memberships.user_id = changed.id');
