"use client";
import { useCallback } from "react";
import type { ApiError } from "@/components/fetch-json";
import { useWrite } from "@/components/use-write";

export type PostResult<T> = { ok: true; data: T } | { ok: false; status: number; message: string; fields?: Record<string, string[]> };

/**
 * For the auth forms: a write through the shared mutation path, as a result
 * instead of a throw. Sign-in itself speaks next-auth's form protocol, not
 * Jigboard's JSON API.
 */
export function usePostJson() {
  const write = useWrite();
  return useCallback(
    async <T = unknown>(url: string, body: unknown): Promise<PostResult<T>> => {
      try {
        return { ok: true, data: await write<T>(url, "POST", body) };
      } catch (e) {
        const err = e as ApiError;
        return { ok: false, status: err.status ?? 0, message: err.message, fields: err.fields };
      }
    },
    [write],
  );
}

/** Signs in through next-auth's credentials endpoint (its own form protocol, so a plain fetch), surfacing the throttle's 429 message. */
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
