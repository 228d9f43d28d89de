import "server-only";
import { cache } from "react";
import { decode } from "next-auth/jwt";
import { env } from "../../env";
import { AppError } from "../http/errors";
import { getUserById } from "../../../db/queries/users";

const COOKIE_NAMES = ["__Secure-next-auth.session-token", "next-auth.session-token"];

function parseCookies(header: string | null): Map<string, string> {
  const map = new Map<string, string>();
  if (!header) return map;
  for (const part of header.split(";")) {
    const i = part.indexOf("=");
    if (i < 0) continue;
    map.set(part.slice(0, i).trim(), decodeURIComponent(part.slice(i + 1).trim()));
  }
  return map;
}

/** Reads next-auth's JWT session cookie (chunked or not) from a Cookie header: the user and the session version it was signed with. */
export async function sessionFromCookieHeader(header: string | null): Promise<{ sub: string; sv: number } | null> {
  const cookies = parseCookies(header);
  for (const name of COOKIE_NAMES) {
    let token = cookies.get(name);
    if (!token) {
      const chunks: string[] = [];
      for (let i = 0; cookies.has(`${name}.${i}`); i++) chunks.push(cookies.get(`${name}.${i}`)!);
      token = chunks.join("") || undefined;
    }
    if (!token) continue;
    try {
      const payload = await decode({ token, secret: env().NEXTAUTH_SECRET });
      if (payload?.sub) return { sub: payload.sub, sv: typeof payload.sv === "number" ? payload.sv : 0 };
    } catch {
      return null;
    }
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
