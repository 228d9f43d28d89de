// @vitest-environment happy-dom
/**
 * The browser's multipart upload engine against a stand-in for the app's
 * upload routes and for storage's part PUTs (the same contract the
 * integration and e2e tests run against the real services). Concurrency,
 * retry with backoff, re-signing on 403, pause/resume through the stored
 * part list and reload-resume are S3 multipart practice as AWS documents it
 * for UploadPart/ListParts; the limits (4 at a time, 5 tries) are our own.
 */
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { CONCURRENCY, MAX_TRIES, Upload, type UploadState } from "@/components/footage/upload-engine";

const PART = 10;
type Behaviour = (part: number, attempt: number, url: string) => "ok" | "fail" | 403 | 400 | 503 | "hang";

function world(size: number) {
  const w = {
    stored: new Map<number, number>(),
    calls: [] as string[],
    signs: 0,
    attempts: new Map<number, number>(),
    inFlight: 0,
    maxInFlight: 0,
    behaviour: (() => "ok") as Behaviour,
    hanging: [] as FakeXhr[],
  };
  const partCount = Math.ceil(size / PART);
  const reply = (body: unknown, status = 200) => new Response(JSON.stringify(body), { status });
  vi.stubGlobal(
    "fetch",
    vi.fn(async (url: string, init: RequestInit = {}) => {
      const method = init.method ?? "GET";
      w.calls.push(`${method} ${url}`);
      if (method === "POST" && url === "/api/episodes/e1/uploads") return reply({ clip: { id: "c1" }, partSize: PART, partCount }, 201);
      if (method === "GET" && url === "/api/clips/c1/parts") return reply({ partSize: PART, partCount, parts: [...w.stored].map(([partNumber, s]) => ({ partNumber, size: s })) });
      if (method === "POST" && url === "/api/clips/c1/parts") {
        w.signs++;
        const { partNumbers } = JSON.parse(String(init.body)) as { partNumbers: number[] };
        return reply({ urls: partNumbers.map((n) => ({ partNumber: n, url: `https://store.test/p${n}?sig=${w.signs}` })) });
      }
      if (method === "POST" && url === "/api/clips/c1/complete") return reply({ clip: { id: "c1" } });
      if (method === "DELETE" && url === "/api/clips/c1") return reply({ ok: true });
      return reply({ error: { message: "unexpected" } }, 500);
    }),
  );

  class FakeXhr {
    status = 0;
    upload: { onprogress: ((e: { loaded: number }) => void) | null } = { onprogress: null };
    onload: (() => void) | null = null;
    onerror: (() => void) | null = null;
    onabort: (() => void) | null = null;
    private url = "";
    private done = false;
    open(_m: string, url: string) {
      this.url = url;
    }
    send(blob: Blob) {
      const n = Number(/\/p(\d+)\?/.exec(this.url)![1]);
      const attempt = (w.attempts.get(n) ?? 0) + 1;
      w.attempts.set(n, attempt);
      w.inFlight++;
      w.maxInFlight = Math.max(w.maxInFlight, w.inFlight);
      const b = w.behaviour(n, attempt, this.url);
      if (b === "hang") return void w.hanging.push(this);
      setTimeout(() => {
        if (this.done) return;
        this.done = true;
        w.inFlight--;
        if (b === "fail") return this.onerror?.();
        this.status = typeof b === "number" ? b : 200;
        if (this.status === 200) {
          this.upload.onprogress?.({ loaded: blob.size });
          w.stored.set(n, blob.size);
        }
        this.onload?.();
      }, 1);
    }
    abort() {
      if (this.done) return;
      this.done = true;
      w.inFlight--;
      this.onabort?.();
    }
  }
  vi.stubGlobal("XMLHttpRequest", FakeXhr);
  return w;
}

const file = (size: number) => new File([new Uint8Array(size)], "A001.mp4", { type: "video/mp4", lastModified: 1 });
const until = async (cond: () => boolean) => {
  for (let i = 0; i < 500 && !cond(); i++) await new Promise((r) => setTimeout(r, 2));
  expect(cond()).toBe(true);
};

beforeEach(() => localStorage.clear());
afterEach(() => vi.unstubAllGlobals());

describe("upload engine", () => {
  it("sends every part, at most four at a time, then completes and forgets the file", async () => {
    const w = world(95);
    const states: UploadState[] = [];
    const u = new Upload(file(95), "e1", (s) => states.push(s), null, 1);
    await u.start();
    expect(u.state.status).toBe("done");
    expect([...w.stored.keys()].sort((a, b) => a - b)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]);
    expect(w.stored.get(10)).toBe(5); // the last part is the remainder
    expect(w.maxInFlight).toBeLessThanOrEqual(CONCURRENCY);
    expect(w.maxInFlight).toBeGreaterThan(1);
    expect(w.calls.at(-1)).toBe("POST /api/clips/c1/complete");
    expect(u.state.sent).toBe(95);
    expect(localStorage.length).toBe(0);
    expect(states.map((s) => s.status)).toContain("uploading");
  });

  it("retries a failed part with backoff, and signs again when storage refuses an expired signature", async () => {
    const w = world(40);
    w.behaviour = (n, attempt) => (n === 2 && attempt <= 2 ? "fail" : n === 3 && attempt === 1 ? 403 : "ok");
    const u = new Upload(file(40), "e1", () => {}, null, 1);
    await u.start();
    expect(u.state.status).toBe("done");
    expect(w.attempts.get(2)).toBe(3);
    expect(w.attempts.get(3)).toBe(2);
    expect(w.signs).toBe(2); // one batch shared by the four workers, one for the refused signature
  });

  it("waits for storage that stops answering, says so, and goes on by itself when it is back", async () => {
    const w = world(20);
    // Part 2 meets a dead connection 7 times, then a 503, then storage is back.
    w.behaviour = (n, attempt) => (n !== 2 ? "ok" : attempt <= 7 ? "fail" : attempt === 8 ? 503 : "ok");
    const states: UploadState[] = [];
    const u = new Upload(file(20), "e1", (s) => states.push({ ...s }), null, 1);
    await u.start();
    expect(u.state.status).toBe("done");
    const waiting = states.find((s) => s.status === "waiting");
    expect(waiting?.error).toBe("Storage is not answering. The upload waits and goes on by itself when it is back.");
    expect(states.findIndex((s) => s.status === "uploading" && s.error === null && states.indexOf(waiting!) < states.indexOf(s))).toBeGreaterThan(-1);
    expect(w.attempts.get(2)).toBe(9);
  });

  it(`gives up on a part storage refuses ${MAX_TRIES} times and says how to go on`, async () => {
    const w = world(20);
    w.behaviour = (n) => (n === 2 ? 400 : "ok");
    const u = new Upload(file(20), "e1", () => {}, null, 1);
    await u.start();
    expect(u.state.status).toBe("error");
    expect(u.state.error).toMatch(/part 2 failed 5 times \(storage answered 400\).*Resume/);
    expect(w.attempts.get(2)).toBe(MAX_TRIES);
  });

  it("pause aborts the parts in flight; resume asks which parts are stored and sends only the rest", async () => {
    const w = world(60);
    w.behaviour = (n) => (n >= 3 ? "hang" : "ok");
    const u = new Upload(file(60), "e1", () => {}, null, 1);
    const running = u.start();
    await until(() => w.stored.size === 2 && w.hanging.length === 4);
    u.pause();
    await running;
    expect(u.state.status).toBe("paused");
    expect(w.inFlight).toBe(0);
    w.behaviour = () => "ok";
    const before = new Map(w.attempts);
    await u.resume();
    expect(u.state.status).toBe("done");
    expect(w.calls).toContain("GET /api/clips/c1/parts");
    // Parts 1 and 2 were stored before the pause and were not sent again.
    expect(w.attempts.get(1)).toBe(before.get(1));
    expect(w.attempts.get(2)).toBe(before.get(2));
    expect(w.stored.size).toBe(6);
  });

  it("after a reload, the same file continues the same upload instead of starting another", async () => {
    const w = world(50);
    w.behaviour = (n) => (n >= 3 ? "hang" : "ok");
    const first = new Upload(file(50), "e1", () => {}, null, 1);
    const running = first.start();
    await until(() => w.stored.size === 2);
    first.pause(); // the page goes away mid-upload
    await running;
    w.behaviour = () => "ok";
    w.calls.length = 0;
    const again = new Upload(file(50), "e1", () => {}, null, 1);
    await again.start();
    expect(again.state.resumed).toBe(true);
    expect(again.state.status).toBe("done");
    expect(w.calls).not.toContain("POST /api/episodes/e1/uploads");
    expect(w.stored.size).toBe(5);
  });

  it("cancel aborts the upload on the server and forgets the file", async () => {
    const w = world(30);
    w.behaviour = () => "hang";
    const u = new Upload(file(30), "e1", () => {}, null, 1);
    const running = u.start();
    await until(() => w.hanging.length > 0);
    await u.cancel();
    await running;
    expect(u.state.status).toBe("cancelled");
    expect(w.calls).toContain("DELETE /api/clips/c1");
    expect(localStorage.length).toBe(0);
  });
});
