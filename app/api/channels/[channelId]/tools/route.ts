import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { toolCreateSchema } from "@/lib/schemas/build";
import { createTool, listToolsByChannel, sponsorBelongsToChannel } from "@/db/queries/tools";
import { toolDto } from "@/lib/server/views/plan";
import { AppError } from "@/lib/server/http/errors";
import { claimUpload } from "@/lib/server/services/uploads";

export const GET = channelRoute({ load: "channel", action: "channel.read" }, async ({ channelId }) => {
  return json({ tools: (await listToolsByChannel({ channelId })).map(toolDto) });
});

export const POST = channelRoute({ load: "channel", action: "tools.edit", body: toolCreateSchema, what: "tool" }, async ({ channelId, body }) => {
  const input = body;
  if (input.sponsorId && !(await sponsorBelongsToChannel({ sponsorId: input.sponsorId, channelId }))) {
    throw new AppError("unprocessable:tool.sponsor", "That sponsor is not one of this channel's.", { fields: { sponsorId: ["not a sponsor of this channel"] } });
  }
  if (input.photoKey) await claimUpload({ key: input.photoKey, channelId, purpose: "tool_photo", field: "photoKey" });
  return json({ tool: toolDto(await createTool({ channelId, input })) }, 201);
});
