import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { env } from "../../env";

const g = globalThis as unknown as { __jigboardMail?: Transporter };

function transport(): Transporter {
  if (!g.__jigboardMail) {
    const url = new URL(env().SMTP_URL);
    const local = url.hostname === "127.0.0.1" || url.hostname === "localhost";
    // The local fake speaks plain SMTP; real relays negotiate TLS as usual.
    g.__jigboardMail = nodemailer.createTransport({ url: env().SMTP_URL, ignoreTLS: local } as Parameters<typeof nodemailer.createTransport>[0]);
  }
  return g.__jigboardMail;
}

/** What sent a message: the local mail fake files it by these, so a channel's dev mailbox shows only its own mail. */
export interface MailTag {
  kind: "invitation" | "password_reset" | "call_sheet" | "review_link";
  channelId?: string;
  refId?: string;
}

export async function sendMail(msg: { to: string | string[]; subject: string; text: string; tag: MailTag; attachments?: { filename: string; content: string; contentType: string }[] }): Promise<void> {
  const { tag, ...rest } = msg;
  const headers: Record<string, string> = { "X-Jigboard-Kind": tag.kind };
  if (tag.channelId) headers["X-Jigboard-Channel"] = tag.channelId;
  if (tag.refId) headers["X-Jigboard-Ref"] = tag.refId;
  await transport().sendMail({ from: env().MAIL_FROM, ...rest, headers });
}

export function appUrl(path: string): string {
  return new URL(path, env().NEXTAUTH_URL).toString();
}
