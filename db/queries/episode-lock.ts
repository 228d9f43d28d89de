import "server-only";
import { eq } from "drizzle-orm";
import type { Tx } from "../client";
import { episodes } from "../schema";

/**
 * Every write to an episode's content (steps, cut list, script, shots,
 * coverage) starts here: it takes the episode's row lock before any of its
 * rows, so all such writes lock in one order (episode, then its rows) and
 * cannot deadlock one another, and position arithmetic within one episode is
 * serialised. The episode's "updated" stamp is set by database triggers when
 * its rows actually change (migration 0005), so a refused write, which
 * changes no row, leaves the stamp alone; the triggers' update of the episode
 * row needs no new lock, since this one already holds it.
 */
export async function lockEpisode(tx: Tx, episodeId: string) {
  await tx.select({ id: episodes.id }).from(episodes).where(eq(episodes.id, episodeId)).for("update");
}
