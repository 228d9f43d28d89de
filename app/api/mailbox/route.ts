import { z } from "zod";
import { env } from "@/lib/env";
import { json, parseId } from "@/lib/server/http/api";
import { userRoute } from "@/lib/server/http/route-builder";
import { requireChannel } from "@/lib/server/access/access";
import { AppError } from "@/lib/server/http/errors";
import { listMailMessagesForChannel } from "@/db/queries/mail";
import type { MailDto } from "@/lib/schemas/account";

const query = z.object({ channelId: z.string() }).strict();

/** Dev only: what the local SMTP fake received. Off when DEV_MAILBOX=false. */
export const GET = userRoute({ query }, async ({ user, query: q }) => {
  if (!env().DEV_MAILBOX) throw new AppError("not_found:mailbox", "The dev mailbox is turned off here.");
  await requireChannel(user.id, parseId(q.channelId, "channel"), "mailbox.read");
  const rows = await listMailMessagesForChannel({ channelId: q.channelId, limit: 100 });
  const messages: MailDto[] = rows.map((m) => ({
    id: m.id,
    kind: m.kind,
    fromAddress: m.fromAddress,
    toAddresses: m.toAddresses,
    subject: m.subject,
    textBody: m.textBody,
    attachments: m.attachments.map(({ filename, contentType, size, sha256 }) => ({ filename, contentType, size, sha256 })),
    receivedAt: m.receivedAt.toISOString(),
  }));
  return json({ messages });
});
