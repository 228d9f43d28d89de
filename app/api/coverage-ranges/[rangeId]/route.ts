import { json, parseId, route, sessionUser } from "@/lib/server/api";
import { requireChannel } from "@/lib/server/access";
import { deleteRange, getRangeById } from "@/db/queries/coverage";
import { getEpisodeById } from "@/db/queries/episodes";
import { settleGaps } from "@/lib/server/coverage-loader";
import { AppError } from "@/lib/server/errors";

type P = { rangeId: string };

export const DELETE = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const id = parseId(params.rangeId, "coverage range");
  const row = await getRangeById({ id });
  if (!row) throw new AppError("not_found:coverage range", "No such coverage range.");
  await requireChannel(user.id, row.channelId, "coverage.manage", "coverage range");
  await deleteRange({ id });
  await settleGaps((await getEpisodeById({ id: row.range.episodeId }))!);
  return json({ ok: true });
});
