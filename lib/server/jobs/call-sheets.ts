import "server-only";
/** Delivering a queued call sheet: the mail with the day attached as an .ics event. Throws to let the queue retry. */
import { callSheetText, callSheetView, shootDayIcs } from "../views/shoot-days";
import { sendMail } from "../infra/mail";
import { getCallSheetSend, markCallSheetSend, getShootDayById } from "../../../db/queries/shoot-days";

export async function deliverCallSheet(sendId: string): Promise<"sent" | "gone"> {
  const send = await getCallSheetSend({ id: sendId });
  if (!send || send.status === "sent") return "gone";
  const day = await getShootDayById({ id: send.shootDayId });
  if (!day) return "gone";
  const sheet = await callSheetView(day);
  try {
    await sendMail({
      to: send.recipients,
      subject: `Call sheet: ${sheet.episodeTitle ?? sheet.channelName}, ${sheet.day.date}, call ${sheet.day.callTime}`,
      text: callSheetText(sheet),
      tag: { kind: "call_sheet", channelId: day.channelId, refId: send.id },
      attachments: [{ filename: `shoot-day-${sheet.day.date}.ics`, content: await shootDayIcs(day, sheet), contentType: "text/calendar; charset=utf-8; method=PUBLISH" }],
    });
  } catch (e) {
    await markCallSheetSend({ id: sendId, status: "queued", error: `not sent yet, will retry: ${(e as Error).message}` });
    throw e;
  }
  await markCallSheetSend({ id: sendId, status: "sent" });
  return "sent";
}
