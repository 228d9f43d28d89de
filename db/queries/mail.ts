import "server-only";
import { sql } from "drizzle-orm";
import { db } from "../client";
import type { MailMessage } from "../schema";

/**
 * The dev mailbox of one channel: only messages sent to its members or to
 * addresses it invited, so one channel's owner never reads another's links.
 */
export async function listMailMessagesForChannel({ channelId, limit = 100 }: { channelId: string; limit?: number }): Promise<MailMessage[]> {
  const r = await db().execute(sql`
    select m.id, m.from_address, m.to_addresses, m.subject, m.text_body, m.html_body, m.received_at
    from mail_messages m
    where m.to_addresses && (
      select coalesce(array_agg(email), '{}') from (
        select u.email from memberships ms join users u on u.id = ms.user_id where ms.channel_id = ${channelId}
        union select i.email from invitations i where i.channel_id = ${channelId}
      ) addresses
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
    receivedAt: new Date(row.received_at as string),
  }));
}
