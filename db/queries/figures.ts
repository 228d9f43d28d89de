import "server-only";
import { sql } from "drizzle-orm";
import { db } from "../client";

export interface StoredFigures {
  rev: number;
  computedRev: number | null;
  scriptSeconds: number | null;
  openGaps: number | null;
}

/** The stored board figures of a channel's episodes, with the revision each was computed at. */
export async function listEpisodeFiguresByChannel({ channelId }: { channelId: string }) {
  const r = await db().execute(sql`
    select f.episode_id, f.rev::float8 as rev, f.computed_rev::float8 as computed_rev, f.script_seconds, f.open_gaps
    from episode_figures f join episodes e on e.id = f.episode_id
    where e.channel_id = ${channelId}`);
  const out = new Map<string, StoredFigures>();
  for (const row of r.rows as { episode_id: string; rev: number; computed_rev: number | null; script_seconds: number | null; open_gaps: number | null }[])
    out.set(row.episode_id, { rev: row.rev, computedRev: row.computed_rev, scriptSeconds: row.script_seconds, openGaps: row.open_gaps });
  return out;
}

/**
 * Stores figures computed from data read after revision `rev` was seen. A row
 * whose revision has moved on since keeps its place (and stays stale), so
 * figures older than the data can never be kept.
 */
export async function storeEpisodeFigures(rows: { episodeId: string; rev: number; scriptSeconds: number | null; openGaps: number | null }[]) {
  if (!rows.length) return;
  await db().execute(sql`
    insert into episode_figures (episode_id, rev, computed_rev, script_seconds, open_gaps)
    select x.episode_id, x.rev, x.rev, x.script_seconds, x.open_gaps
    from jsonb_to_recordset(${JSON.stringify(rows.map((r) => ({ episode_id: r.episodeId, rev: r.rev, script_seconds: r.scriptSeconds, open_gaps: r.openGaps })))}::jsonb)
      as x(episode_id uuid, rev bigint, script_seconds int, open_gaps int)
    where exists (select 1 from episodes e where e.id = x.episode_id)
    order by x.episode_id
    on conflict (episode_id) do update
      set computed_rev = excluded.computed_rev, script_seconds = excluded.script_seconds, open_gaps = excluded.open_gaps
      where episode_figures.rev = excluded.computed_rev`);
}

/** The episode's revision of derived views (0 should its row be missing). */
export async function getEpisodeRev({ episodeId }: { episodeId: string }): Promise<number> {
  const r = await db().execute(sql`select rev::float8 as rev from episode_figures where episode_id = ${episodeId}`);
  return (r.rows[0] as { rev: number } | undefined)?.rev ?? 0;
}

/**
 * The channel's board revision: a digest of every (episode, rev) pair of its
 * episodes. Revisions only grow and episode ids are never reused, so the
 * digest changes with every episode added, changed or removed and never
 * comes back to an earlier value.
 */
export async function getChannelRev({ channelId }: { channelId: string }): Promise<string> {
  const r = await db().execute(sql`
    select md5(coalesce(string_agg(e.id::text || ':' || coalesce(f.rev, 0), ',' order by e.id), '')) as rev
    from episodes e left join episode_figures f on f.episode_id = e.id
    where e.channel_id = ${channelId}`);
  return (r.rows[0] as { rev: string }).rev;
}
