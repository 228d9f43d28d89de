import "server-only";
/**
 * Loads a record together with the caller's access to its channel. A record
 * of a channel the caller is not in answers exactly like a missing one (404).
 */
import type { Action } from "../../permissions";
import { AppError } from "../http/errors";
import { parseId } from "../http/api";
import { requireChannel } from "./access";
import { getEpisodeById } from "../../../db/queries/episodes";
import { getStepById } from "../../../db/queries/build";
import { getMaterialById } from "../../../db/queries/materials";
import { getToolById } from "../../../db/queries/tools";
import { getSegmentById } from "../../../db/queries/script";
import { getClipById } from "../../../db/queries/footage";
import { getShotById } from "../../../db/queries/shots";

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

export async function loadSegment(userId: string, rawId: string | undefined) {
  const id = parseId(rawId, "segment");
  const row = await getSegmentById({ id });
  if (!row) throw new AppError("not_found:segment", "No such script segment.");
  const access = await requireChannel(userId, row.channelId, "channel.read", "segment");
  return { segment: row.segment, channelId: row.channelId, access };
}

/** A clip of another channel is "not found", whatever its id or storage key. */
export async function loadClip(userId: string, rawId: string | undefined) {
  const id = parseId(rawId, "clip");
  const clip = await getClipById({ id });
  if (!clip) throw new AppError("not_found:clip", "No such clip.");
  const access = await requireChannel(userId, clip.channelId, "channel.read", "clip");
  const episode = (await getEpisodeById({ id: clip.episodeId }))!;
  return { clip, access, episode };
}

export async function loadShot(userId: string, rawId: string | undefined) {
  const id = parseId(rawId, "shot");
  const row = await getShotById({ id });
  if (!row) throw new AppError("not_found:shot", "No such shot.");
  const access = await requireChannel(userId, row.channelId, "channel.read", "shot");
  return { shot: row.shot, access };
}
