import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { callSheetSendSchema } from "@/lib/schemas/shoot";
import { sendCallSheet } from "@/lib/server/services/shoot-days";
import { callSheetView } from "@/lib/server/views/shoot-days";
import { recordAudit } from "@/db/queries/audit";

/** The call sheet: running order with times, shots per step, crew with call times, cautions, and every send. */
export const GET = channelRoute({ load: "shootDay", action: "channel.read" }, async ({ shootDay }) => json(await callSheetView(shootDay)));

/** Queues the call sheet to the crew and helpers (with the day as an .ics attachment); the job queue sends it. */
export const POST = channelRoute({ load: "shootDay", action: "schedule.edit", body: callSheetSendSchema, what: "call sheet" }, async ({ shootDay, channelId, user }) => {
  const send = await sendCallSheet({ day: shootDay, userId: user.id });
  await recordAudit({ channelId, userId: user.id, action: "send", entity: "call_sheet", entityId: send.id, after: { shootDayId: shootDay.id, recipients: send.recipients } });
  return json({ send: { id: send.id, recipients: send.recipients, status: send.status, queuedAt: send.queuedAt.toISOString() } }, 202);
});
