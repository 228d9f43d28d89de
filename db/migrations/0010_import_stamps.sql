-- A channel import writes rows exactly as they were exported, stamps included:
-- within its transaction it sets jigboard.importing, and the episode stamp
-- triggers leave the stamps alone.
CREATE OR REPLACE FUNCTION stamp_episodes_from_new() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF coalesce(current_setting('jigboard.importing', true), '') = 'on' THEN RETURN NULL; END IF;
  UPDATE episodes SET updated_at = now() WHERE id IN (SELECT DISTINCT episode_id FROM new_rows);
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION stamp_episodes_from_old() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF coalesce(current_setting('jigboard.importing', true), '') = 'on' THEN RETURN NULL; END IF;
  UPDATE episodes SET updated_at = now() WHERE id IN (SELECT DISTINCT episode_id FROM old_rows);
  RETURN NULL;
END $$;
