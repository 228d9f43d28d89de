import { json } from "@/lib/server/http/api";
import { assertCan, assertCanMove } from "@/lib/server/access/access";
import { channelRoute } from "@/lib/server/http/route-builder";
import { AppError } from "@/lib/server/http/errors";
import { rateOf } from "@/lib/timecode";
import { episodeUpdateSchema } from "@/lib/schemas/episode";
import { archiveEpisode, toEpisodeDto, updateEpisode } from "@/db/queries/episodes";
import { recordAudit } from "@/db/queries/audit";
import { getMembership } from "@/db/queries/channels";

export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ episode }) => json({ episode: toEpisodeDto(episode) }));

/** Edits need episode.edit; a move is checked against the stages (editors move only within editing). */
export const PATCH = channelRoute({ load: "episode", action: ["episode.edit", "episode.move"], body: episodeUpdateSchema, what: "episode" }, async ({ episode, access, user, body: patch }) => {
  const { stage, position, ...fields } = patch;
  if (Object.keys(fields).length > 0) assertCan(access, "episode.edit");
  if (patch.presenterId && !(await getMembership({ userId: patch.presenterId, channelId: episode.channelId }))) {
    throw new AppError("unprocessable:episode.presenter", "The presenter must be a member of this channel.", { fields: { presenterId: ["not a member of this channel"] } });
  }
  const result = await updateEpisode({
    id: episode.id,
    channelId: episode.channelId,
    userId: user.id,
    patch,
    check: (current) => {
      if (stage !== undefined || position !== undefined) {
        assertCanMove(access, current.stage, stage ?? current.stage);
        if (current.archivedAt) throw new AppError("conflict:episode.archived", "This episode is archived; restore it before moving it.");
      }
      const rate = patch.frameRate ?? current.frameRate;
      const drop = patch.dropFrame ?? current.dropFrame;
      if (drop && rate !== "29.97" && rate !== "59.94") {
        throw new AppError("unprocessable:episode.dropFrame", "Drop-frame applies only at 29.97 and 59.94 fps.", {
          fields: { dropFrame: ["drop-frame applies only at 29.97 and 59.94 fps"] },
        });
      }
    },
    // Pins, fixed lengths, B-roll ranges, gaps and clip in/out points keep their time at the new rate.
    rates: (current) => (patch.frameRate && patch.frameRate !== current.frameRate ? { from: rateOf(current.frameRate), to: rateOf(patch.frameRate) } : null),
  });
  if (!result) throw new AppError("not_found:episode", "No such episode.");
  await recordAudit({
    channelId: episode.channelId,
    userId: user.id,
    action: stage !== undefined || position !== undefined ? "move" : "update",
    entity: "episode",
    entityId: episode.id,
    before: toEpisodeDto(result.before),
    after: toEpisodeDto(result.after),
  });
  return json({ episode: toEpisodeDto(result.after) });
});

/** Deleting an episode archives it; nothing is destroyed. */
export const DELETE = channelRoute({ load: "episode", action: "episode.archive" }, async ({ episode, user }) => {
  const row = await archiveEpisode({ id: episode.id, channelId: episode.channelId, userId: user.id });
  if (!row) throw new AppError("conflict:episode.archived", "This episode is already archived.");
  await recordAudit({ channelId: episode.channelId, userId: user.id, action: "archive", entity: "episode", entityId: episode.id });
  return json({ episode: toEpisodeDto(row) });
});
