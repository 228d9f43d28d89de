import "server-only";
import { env } from "../../env";
import { AppError } from "../http/errors";
import { countRecentFailures, recordSignInAttempt } from "../../../db/queries/auth";

/**
 * Throttles kept in PostgreSQL so they hold across app instances.
 *
 * Sign-in: N failures in the window for one account from one client address
 * stop that pair (an attacker's address), while the account as a whole only
 * slows down, with a delay that doubles from the 2N-th failure and never
 * exceeds a minute. So guessing is slow, and nobody can lock the real user
 * out from their own address.
 */
export function signInKeys(email: string, address: string): { pair: string; account: string } {
  const e = email.trim().toLowerCase();
  return { pair: `pair:${e}|${address}`, account: `account:${e}` };
}

/**
 * The client's address. The serving process (lib/server/http/serve.mjs) drops any
 * X-Forwarded-For a client sent unless TRUST_PROXY is set, and Next then fills
 * it from the socket; with a trusted proxy, the rightmost entry is the one it added.
 */
export function clientAddress(headers: Headers): string {
  const list = (headers.get("x-forwarded-for") ?? "").split(",").map((s) => s.trim()).filter(Boolean);
  const picked = env().TRUST_PROXY ? list[list.length - 1] : list[0];
  return picked || "unknown";
}

function limited(code: `rate_limited:${string}`, message: string, retryAfter: number): AppError {
  return new AppError(code, message, { headers: { "Retry-After": String(retryAfter) }, fields: { retryAfterSeconds: [String(retryAfter)] } });
}

export const ACCOUNT_MAX_DELAY_SECONDS = 60;

/** Seconds the account must wait after `failures` failures, the last at `last`: 0 below 2N, then 1, 2, 4 … capped. */
export function accountDelaySeconds(failures: number, max: number): number {
  if (failures < 2 * max) return 0;
  return Math.min(ACCOUNT_MAX_DELAY_SECONDS, 2 ** (failures - 2 * max));
}

export async function assertSignInAllowed(keys: { pair: string; account: string }): Promise<void> {
  const { SIGN_IN_MAX_FAILURES: max, SIGN_IN_WINDOW_SECONDS: windowSeconds } = env();
  const pair = await countRecentFailures({ key: keys.pair, windowSeconds });
  if (pair.failures >= max && pair.oldest) {
    const retryAfter = Math.max(1, Math.ceil((pair.oldest.getTime() + windowSeconds * 1000 - Date.now()) / 1000));
    throw limited("rate_limited:sign-in", `Too many failed sign-ins for this account from your address. Try again in ${retryAfter} seconds, or reset your password.`, retryAfter);
  }
  const account = await countRecentFailures({ key: keys.account, windowSeconds });
  const delay = accountDelaySeconds(account.failures, max);
  if (delay && account.newest) {
    const retryAfter = Math.ceil((account.newest.getTime() + delay * 1000 - Date.now()) / 1000);
    if (retryAfter > 0) throw limited("rate_limited:sign-in", `This account has had many failed sign-ins. Wait ${retryAfter} seconds before the next try.`, retryAfter);
  }
}

export async function recordSignIn(keys: { pair: string; account: string }, succeeded: boolean): Promise<void> {
  await recordSignInAttempt({ keys: [keys.pair, keys.account], succeeded });
}

const RESET_PER_ADDRESS = 3;
const RESET_PER_CLIENT = 10;
const RESET_WINDOW_SECONDS = 900;

/** Password-reset requests: a few per address asked about, and per client, in 15 minutes. */
export async function assertResetAllowed(keys: string[]): Promise<void> {
  for (const key of keys) {
    const max = key.startsWith("reset:") ? RESET_PER_ADDRESS : RESET_PER_CLIENT;
    const { failures, oldest } = await countRecentFailures({ key, windowSeconds: RESET_WINDOW_SECONDS });
    if (failures >= max && oldest) {
      const retryAfter = Math.max(1, Math.ceil((oldest.getTime() + RESET_WINDOW_SECONDS * 1000 - Date.now()) / 1000));
      throw limited("rate_limited:password-reset", `Too many reset requests. Try again in ${retryAfter} seconds.`, retryAfter);
    }
  }
}

export async function recordResetRequest(keys: string[]): Promise<void> {
  await recordSignInAttempt({ keys, succeeded: false });
}
