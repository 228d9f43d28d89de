import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { env } from "../env";

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

export async function sendMail(msg: { to: string; subject: string; text: string }): Promise<void> {
  await transport().sendMail({ from: env().MAIL_FROM, ...msg });
}

export function appUrl(path: string): string {
  return new URL(path, env().NEXTAUTH_URL).toString();
}
