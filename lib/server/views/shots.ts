import "server-only";
import type { ClipDto, ShotDto } from "../../schemas/footage";
import type { Clip, Shot } from "../../../db/schema";

/** A shot as the API shows it (the shape of shotSchema). */
export function toShotDto(s: Shot): ShotDto {
  return {
    id: s.id,
    kind: s.kind,
    description: s.description,
    framing: s.framing,
    cameraNotes: s.cameraNotes,
    priority: s.priority,
    status: s.status,
    stepId: s.stepId,
    segmentId: s.segmentId,
    shootDayId: s.shootDayId,
    gapId: s.gapId,
    position: s.position,
  };
}

/** A clip as the API shows it (the shape of clipSchema). */
export function toClipDto(c: Clip): ClipDto {
  return {
    id: c.id,
    episodeId: c.episodeId,
    shotId: c.shotId,
    state: c.state,
    originalName: c.originalName,
    sizeBytes: c.sizeBytes,
    partSize: c.partSize,
    contentType: c.contentType,
    durationMs: c.durationMs,
    frameRate: c.frameRate,
    width: c.width,
    height: c.height,
    startTimecode: c.startTimecode,
    checksum: c.checksum,
    inFrame: c.inFrame,
    outFrame: c.outFrame,
    createdAt: c.createdAt.toISOString(),
  };
}
