CREATE TABLE "episode_figures" (
	"episode_id" uuid PRIMARY KEY NOT NULL,
	"rev" bigint DEFAULT 1 NOT NULL,
	"computed_rev" bigint,
	"script_seconds" integer,
	"open_gaps" integer
);
--> statement-breakpoint
ALTER TABLE "episode_figures" ADD CONSTRAINT "episode_figures_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
-- Every episode has its row from the start, so the channel's list of
-- (episode, rev) changes with every episode added, changed or removed.
INSERT INTO "episode_figures" ("episode_id") SELECT "id" FROM "episodes" ON CONFLICT DO NOTHING;
--> statement-breakpoint
-- Raises the revision of the given episodes (a row is made when missing);
-- episodes already gone (a cascading delete) are skipped. Rows are locked in
-- id order.
CREATE OR REPLACE FUNCTION figures_touch(p_ids uuid[]) RETURNS void LANGUAGE plpgsql AS $$
BEGIN
  IF cardinality(p_ids) = 0 THEN RETURN; END IF;
  INSERT INTO episode_figures (episode_id)
    SELECT e.id FROM episodes e WHERE e.id = ANY(p_ids) ORDER BY e.id
  ON CONFLICT (episode_id) DO UPDATE SET rev = episode_figures.rev + 1;
END $$;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION figures_from_episode_rows() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    PERFORM figures_touch(ARRAY(SELECT DISTINCT episode_id FROM old_rows));
  ELSE
    PERFORM figures_touch(ARRAY(SELECT DISTINCT episode_id FROM new_rows));
  END IF;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION figures_from_episodes() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  PERFORM figures_touch(ARRAY(SELECT id FROM new_rows));
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION figures_from_users() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  PERFORM figures_touch(ARRAY(
    SELECT e.id FROM new_rows n JOIN old_rows o ON o.id = n.id JOIN episodes e ON e.presenter_id = n.id
    WHERE n.reading_rate_wpm IS DISTINCT FROM o.reading_rate_wpm));
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION figures_from_channels() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  PERFORM figures_touch(ARRAY(
    SELECT e.id FROM new_rows n JOIN old_rows o ON o.id = n.id JOIN episodes e ON e.channel_id = n.id
    WHERE (n.broll_gap_ms, n.to_camera_max_ms) IS DISTINCT FROM (o.broll_gap_ms, o.to_camera_max_ms)));
  RETURN NULL;
END $$;
--> statement-breakpoint
DO $$
DECLARE t text;
BEGIN
  FOREACH t IN ARRAY ARRAY['script_segments', 'coverage_ranges', 'gaps', 'shots'] LOOP
    EXECUTE format('CREATE TRIGGER %I AFTER INSERT ON %I REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION figures_from_episode_rows()', t || '_figures_insert', t);
    EXECUTE format('CREATE TRIGGER %I AFTER UPDATE ON %I REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION figures_from_episode_rows()', t || '_figures_update', t);
    EXECUTE format('CREATE TRIGGER %I AFTER DELETE ON %I REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION figures_from_episode_rows()', t || '_figures_delete', t);
  END LOOP;
  -- An episode's own row: any change, a board move or a new title included (its card shows them).
  CREATE TRIGGER episodes_figures_insert AFTER INSERT ON episodes REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION figures_from_episodes();
  CREATE TRIGGER episodes_figures_update AFTER UPDATE ON episodes REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION figures_from_episodes();
  CREATE TRIGGER users_figures_update AFTER UPDATE ON users REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION figures_from_users();
  CREATE TRIGGER channels_figures_update AFTER UPDATE ON channels REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION figures_from_channels();
END $$;
