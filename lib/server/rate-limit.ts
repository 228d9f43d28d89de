import "server-only";
import { env } from "../env";
import { AppError } from "./errors";
import { countRecentFailures, recordSignInAttempt } from "../../db/queries/auth";

/**
 * Sign-in throttling kept in PostgreSQL so it holds across app instances:
 * per account and per client address, N failures in a sliding window.
 */
export function signInKeys(email: string, address: string): string[] {
  return [`account:${email.trim().toLowerCase()}`, `address:${address}`];
}

export function clientAddress(headers: Headers): string {
  return headers.get("x-forwarded-for")?.split(",")[0]?.trim() || headers.get("x-real-ip") || "local";
}

export async function assertSignInAllowed(keys: string[]): Promise<void> {
  const { SIGN_IN_MAX_FAILURES: max, SIGN_IN_WINDOW_SECONDS: windowSeconds } = env();
  for (const key of keys) {
    const { failures, oldest } = await countRecentFailures({ key, windowSeconds });
    if (failures >= max && oldest) {
      const retryAfter = Math.max(1, Math.ceil((oldest.getTime() + windowSeconds * 1000 - Date.now()) / 1000));
      const who = key.startsWith("account:") ? "this account" : "your address";
      throw new AppError("rate_limited:sign-in", `Too many failed sign-ins for ${who}. Try again in ${retryAfter} seconds, or reset your password.`, {
        headers: { "Retry-After": String(retryAfter) },
        fields: { retryAfterSeconds: [String(retryAfter)] },
      });
    }
  }
}

export async function recordSignIn(keys: string[], succeeded: boolean): Promise<void> {
  await recordSignInAttempt({ keys, succeeded });
}
