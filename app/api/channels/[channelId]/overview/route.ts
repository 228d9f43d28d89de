import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { AppError } from "@/lib/server/http/errors";
import { getChannelById } from "@/db/queries/channels";
import { overviewFor } from "@/lib/server/views/overview";

/** The channel at a glance: pipeline, shoot days, publish dates, open gaps, sponsor dates, runtime against target. */
export const GET = channelRoute({ load: "channel", action: "channel.read" }, async ({ channelId }) => {
  const channel = await getChannelById({ id: channelId });
  if (!channel) throw new AppError("not_found:channel", "No such channel.");
  return json(await overviewFor(channel));
});
