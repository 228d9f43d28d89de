CREATE TABLE "channel_revs" (
	"channel_id" uuid PRIMARY KEY NOT NULL,
	"rev" bigint DEFAULT 1 NOT NULL
);
--> statement-breakpoint
ALTER TABLE "channel_revs" ADD CONSTRAINT "channel_revs_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
-- Raises the board revision of the given channels (a row is made when missing).
CREATE OR REPLACE FUNCTION board_touch(p_ids uuid[]) RETURNS void LANGUAGE plpgsql AS $$
BEGIN
  IF cardinality(p_ids) = 0 THEN RETURN; END IF;
  INSERT INTO channel_revs (channel_id)
    SELECT c.id FROM channels c WHERE c.id = ANY(p_ids) ORDER BY c.id
  ON CONFLICT (channel_id) DO UPDATE SET rev = channel_revs.rev + 1;
END $$;
--> statement-breakpoint
-- An episode's figures changing changes its channel's board too.
CREATE OR REPLACE FUNCTION figures_touch(p_ids uuid[]) RETURNS void LANGUAGE plpgsql AS $$
BEGIN
  IF cardinality(p_ids) = 0 THEN RETURN; END IF;
  INSERT INTO episode_figures (episode_id)
    SELECT e.id FROM episodes e WHERE e.id = ANY(p_ids) ORDER BY e.id
  ON CONFLICT (episode_id) DO UPDATE SET rev = episode_figures.rev + 1;
  PERFORM board_touch(ARRAY(SELECT DISTINCT e.channel_id FROM episodes e WHERE e.id = ANY(p_ids)));
END $$;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION board_from_episodes() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    PERFORM board_touch(ARRAY(SELECT DISTINCT channel_id FROM old_rows));
  ELSE
    PERFORM board_touch(ARRAY(SELECT DISTINCT channel_id FROM new_rows));
  END IF;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE TRIGGER episodes_board_insert AFTER INSERT ON episodes REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION board_from_episodes();
--> statement-breakpoint
CREATE TRIGGER episodes_board_update AFTER UPDATE ON episodes REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION board_from_episodes();
--> statement-breakpoint
CREATE TRIGGER episodes_board_delete AFTER DELETE ON episodes REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION board_from_episodes();
