import "server-only";
import { sql } from "drizzle-orm";
import { db } from "../client";
import type { MailMessage } from "../schema";

/**
 * The dev mailbox of one channel: only mail this channel's own actions sent:
 * its invitations while they are still pending (not accepted, revoked or
 * expired), and its call sheets. Password resets and other channels' mail
 * never show, whoever they were sent to.
 */
export async function listMailMessagesForChannel({ channelId, limit = 100 }: { channelId: string; limit?: number }): Promise<MailMessage[]> {
  const r = await db().execute(sql`
    select m.id, m.from_address, m.to_addresses, m.subject, m.text_body, m.html_body, m.channel_id, m.kind, m.ref_id, m.attachments, m.received_at
    from mail_messages m
    where m.channel_id = ${channelId}
      and (
        (m.kind = 'invitation' and exists (
          select 1 from invitations i
          where i.id = m.ref_id and i.channel_id = ${channelId} and i.accepted_at is null and i.revoked_at is null and i.expires_at > now()))
        or (m.kind = 'review_link' and exists (
          select 1 from guest_links g join deals d on d.id = g.deal_id
          where g.id = m.ref_id and d.channel_id = ${channelId}))
        or (m.kind = 'call_sheet' and exists (
          select 1 from call_sheet_sends c join shoot_days d on d.id = c.shoot_day_id
          where c.id = m.ref_id and d.channel_id = ${channelId}))
      )
    order by m.received_at desc
    limit ${limit}`);
  return (r.rows as Record<string, unknown>[]).map((row) => ({
    id: row.id as string,
    fromAddress: row.from_address as string,
    toAddresses: row.to_addresses as string[],
    subject: row.subject as string,
    textBody: row.text_body as string,
    htmlBody: (row.html_body as string | null) ?? null,
    channelId: (row.channel_id as string | null) ?? null,
    kind: (row.kind as string | null) ?? null,
    refId: (row.ref_id as string | null) ?? null,
    attachments: (row.attachments as MailMessage["attachments"]) ?? [],
    receivedAt: new Date(row.received_at as string),
  }));
}
