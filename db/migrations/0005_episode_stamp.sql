-- The episode's "updated" stamp follows its content: any statement that
-- inserts, updates or deletes rows of an episode's steps, cut list, script,
-- shots, clips, gaps or B-roll ranges stamps the episodes it touched. A
-- statement that changes no row stamps nothing, so a refused write leaves the
-- stamp as it was. Writers lock the episode row first (db/queries/episode-lock.ts),
-- so this update never waits for a lock the writer does not hold.
CREATE OR REPLACE FUNCTION stamp_episodes_from_new() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  UPDATE episodes SET updated_at = now() WHERE id IN (SELECT DISTINCT episode_id FROM new_rows);
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION stamp_episodes_from_old() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  UPDATE episodes SET updated_at = now() WHERE id IN (SELECT DISTINCT episode_id FROM old_rows);
  RETURN NULL;
END $$;
--> statement-breakpoint
DO $$
DECLARE t text;
BEGIN
  FOREACH t IN ARRAY ARRAY['build_steps', 'materials', 'script_segments', 'shots', 'clips', 'gaps', 'coverage_ranges'] LOOP
    EXECUTE format('CREATE TRIGGER %I AFTER INSERT ON %I REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION stamp_episodes_from_new()', t || '_stamp_insert', t);
    EXECUTE format('CREATE TRIGGER %I AFTER UPDATE ON %I REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION stamp_episodes_from_new()', t || '_stamp_update', t);
    EXECUTE format('CREATE TRIGGER %I AFTER DELETE ON %I REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION stamp_episodes_from_old()', t || '_stamp_delete', t);
  END LOOP;
END $$;
