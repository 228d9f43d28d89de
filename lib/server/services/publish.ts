import "server-only";
/** Publish package writes: texts and sections, the thumbnail, the script marked final. */
import type { PublishUpdate } from "../../schemas/publish";
import { db } from "../../../db/client";
import type { Episode } from "../../../db/schema";
import { lockEpisode } from "../../../db/queries/episode-lock";
import { getPublishPackage, upsertPublishPackage } from "../../../db/queries/publish";
import { listSegmentsByEpisode } from "../../../db/queries/script";
import { claimUpload } from "./uploads";
import { packageOrDefault, scriptFingerprint } from "../views/sponsors";
import { AppError } from "../http/errors";

export async function updatePublishPackage({ episode, userId, patch }: { episode: Episode; userId: string; patch: PublishUpdate }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episode.id);
    const { sections, ...rest } = patch;
    const current = packageOrDefault(await getPublishPackage({ episodeId: episode.id }), episode);
    return upsertPublishPackage(tx, episode.id, {
      ...rest,
      ...(sections ? { sections: { ...current.sections, ...sections } } : {}),
      // A new package keeps the episode's summary until someone writes another.
      ...(rest.summary === undefined ? { summary: current.summary } : {}),
      updatedBy: userId,
    });
  });
}

/** The thumbnail must be an upload this server issued to the channel for a thumbnail. */
export async function setThumbnail({ episode, userId, key }: { episode: Episode; userId: string; key: string | null }) {
  if (key !== null) {
    await claimUpload({ key, channelId: episode.channelId, purpose: "thumbnail", field: "key" });
  }
  const contentType = key ? (key.endsWith(".png") ? "image/png" : "image/jpeg") : null;
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episode.id);
    return upsertPublishPackage(tx, episode.id, { thumbnailKey: key, thumbnailContentType: contentType, ...(key === null ? { thumbnailAdLabel: false } : {}), updatedBy: userId });
  });
}

/** Marks the script final as it stands now (its segments and their versions), or takes the mark away. */
export async function markScriptFinal({ episode, userId, final }: { episode: Episode; userId: string; final: boolean }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episode.id);
    if (!final) return upsertPublishPackage(tx, episode.id, { scriptFinalFingerprint: null, scriptFinalAt: null, scriptFinalBy: null, updatedBy: userId });
    const segments = await listSegmentsByEpisode({ episodeId: episode.id });
    if (!segments.length) throw new AppError("unprocessable:script.empty", "The script has no segments to mark final.");
    const summary = (await getPublishPackage({ episodeId: episode.id }))?.summary ?? episode.summary;
    return upsertPublishPackage(tx, episode.id, { scriptFinalFingerprint: scriptFingerprint(segments), scriptFinalAt: new Date(), scriptFinalBy: userId, summary, updatedBy: userId });
  });
}
