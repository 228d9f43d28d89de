import "server-only";
import { AppError } from "./errors";
import { parseId } from "./api";
import { requireChannel } from "./access";
import { getSegmentById } from "../../db/queries/script";

export async function loadSegment(userId: string, rawId: string | undefined) {
  const id = parseId(rawId, "segment");
  const row = await getSegmentById({ id });
  if (!row) throw new AppError("not_found:segment", "No such script segment.");
  const access = await requireChannel(userId, row.channelId, "channel.read", "segment");
  return { segment: row.segment, channelId: row.channelId, access };
}
