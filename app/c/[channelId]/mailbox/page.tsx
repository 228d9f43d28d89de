import { format } from "date-fns";
import { pageAccess } from "@/lib/server/access/page-access";
import { listMailMessagesForChannel } from "@/db/queries/mail";
import { env } from "@/lib/env";
import { Notice } from "@/components/ui/field";

export const metadata = { title: "Dev mailbox" };

function linkify(text: string) {
  return text.split(/(https?:\/\/\S+)/g).map((part, i) =>
    /^https?:\/\//.test(part) ? (
      <a key={i} href={part} className="break-all text-chalk-600 underline">
        {part}
      </a>
    ) : (
      <span key={i}>{part}</span>
    ),
  );
}

export default async function MailboxPage({ params }: { params: Promise<{ channelId: string }> }) {
  const { channelId } = await params;
  const access = await pageAccess(channelId, "mailbox.read", `/c/${channelId}/mailbox`);
  if (!env().DEV_MAILBOX) return <Notice>The dev mailbox is turned off: mail goes to the real SMTP server.</Notice>;
  if (!access.allowed) return <Notice tone="error">Only the channel owner can read the dev mailbox.</Notice>;
  const messages = await listMailMessagesForChannel({ channelId: access.channelId, limit: 100 });
  return (
    <div className="mx-auto max-w-3xl space-y-4">
      <h1 className="text-xl font-bold">Dev mailbox</h1>
      <p className="text-sm text-walnut-700">Everything the local mail server received, newest first. Only on machines running the local services.</p>
      {messages.length === 0 ? <p className="rounded-plank border border-dashed border-timber-400 p-4 text-sm">No mail yet. Invite someone or send a call sheet, and the message shows up here.</p> : null}
      <ol className="space-y-3">
        {messages.map((m) => (
          <li key={m.id} className="rounded-plank border border-timber-300 bg-white p-3" data-testid="mail-message">
            <p className="text-xs text-walnut-600">
              <span className="num">{format(m.receivedAt, "yyyy-MM-dd HH:mm:ss")}</span> · to {m.toAddresses.join(", ")}
            </p>
            <h2 className="font-medium">{m.subject}</h2>
            <pre className="mt-2 whitespace-pre-wrap font-sans text-sm">{linkify(m.textBody)}</pre>
            {m.attachments.length ? (
              <p className="mt-2 text-xs text-walnut-700" data-testid="mail-attachments">
                Attached: {m.attachments.map((a) => `${a.filename} (${a.contentType.split(";")[0]}, ${a.size} bytes)`).join(", ")}
              </p>
            ) : null}
          </li>
        ))}
      </ol>
    </div>
  );
}
