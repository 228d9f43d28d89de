import "server-only";
/**
 * Loads a record together with the caller's access to its channel. A record
 * of a channel the caller is not in answers exactly like a missing one (404).
 */
import type { Action } from "../permissions";
import { AppError } from "./errors";
import { parseId } from "./api";
import { requireChannel } from "./access";
import { getEpisodeById } from "../../db/queries/episodes";
import { getStepById } from "../../db/queries/build";
import { getMaterialById } from "../../db/queries/materials";
import { getToolById } from "../../db/queries/tools";

export async function loadEpisode(userId: string, rawId: string | undefined, action: Action = "channel.read") {
  const id = parseId(rawId, "episode");
  const episode = await getEpisodeById({ id });
  if (!episode) throw new AppError("not_found:episode", "No such episode.");
  const access = await requireChannel(userId, episode.channelId, "channel.read", "episode");
  if (action !== "channel.read") await requireChannel(userId, episode.channelId, action, "episode");
  return { episode, access };
}

export async function loadStep(userId: string, rawId: string | undefined) {
  const id = parseId(rawId, "step");
  const row = await getStepById({ id });
  if (!row) throw new AppError("not_found:step", "No such build step.");
  const access = await requireChannel(userId, row.channelId, "channel.read", "step");
  return { step: row.step, channelId: row.channelId, access };
}

export async function loadMaterial(userId: string, rawId: string | undefined) {
  const id = parseId(rawId, "material");
  const row = await getMaterialById({ id });
  if (!row) throw new AppError("not_found:material", "No such cut-list row.");
  const { episode, access } = await loadEpisode(userId, row.episodeId).catch(() => {
    throw new AppError("not_found:material", "No such cut-list row.");
  });
  return { material: row, episode, access };
}

export async function loadTool(userId: string, rawId: string | undefined) {
  const id = parseId(rawId, "tool");
  const tool = await getToolById({ id });
  if (!tool) throw new AppError("not_found:tool", "No such tool.");
  const access = await requireChannel(userId, tool.channelId, "channel.read", "tool");
  return { tool, access };
}
