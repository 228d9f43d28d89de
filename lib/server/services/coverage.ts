import "server-only";
import { coverageFor } from "../views/coverage";
import type { Episode } from "../../../db/schema";
import { listOpenComputedGaps, resolveGaps } from "../../../db/queries/coverage";

/** After B-roll changes: kept computed gaps that B-roll now covers are marked resolved. */
export async function settleGaps(episode: Episode) {
  const [{ coverage }, open] = await Promise.all([coverageFor(episode), listOpenComputedGaps({ episodeId: episode.id })]);
  const closed = open.filter((g) => !coverage.stillComputed(g)).map((g) => g.id);
  await resolveGaps({ ids: closed });
  return closed.length;
}
