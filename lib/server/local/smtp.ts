/**
 * The local SMTP fake: accepts every message on 127.0.0.1 and stores it in
 * PostgreSQL (mail_messages), where the dev mailbox page reads it. Nothing is
 * relayed anywhere.
 */
import { SMTPServer } from "smtp-server";
import { simpleParser, type AddressObject } from "mailparser";
import pg from "pg";
import crypto from "node:crypto";

export interface LocalSmtp {
  url: string;
  stop(): Promise<void>;
}

function addresses(a: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(a) ? a : a ? [a] : [];
  return list.flatMap((o) => o.value.map((v) => v.address ?? "")).filter(Boolean);
}

export async function startLocalSmtp(opts: { port: number; databaseUrl: string }): Promise<LocalSmtp> {
  const pool = new pg.Pool({ connectionString: opts.databaseUrl, max: 2 });
  const server = new SMTPServer({
    authOptional: true,
    // The bundled self-signed certificate has expired; local plain SMTP only.
    disabledCommands: ["STARTTLS", "AUTH"],
    logger: false,
    size: 10 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (mail) => {
          const to = addresses(mail.to);
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
          const uuidHeader = (name: string) => {
            const v = mail.headers.get(name);
            return typeof v === "string" && /^[0-9a-f-]{36}$/i.test(v.trim()) ? v.trim() : null;
          };
          const kind = mail.headers.get("x-jigboard-kind");
          const attachments = mail.attachments.map((a) => ({
            filename: a.filename ?? "",
            contentType: a.contentType,
            size: a.content.length,
            sha256: crypto.createHash("sha256").update(a.content).digest("hex"),
            base64: a.content.length <= 256 * 1024 ? a.content.toString("base64") : null,
          }));
          await pool.query(
            "insert into mail_messages (from_address, to_addresses, subject, text_body, html_body, channel_id, kind, ref_id, attachments) values ($1, $2, $3, $4, $5, $6, $7, $8, $9)",
            [
              addresses(mail.from)[0] ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : ""),
              to.length ? to : envelopeTo,
              mail.subject ?? "",
              mail.text ?? "",
              typeof mail.html === "string" ? mail.html : null,
              uuidHeader("x-jigboard-channel"),
              typeof kind === "string" ? kind.trim().slice(0, 40) : null,
              uuidHeader("x-jigboard-ref"),
              JSON.stringify(attachments),
            ],
          );
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(opts.port, "127.0.0.1", () => resolve());
  });
  return {
    url: `smtp://127.0.0.1:${opts.port}`,
    async stop() {
      await new Promise<void>((r) => server.close(() => r()));
      await pool.end();
    },
  };
}
