import { afterEach, describe, expect, it, vi } from "vitest";
import { dropUntrustedForwarding } from "@/lib/server/http/forwarding.mjs";
import { accountDelaySeconds, ACCOUNT_MAX_DELAY_SECONDS, clientAddress, signInKeys } from "@/lib/server/infra/rate-limit";
import { resetEnvCache } from "@/lib/env";

afterEach(() => {
  vi.unstubAllEnvs();
  resetEnvCache();
});

describe("client address", () => {
  it("drops a client's own forwarding headers unless a proxy is trusted", () => {
    expect(dropUntrustedForwarding({ "x-forwarded-for": "6.6.6.6", "x-real-ip": "6.6.6.6", host: "a" }, false)).toEqual({ host: "a" });
    expect(dropUntrustedForwarding({ "x-forwarded-for": "6.6.6.6, 10.0.0.1" }, true)).toEqual({ "x-forwarded-for": "6.6.6.6, 10.0.0.1" });
  });

  it("takes the rightmost hop behind a trusted proxy, the socket's value otherwise", () => {
    vi.stubEnv("TRUST_PROXY", "true");
    resetEnvCache();
    // A client-supplied 6.6.6.6 followed by the address the proxy saw.
    expect(clientAddress(new Headers({ "x-forwarded-for": "6.6.6.6, 203.0.113.9" }))).toBe("203.0.113.9");
    vi.stubEnv("TRUST_PROXY", "false");
    resetEnvCache();
    // Not trusted: the server filled the header from the socket; it holds one value.
    expect(clientAddress(new Headers({ "x-forwarded-for": "127.0.0.1" }))).toBe("127.0.0.1");
    expect(clientAddress(new Headers())).toBe("unknown");
  });

  it("keys the hard limit by account and address together", () => {
    expect(signInKeys(" Ann@Example.com ", "203.0.113.9")).toEqual({ pair: "pair:ann@example.com|203.0.113.9", account: "account:ann@example.com" });
  });

  it("slows the account down from 2N failures, doubling, never past the cap (common practice, no published source)", () => {
    expect([9, 10, 11, 12, 13, 20, 40].map((f) => accountDelaySeconds(f, 5))).toEqual([0, 1, 2, 4, 8, ACCOUNT_MAX_DELAY_SECONDS, ACCOUNT_MAX_DELAY_SECONDS]);
  });
});
