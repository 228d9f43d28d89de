import "server-only";
import { LRUCache } from "lru-cache";
import { getChannelRev, getEpisodeRev } from "../../../db/queries/figures";
import { jsonText } from "../http/api";

/**
 * Response bodies of an episode's derived views (the timed script, the shot
 * list), kept in this process under the episode's revision
 * (episode_figures.rev, raised by triggers in the same transaction as every
 * change to what the views read). Each request reads the revision from the
 * database first and builds from data read after it, so no instance serves a
 * body older than what is committed, and several instances each fill their
 * own. Bounded (64 MB of text, least recently used first out); losing it
 * changes nothing but speed. The revision is also the ETag, so a client
 * holding the current body gets 304 without one.
 */
const bodies = new LRUCache<string, string>({ maxSize: 64_000_000, sizeCalculation: (v) => Math.max(1, v.length) });

export async function episodeViewResponse(req: Request, view: string, episodeId: string, build: () => Promise<unknown>): Promise<Response> {
  const rev = await getEpisodeRev({ episodeId });
  const key = `${view}:${episodeId}:${rev}`;
  const etag = `W/"${view}-${episodeId}-${rev}"`;
  const headers = { etag, "cache-control": "private, no-cache" };
  if (ifNoneMatch(req.headers.get("if-none-match"), etag)) return jsonText(null, 304, headers);
  let body = bodies.get(key);
  if (body === undefined) bodies.set(key, (body = JSON.stringify(await build())));
  return jsonText(body, 200, headers);
}

function ifNoneMatch(header: string | null, etag: string): boolean {
  if (!header) return false;
  return header.split(",").some((t) => t.trim() === etag || t.trim() === "*");
}

/**
 * The same for a channel-wide view (the board) under the channel's revision
 * (a digest of its episodes' revisions): `build` runs only when the revision
 * moved on, and its result says its own size in characters.
 */
const channelViews = new LRUCache<string, { size: number; value: unknown }>({ maxSize: 64_000_000, sizeCalculation: (v) => Math.max(1, v.size) });

export async function channelView<T>(view: string, channelId: string, variant: string, build: () => Promise<{ size: number; value: T }>): Promise<T> {
  const rev = await getChannelRev({ channelId });
  const key = `${view}:${channelId}:${variant}:${rev}`;
  let hit = channelViews.get(key);
  if (!hit) channelViews.set(key, (hit = await build()));
  return hit.value as T;
}

/** For tests: forget every cached body. */
export function clearViewCache() {
  bodies.clear();
  channelViews.clear();
}
