import "server-only";
import type { EpisodeDto } from "../../schemas/episode";
import type { Episode } from "../../../db/schema";

/** An episode row as the API shows it (the shape of episodeSchema). */
export function toEpisodeDto(e: Episode): EpisodeDto {
  return {
    id: e.id,
    channelId: e.channelId,
    title: e.title,
    summary: e.summary,
    stage: e.stage,
    position: e.position,
    targetRuntimeSeconds: e.targetRuntimeSeconds,
    publishDate: e.publishDate,
    frameRate: e.frameRate,
    dropFrame: e.dropFrame,
    presenterId: e.presenterId,
    createdBy: e.createdBy,
    updatedBy: e.updatedBy,
    createdAt: e.createdAt.toISOString(),
    updatedAt: e.updatedAt.toISOString(),
    archivedAt: e.archivedAt ? e.archivedAt.toISOString() : null,
  };
}
