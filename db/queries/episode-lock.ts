import "server-only";
import { eq, sql } from "drizzle-orm";
import type { Tx } from "../client";
import { episodes } from "../schema";

/**
 * Every write to an episode's content (steps, cut list, script, shots) starts
 * here: it stamps the episode as updated and takes the episode's row lock
 * first, so all such writes take their locks in one order (episode, then its
 * rows) and cannot deadlock one another. It also serialises position
 * arithmetic (the next position in a list) within one episode.
 */
export async function touchEpisode(tx: Tx, episodeId: string) {
  await tx.update(episodes).set({ updatedAt: sql`now()` }).where(eq(episodes.id, episodeId));
}
