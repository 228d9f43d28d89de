import "server-only";
import { cache } from "react";
import { getToken } from "next-auth/jwt";
import { parse as parseCookie } from "cookie";
import { env } from "../../env";
import { AppError } from "../http/errors";
import { getUserById } from "../../../db/queries/users";

const SECURE_COOKIE = "__Secure-next-auth.session-token";
const PLAIN_COOKIE = "next-auth.session-token";

/**
 * Reads next-auth's JWT session cookie (chunked or not) from a Cookie header
 * with next-auth's own getToken: the user and the session version it was
 * signed with. Both cookie names are tried, so a session set over https
 * (secure name) and one set over plain http on 127.0.0.1 are both read.
 */
export async function sessionFromCookieHeader(header: string | null): Promise<{ sub: string; sv: number } | null> {
  if (!header) return null;
  const cookies = new Map(Object.entries(parseCookie(header)).filter((e): e is [string, string] => typeof e[1] === "string"));
  const req = { cookies, headers: {} } as unknown as Parameters<typeof getToken>[0]["req"];
  for (const cookieName of [SECURE_COOKIE, PLAIN_COOKIE]) {
    const payload = await getToken({ req, cookieName, secureCookie: cookieName === SECURE_COOKIE, secret: env().NEXTAUTH_SECRET }).catch(() => null);
    if (payload?.sub) return { sub: payload.sub, sv: typeof payload.sv === "number" ? payload.sv : 0 };
  }
  return null;
}

export interface SessionUser {
  id: string;
  email: string;
  name: string;
}

/** The signed-in user, re-read from the database so a removed account is out at once. */

export async function requireUser(cookieHeader: string | null): Promise<SessionUser> {
  const session = await sessionFromCookieHeader(cookieHeader);
  if (!session) throw new AppError("unauthenticated", "Sign in to continue.");
  const user = await getUserById({ id: session.sub });
  // A password change or "sign out everywhere" bumps the version: older sessions end here, on their next request.
  if (!user || user.sessionVersion !== session.sv) throw new AppError("unauthenticated", "Your session has ended. Sign in again.");
  return { id: user.id, email: user.email, name: user.name };
}

/**
 * For server components and server actions: reads the request's cookies.
 * Memoised for one render (React cache), so a layout and its page ask the
 * database once.
 */
export const currentUser = cache(async function currentUser(): Promise<SessionUser | null> {
  const { headers } = await import("next/headers");
  const h = await headers();
  try {
    return await requireUser(h.get("cookie"));
  } catch {
    return null;
  }
});
