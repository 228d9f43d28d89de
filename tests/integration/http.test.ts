/**
 * Against the production build that `npm test` serves: real next-auth
 * sign-in, the PostgreSQL-backed throttle, health and OpenAPI.
 */
import { describe, expect, it } from "vitest";
import { makeWorld, PASSWORD } from "../support/fixtures";

const BASE = process.env.JIGBOARD_TEST_URL ?? "http://127.0.0.1:3100";

async function signIn(email: string, password: string, address = "203.0.113.7") {
  const csrfRes = await fetch(`${BASE}/api/auth/csrf`);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const cookie = csrfRes.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
  const res = await fetch(`${BASE}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie, "x-forwarded-for": address },
    body: new URLSearchParams({ email, password, csrfToken, json: "true" }),
  });
  const session = res.headers.getSetCookie().find((c) => c.startsWith("next-auth.session-token="));
  return { status: res.status, session: session?.split(";")[0], body: await res.text() };
}

describe("served app", () => {
  it("health reports database and storage", async () => {
    const r = await fetch(`${BASE}/api/health`);
    expect(r.status).toBe(200);
    expect(await r.json()).toEqual({ ok: true, database: { ok: true }, storage: { ok: true } });
  });

  it("serves the OpenAPI document", async () => {
    const doc = (await (await fetch(`${BASE}/api/openapi.json`)).json()) as { openapi: string; paths: Record<string, unknown> };
    expect(doc.openapi).toBe("3.1.0");
    expect(Object.keys(doc.paths)).toEqual(expect.arrayContaining(["/api/channels", "/api/episodes/{episodeId}", "/api/health"]));
  });

  it("every demo account signs in, and the session opens the API", async () => {
    for (const who of ["owner", "presenter", "editor", "producer", "sponsors", "outsider"]) {
      const r = await signIn(`${who}@jigboard.example`, "jigboard-demo", `198.51.100.${who.length}`);
      expect(r.session, who).toBeTruthy();
      const channels = await fetch(`${BASE}/api/channels`, { headers: { cookie: r.session! } });
      expect(channels.status).toBe(200);
      const body = (await channels.json()) as { channels: { name: string }[] };
      expect(body.channels.length).toBe(1);
    }
  });

  it("unauthenticated API calls are 401 over HTTP too", async () => {
    const r = await fetch(`${BASE}/api/channels`);
    expect(r.status).toBe(401);
    expect(((await r.json()) as { error: { code: string } }).error.code).toBe("unauthenticated");
  });

  // The test app runs with TRUST_PROXY=true, as behind a proxy: X-Forwarded-For names the client.
  it("five wrong passwords stop that account from that address only: the real user still signs in from theirs", async () => {
    const w = await makeWorld();
    const email = w.members.editor.email;
    for (let i = 0; i < 5; i++) expect((await signIn(email, "wrong-password", "192.0.2.10")).session).toBeUndefined();
    const blocked = await signIn(email, PASSWORD, "192.0.2.10");
    expect(blocked.status).toBe(429);
    const body = JSON.parse(blocked.body) as { error: { code: string; message: string } };
    expect(body.error.code).toBe("rate_limited:sign-in");
    expect(body.error.message).toMatch(/Try again in \d+ seconds/);
    // The attacker's address is stopped; the user's own address is not.
    expect((await signIn(email, PASSWORD, "198.51.100.23")).session).toBeTruthy();
  });

  it("many failures from many addresses slow the account down (a second, doubling, at most a minute) but never lock it", async () => {
    const w = await makeWorld();
    const email = w.members.producer.email;
    for (let i = 0; i < 10; i++) await signIn(email, "wrong", `192.0.2.${50 + i}`);
    const slowed = await signIn(email, PASSWORD, "198.51.100.77");
    expect(slowed.status).toBe(429);
    expect(JSON.parse(slowed.body).error.message).toMatch(/Wait \d+ seconds/);
    await new Promise((r) => setTimeout(r, 1100));
    expect((await signIn(email, PASSWORD, "198.51.100.77")).session).toBeTruthy();
  });

  it("sends security headers on pages and API answers, with a fresh script nonce that Next puts on its scripts", async () => {
    for (const path of ["/sign-in", "/api/health", "/api/channels"]) {
      const r = await fetch(`${BASE}${path}`);
      expect(r.headers.get("x-frame-options"), path).toBe("DENY");
      expect(r.headers.get("x-content-type-options")).toBe("nosniff");
      expect(r.headers.get("referrer-policy")).toBe("same-origin");
      expect(r.headers.get("permissions-policy")).toContain("camera=()");
      expect(r.headers.get("cross-origin-opener-policy")).toBe("same-origin");
      const csp = r.headers.get("content-security-policy") ?? "";
      expect(csp).toContain("frame-ancestors 'none'");
      expect(csp).toContain("object-src 'none'");
      expect(csp).not.toMatch(/script-src[^;]*'unsafe-inline'/);
    }
    const page = await fetch(`${BASE}/sign-in`);
    const nonce = /'nonce-([^']+)'/.exec(page.headers.get("content-security-policy") ?? "")?.[1];
    expect(nonce).toBeTruthy();
    const html = await page.text();
    const scripts = [...html.matchAll(/<script\b[^>]*>/g)].map((m) => m[0]);
    expect(scripts.length).toBeGreaterThan(0);
    for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`);
    const again = await fetch(`${BASE}/sign-in`);
    expect(again.headers.get("content-security-policy")).not.toContain(nonce!);
  });

  it("answers next-auth's odd inputs with a redirect or a 4xx, never a 500", async () => {
    for (const cb of ["\\\\evil.example", "%2F%2Fevil.example", "http://127.0.0.1:3917.evil.example/", "javascript:alert(1)", "//evil.example"]) {
      const r = await fetch(`${BASE}/api/auth/signin?callbackUrl=${encodeURIComponent(cb)}`, { redirect: "manual" });
      expect(r.status, cb).toBeLessThan(500);
      const loc = r.headers.get("location") ?? "";
      expect(loc, cb).not.toMatch(/evil\.example|javascript:/);
    }
    const get = await fetch(`${BASE}/api/auth/callback/credentials`, { redirect: "manual" });
    expect(get.status).toBeLessThan(500);
    const junk = await fetch(`${BASE}/api/auth/callback/credentials`, { method: "POST", redirect: "manual", headers: { "content-type": "application/json" }, body: "{" });
    expect(junk.status).toBeLessThan(500);
  });
});
