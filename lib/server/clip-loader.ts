import "server-only";
import { AppError } from "./errors";
import { parseId } from "./api";
import { requireChannel } from "./access";
import { getClipById } from "../../db/queries/footage";
import { getShotById } from "../../db/queries/shots";
import { getEpisodeById } from "../../db/queries/episodes";

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
