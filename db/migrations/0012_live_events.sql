CREATE TABLE "live_events" (
	"id" bigint PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "live_events_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 9223372036854775807 START WITH 1 CACHE 1),
	"channel_id" uuid NOT NULL,
	"episode_id" uuid,
	"kind" text NOT NULL,
	"op" text NOT NULL,
	"record_ids" text[] NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE INDEX "live_events_channel_idx" ON "live_events" USING btree ("channel_id","id");--> statement-breakpoint
-- One event per statement, channel and episode, with the changed rows' ids;
-- NOTIFY is delivered when the transaction commits, and never for one that
-- rolls back. Imports (jigboard.importing) announce nothing.
CREATE OR REPLACE FUNCTION live_announce(p_channel uuid, p_episode uuid, p_kind text, p_op text, p_ids text[]) RETURNS void LANGUAGE plpgsql AS $$
DECLARE ev_id bigint;
BEGIN
  INSERT INTO live_events (channel_id, episode_id, kind, op, record_ids)
    VALUES (p_channel, p_episode, p_kind, p_op, CASE WHEN cardinality(p_ids) > 100 THEN p_ids[1:100] ELSE p_ids END)
    RETURNING id INTO ev_id;
  PERFORM pg_notify('jigboard_live', json_build_object('id', ev_id, 'channelId', p_channel, 'episodeId', p_episode, 'kind', p_kind, 'op', p_op, 'count', cardinality(p_ids), 'recordIds', CASE WHEN cardinality(p_ids) > 100 THEN p_ids[1:100] ELSE p_ids END)::text);
END $$;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION live_from_episode_rows() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE r record;
BEGIN
  IF coalesce(current_setting('jigboard.importing', true), '') = 'on' THEN RETURN NULL; END IF;
  IF TG_OP = 'DELETE' THEN
    FOR r IN SELECT e.channel_id, o.episode_id, array_agg(o.id::text) AS ids FROM old_rows o JOIN episodes e ON e.id = o.episode_id GROUP BY e.channel_id, o.episode_id LOOP
      PERFORM live_announce(r.channel_id, r.episode_id, TG_TABLE_NAME, lower(TG_OP), r.ids);
    END LOOP;
  ELSE
    FOR r IN SELECT e.channel_id, n.episode_id, array_agg(n.id::text) AS ids FROM new_rows n JOIN episodes e ON e.id = n.episode_id GROUP BY e.channel_id, n.episode_id LOOP
      PERFORM live_announce(r.channel_id, r.episode_id, TG_TABLE_NAME, lower(TG_OP), r.ids);
    END LOOP;
  END IF;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION live_from_channel_rows() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE r record;
BEGIN
  IF coalesce(current_setting('jigboard.importing', true), '') = 'on' THEN RETURN NULL; END IF;
  IF TG_TABLE_NAME = 'episodes' THEN
    IF TG_OP = 'DELETE' THEN
      FOR r IN SELECT o.channel_id, array_agg(o.id::text) AS ids FROM old_rows o GROUP BY o.channel_id LOOP PERFORM live_announce(r.channel_id, NULL, TG_TABLE_NAME, lower(TG_OP), r.ids); END LOOP;
    ELSE
      FOR r IN SELECT n.channel_id, array_agg(n.id::text) AS ids FROM new_rows n GROUP BY n.channel_id LOOP PERFORM live_announce(r.channel_id, NULL, TG_TABLE_NAME, lower(TG_OP), r.ids); END LOOP;
    END IF;
  ELSE
    -- memberships: the record id is the member's user id
    IF TG_OP = 'DELETE' THEN
      FOR r IN SELECT o.channel_id, array_agg(o.user_id::text) AS ids FROM old_rows o GROUP BY o.channel_id LOOP PERFORM live_announce(r.channel_id, NULL, TG_TABLE_NAME, lower(TG_OP), r.ids); END LOOP;
    ELSE
      FOR r IN SELECT n.channel_id, array_agg(n.user_id::text) AS ids FROM new_rows n GROUP BY n.channel_id LOOP PERFORM live_announce(r.channel_id, NULL, TG_TABLE_NAME, lower(TG_OP), r.ids); END LOOP;
    END IF;
  END IF;
  RETURN NULL;
END $$;
--> statement-breakpoint
DO $$
DECLARE t text;
BEGIN
  FOREACH t IN ARRAY ARRAY['script_segments', 'shots', 'gaps', 'coverage_ranges', 'build_steps', 'shoot_log_notes'] LOOP
    EXECUTE format('CREATE TRIGGER %I AFTER INSERT ON %I REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION live_from_episode_rows()', t || '_live_insert', t);
    EXECUTE format('CREATE TRIGGER %I AFTER UPDATE ON %I REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION live_from_episode_rows()', t || '_live_update', t);
    EXECUTE format('CREATE TRIGGER %I AFTER DELETE ON %I REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION live_from_episode_rows()', t || '_live_delete', t);
  END LOOP;
  FOREACH t IN ARRAY ARRAY['episodes', 'memberships'] LOOP
    EXECUTE format('CREATE TRIGGER %I AFTER INSERT ON %I REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION live_from_channel_rows()', t || '_live_insert', t);
    EXECUTE format('CREATE TRIGGER %I AFTER UPDATE ON %I REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION live_from_channel_rows()', t || '_live_update', t);
    EXECUTE format('CREATE TRIGGER %I AFTER DELETE ON %I REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION live_from_channel_rows()', t || '_live_delete', t);
  END LOOP;
END $$;
