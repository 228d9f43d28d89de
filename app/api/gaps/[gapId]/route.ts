import { json, parseBody, parseId, route, sessionUser } from "@/lib/server/api";
import { requireChannel } from "@/lib/server/access";
import { gapUpdateSchema } from "@/lib/schemas/footage";
import { getGapById, updateGap } from "@/db/queries/coverage";
import { AppError } from "@/lib/server/errors";

type P = { gapId: string };

export const PATCH = route<P>(async (req, params) => {
  const patch = await parseBody(req, gapUpdateSchema, "gap");
  const user = await sessionUser(req);
  const id = parseId(params.gapId, "gap");
  const row = await getGapById({ id });
  if (!row) throw new AppError("not_found:gap", "No such gap.");
  await requireChannel(user.id, row.channelId, "coverage.manage", "gap");
  const after = await updateGap({ id, patch });
  return json({ gap: { id: after!.id, status: after!.status, note: after!.note } });
});
