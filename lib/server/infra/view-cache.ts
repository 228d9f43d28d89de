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
 * own. One bound for all views (128 MB, least recently used first out); losing it
 * changes nothing but speed. The revision is also the ETag, so a client
 * holding the current body gets 304 without one.
 */
const views = new LRUCache<string, { bytes: number; value: unknown }>({ maxSize: 128_000_000, sizeCalculation: (v) => Math.max(1, v.bytes) });

/** The value kept under `key`, built (and kept) when there is none. */
async function remember<T>(key: string, build: () => Promise<{ bytes: number; value: T }>): Promise<T> {
  let hit = views.get(key);
  if (!hit) views.set(key, (hit = await build()));
  return hit.value as T;
}

export async function episodeViewResponse(req: Request, view: string, episodeId: string, build: () => Promise<unknown>): Promise<Response> {
  const rev = await getEpisodeRev({ episodeId });
  const etag = `W/"${view}-${episodeId}-${rev}"`;
  const headers = { etag, "cache-control": "private, no-cache" };
  if (ifNoneMatch(req.headers.get("if-none-match"), etag)) return jsonText(null, 304, headers);
  const body = await remember(`${view}:${episodeId}:${rev}`, async () => {
    const text = JSON.stringify(await build());
    return { bytes: 2 * text.length, value: text };
  });
  return jsonText(body, 200, headers);
}

function ifNoneMatch(header: string | null, etag: string): boolean {
  if (!header) return false;
  return header.split(",").some((t) => t.trim() === etag || t.trim() === "*");
}

/**
 * The same for a channel-wide view (the board) under the channel's revision
 * (a digest of its episodes' revisions): `build` runs only when the revision
 * moved on, and its result says its own size in bytes.
 */
export async function channelView<T>(view: string, channelId: string, variant: string, build: () => Promise<{ bytes: number; value: T }>): Promise<T> {
  return remember(`${view}:${channelId}:${variant}:${await getChannelRev({ channelId })}`, build);
}

/** For tests: forget every cached view. */
export function clearViewCache() {
  views.clear();
}
