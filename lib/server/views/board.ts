import "server-only";
import { listEpisodesByChannel } from "../../../db/queries/episodes";
import type { EpisodeListQuery } from "../../schemas/episode";
import { channelView } from "../infra/view-cache";
import { toEpisodeDto } from "./episode";
import { progressFigures, sponsorStates } from "./board-figures";

/**
 * The board response as JSON text: each card (episode and progress figures)
 * serialized once per board revision of the channel and kept; the sponsor
 * checks' state is read fresh on every request and spliced into the cards
 * that have one.
 */
export async function boardJson(channelId: string, query: EpisodeListQuery): Promise<string> {
  const variant = JSON.stringify([query.stage ?? null, query.month ?? null, query.archived === "true"]);
  const cards = await channelView("board", channelId, variant, async () => {
    const rows = await listEpisodesByChannel({ channelId, stage: query.stage, month: query.month, archived: query.archived === "true" });
    const figures = await progressFigures(rows);
    const value = rows.map((e) => ({ episode: e, json: JSON.stringify({ ...toEpisodeDto(e), ...figures.get(e.id) }) }));
    return { bytes: value.reduce((n, c) => n + 2 * c.json.length, 0), value };
  });
  const states = await sponsorStates(cards.map((c) => c.episode));
  const parts = cards.map((c) => {
    const state = states.get(c.episode.id);
    // Each card is a JSON object: the state goes in before its closing brace.
    return state ? `${c.json.slice(0, -1)},"sponsorState":${JSON.stringify(state)}}` : c.json;
  });
  return `{"episodes":[${parts.join(",")}]}`;
}
