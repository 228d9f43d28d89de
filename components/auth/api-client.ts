import { ApiError, send } from "@/components/fetch-json";

/**
 * For the auth forms: the shared API helper, as a result instead of a throw.
 * Sign-in itself speaks next-auth's form protocol, not Jigboard's JSON API.
 */
export async function postJson<T = unknown>(url: string, body: unknown): Promise<{ ok: true; data: T } | { ok: false; status: number; message: string; fields?: Record<string, string[]> }> {
  try {
    return { ok: true, data: await send<T>(url, "POST", body) };
  } catch (e) {
    const err = e as ApiError;
    return { ok: false, status: err.status ?? 0, message: err.message, fields: err.fields };
  }
}

/** Signs in through next-auth's credentials endpoint, surfacing the throttle's 429 message. */
export async function signInWithPassword(email: string, password: string): Promise<{ ok: true } | { ok: false; message: string }> {
  const csrf = await fetch("/api/auth/csrf").then((r) => r.json() as Promise<{ csrfToken: string }>);
  const res = await fetch("/api/auth/callback/credentials", {
    method: "POST",
    headers: { "content-type": "application/x-www-form-urlencoded", "x-auth-return-redirect": "1" },
    body: new URLSearchParams({ email, password, csrfToken: csrf.csrfToken, json: "true", callbackUrl: "/" }),
  });
  if (res.status === 429) {
    const data = await res.json().catch(() => null);
    return { ok: false, message: data?.error?.message ?? "Too many attempts. Wait a little and try again." };
  }
  const data = (await res.json().catch(() => ({}))) as { url?: string };
  if (!res.ok || !data.url || new URL(data.url, window.location.origin).searchParams.get("error")) {
    return { ok: false, message: "That e-mail and password do not match an account." };
  }
  return { ok: true };
}
