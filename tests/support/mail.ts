import { sql } from "drizzle-orm";
import { db } from "../../db/client";

/** Waits for the SMTP fake to store a message to `to` and returns its text. */
export async function waitForMail(to: string, subjectPart: string, timeoutMs = 10_000): Promise<{ subject: string; text: string }> {
  const end = Date.now() + timeoutMs;
  while (Date.now() < end) {
    const r = await db().execute(
      sql`select subject, text_body from mail_messages where ${to} = any(to_addresses) and subject ilike ${"%" + subjectPart + "%"} order by received_at desc limit 1`,
    );
    const row = r.rows[0] as { subject: string; text_body: string } | undefined;
    if (row) return { subject: row.subject, text: row.text_body };
    await new Promise((res) => setTimeout(res, 100));
  }
  throw new Error(`no mail to ${to} about "${subjectPart}"`);
}

export function linkToken(text: string, pathPart: string): string {
  const m = new RegExp(`${pathPart}/([A-Za-z0-9_-]+)`).exec(text);
  if (!m) throw new Error(`no ${pathPart} link in: ${text}`);
  return m[1]!;
}
