import { json, parseBody, parseId, route, sessionUser } from "@/lib/server/api";
import { requireChannel } from "@/lib/server/access";
import { toolCreateSchema } from "@/lib/schemas/build";
import { createTool, listToolsByChannel, sponsorBelongsToChannel } from "@/db/queries/tools";
import { toolDto } from "@/lib/server/plan";
import { AppError } from "@/lib/server/errors";
import { claimUpload } from "@/lib/server/uploads";

type P = { channelId: string };

export const GET = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const channelId = parseId(params.channelId, "channel");
  await requireChannel(user.id, channelId, "channel.read");
  return json({ tools: (await listToolsByChannel({ channelId })).map(toolDto) });
});

export const POST = route<P>(async (req, params) => {
  const input = await parseBody(req, toolCreateSchema, "tool");
  const user = await sessionUser(req);
  const channelId = parseId(params.channelId, "channel");
  await requireChannel(user.id, channelId, "tools.edit");
  if (input.sponsorId && !(await sponsorBelongsToChannel({ sponsorId: input.sponsorId, channelId }))) {
    throw new AppError("unprocessable:tool.sponsor", "That sponsor is not one of this channel's.", { fields: { sponsorId: ["not a sponsor of this channel"] } });
  }
  if (input.photoKey) await claimUpload({ key: input.photoKey, channelId, purpose: "tool_photo", field: "photoKey" });
  return json({ tool: toolDto(await createTool({ channelId, input })) }, 201);
});
