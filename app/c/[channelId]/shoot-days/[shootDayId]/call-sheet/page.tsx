import { notFound } from "next/navigation";
import { z } from "zod";
import { pageAccess } from "@/lib/server/access/page-access";
import { getShootDayById } from "@/db/queries/shoot-days";
import { callSheetView } from "@/lib/server/views/shoot-days";
import { can } from "@/lib/permissions";
import { CallSheet } from "@/components/shoot-days/call-sheet";

export const metadata = { title: "Call sheet" };

export default async function CallSheetPage({ params }: { params: Promise<{ channelId: string; shootDayId: string }> }) {
  const { channelId, shootDayId } = await params;
  const access = await pageAccess(channelId, "channel.read", `/c/${channelId}/shoot-days/${shootDayId}/call-sheet`);
  const id = z.uuid().safeParse(shootDayId);
  const day = id.success ? await getShootDayById({ id: id.data }) : null;
  if (!day || day.channelId !== access.channelId) notFound();
  return <CallSheet sheet={await callSheetView(day)} canSend={can(access.roles, "schedule.edit")} />;
}
