import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { toolUpdateSchema } from "@/lib/schemas/build";
import { archiveTool, sponsorBelongsToChannel, updateTool } from "@/db/queries/tools";
import { toolDto } from "@/lib/server/views/plan";
import { AppError } from "@/lib/server/http/errors";
import { claimUpload } from "@/lib/server/services/uploads";

export const PATCH = channelRoute({ load: "tool", action: "tools.edit", body: toolUpdateSchema, what: "tool" }, async ({ tool, body }) => {
  const patch = body;
  if (patch.sponsorId && !(await sponsorBelongsToChannel({ sponsorId: patch.sponsorId, channelId: tool.channelId }))) {
    throw new AppError("unprocessable:tool.sponsor", "That sponsor is not one of this channel's.", { fields: { sponsorId: ["not a sponsor of this channel"] } });
  }
  if (patch.photoKey && patch.photoKey !== tool.photoKey) await claimUpload({ key: patch.photoKey, channelId: tool.channelId, purpose: "tool_photo", field: "photoKey" });
  const row = await updateTool({ id: tool.id, channelId: tool.channelId, patch });
  if (!row) throw new AppError("not_found:tool", "No such tool.");
  return json({ tool: toolDto(row) });
});

/** Removing a tool archives it; steps that used it keep the link for the record. */
export const DELETE = channelRoute({ load: "tool", action: "tools.edit" }, async ({ tool }) => {
  const row = await archiveTool({ id: tool.id, channelId: tool.channelId });
  if (!row) throw new AppError("conflict:tool.archived", "This tool is already off the shelf.");
  return json({ ok: true });
});
