/**
 * Builds isolated test worlds straight in the database: a channel with one
 * member per role, plus an outsider's channel. Each call makes new rows, so
 * files never depend on each other or on the demo seed.
 */
import crypto from "node:crypto";
import bcrypt from "bcryptjs";
import { encode } from "next-auth/jwt";
import { db } from "../../db/client";
import { channels, episodes, memberships, users } from "../../db/schema";
import type { Role } from "../../lib/roles";
import type { Stage } from "../../lib/stages";

export const PASSWORD = "correct-horse-battery";
const hash = bcrypt.hashSync(PASSWORD, 4);

export async function makeUser(label: string) {
  const email = `${label}-${crypto.randomUUID().slice(0, 8)}@test.example`;
  const [u] = await db().insert(users).values({ email, name: label, passwordHash: hash }).returning();
  return u!;
}

export async function makeWorld() {
  const [channel] = await db().insert(channels).values({ name: `Test channel ${crypto.randomUUID().slice(0, 6)}` }).returning();
  const [other] = await db().insert(channels).values({ name: `Other channel ${crypto.randomUUID().slice(0, 6)}` }).returning();
  const roleNames: Role[] = ["owner", "presenter", "editor", "producer", "sponsor_liaison"];
  const members = {} as Record<Role, Awaited<ReturnType<typeof makeUser>>>;
  for (const r of roleNames) {
    members[r] = await makeUser(r);
    await db().insert(memberships).values({ channelId: channel!.id, userId: members[r].id, roles: [r] });
  }
  const outsider = await makeUser("outsider");
  await db().insert(memberships).values({ channelId: other!.id, userId: outsider.id, roles: ["owner"] });
  return { channel: channel!, other: other!, members, outsider };
}

export async function makeEpisode(channelId: string, stage: Stage, position: number, title = `Episode ${position}`) {
  const [e] = await db().insert(episodes).values({ channelId, stage, position, title }).returning();
  return e!;
}

export async function cookieFor(userId: string): Promise<string> {
  const token = await encode({ token: { sub: userId }, secret: process.env.NEXTAUTH_SECRET! });
  return `next-auth.session-token=${token}`;
}

type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** Calls a route handler in-process with a real Request, as Next would. */
export async function call(
  handler: Handler,
  opts: { method?: string; path?: string; params?: Record<string, string>; body?: unknown; rawBody?: string; user?: { id: string } | null; headers?: Record<string, string> },
) {
  const headers: Record<string, string> = { "content-type": "application/json", ...opts.headers };
  if (opts.user) headers.cookie = await cookieFor(opts.user.id);
  const req = new Request(`http://127.0.0.1${opts.path ?? "/"}`, {
    method: opts.method ?? "GET",
    headers,
    body: opts.rawBody ?? (opts.body === undefined ? undefined : JSON.stringify(opts.body)),
  });
  const res = await handler(req, { params: Promise.resolve(opts.params ?? {}) });
  if ((res.headers.get("content-type") ?? "").startsWith("text/event-stream") && res.body) {
    // A live stream never ends by itself: read up to its "ready" (or "revoked") event, then hang up.
    const reader = res.body.getReader();
    const dec = new TextDecoder();
    let text = "";
    while (!/event: (ready|revoked)/.test(text)) {
      const { value, done } = await reader.read();
      if (done) break;
      text += dec.decode(value);
    }
    await reader.cancel();
    return { status: res.status, json: text as any, headers: res.headers };
  }
  const text = await res.text();
  let json: any = null;
  try {
    json = text ? JSON.parse(text) : null;
  } catch {
    json = text;
  }
  return { status: res.status, json, headers: res.headers };
}
