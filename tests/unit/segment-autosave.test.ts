// @vitest-environment happy-dom
/**
 * The script's autosave hook, driven as the editor drives it, against a
 * stand-in for the API that answers as the real route does (version checks,
 * 409 with the stored segment, no answer when offline). The behaviour under
 * test is common practice for collaborative editors, no published source.
 */
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { act, renderHook } from "@testing-library/react";
import { createElement, type ReactNode } from "react";
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { AUTOSAVE_DEBOUNCE_MS, OFFLINE_RETRY_MS, useSegmentAutosave } from "@/components/script/use-segment-autosave";
import type { SegmentDto } from "@/lib/schemas/script";

const seg = (over: Partial<SegmentDto> = {}): SegmentDto => ({
  id: "s1",
  position: 0,
  kind: "voice_over",
  text: "Glue the panel",
  stepId: null,
  pinnedStartFrame: null,
  explicitDurationFrames: null,
  editorNotes: "",
  chapterStart: false,
  chapterTitle: null,
  version: 1,
  updatedBy: null,
  updatedAt: "2026-12-01T10:00:00.000Z",
  ...over,
});

/** A stored segment and the PATCH route's rules; `offline` makes requests fail as a dropped network does. */
function fakeServer(initial: SegmentDto) {
  const state = { stored: initial, offline: false, requests: [] as Record<string, unknown>[], hold: null as null | Promise<void> };
  const fetchFn = vi.fn(async (_url: string, init: RequestInit) => {
    const body = JSON.parse(String(init.body)) as Record<string, unknown>;
    state.requests.push(body);
    if (state.hold) await state.hold;
    if (state.offline) throw new TypeError("Failed to fetch");
    if (body.version !== state.stored.version) {
      return new Response(JSON.stringify({ error: { code: "conflict:segment.version", message: "stale", current: state.stored } }), { status: 409 });
    }
    const { version: _v, ...fields } = body;
    state.stored = { ...state.stored, ...fields, version: state.stored.version + 1 };
    return new Response(JSON.stringify({ segment: state.stored }), { status: 200 });
  });
  return { state, fetchFn };
}

function mount(initial: SegmentDto) {
  const client = new QueryClient({ defaultOptions: { mutations: { retry: false } } });
  const wrapper = ({ children }: { children: ReactNode }) => createElement(QueryClientProvider, { client }, children);
  return renderHook(({ s }) => useSegmentAutosave(s), { wrapper, initialProps: { s: initial } });
}

const settle = async (ms = 0) => {
  await act(async () => {
    await vi.advanceTimersByTimeAsync(ms);
  });
};

let server: ReturnType<typeof fakeServer>;
beforeEach(() => {
  vi.useFakeTimers();
  server = fakeServer(seg());
  vi.stubGlobal("fetch", server.fetchFn);
});
afterEach(() => {
  vi.useRealTimers();
  vi.unstubAllGlobals();
});

describe("segment autosave", () => {
  it("waits for a pause in typing, then saves the last words once, based on the stored version", async () => {
    const { result } = mount(seg());
    act(() => result.current.change("Glue the panel and"));
    act(() => result.current.change("Glue the panel and clamp it"));
    expect(result.current.state).toBe("pending");
    await settle(AUTOSAVE_DEBOUNCE_MS - 1);
    expect(server.state.requests).toEqual([]);
    await settle(1);
    await settle();
    expect(server.state.requests).toEqual([{ version: 1, text: "Glue the panel and clamp it" }]);
    expect(result.current.state).toBe("saved");
    expect(result.current.base.version).toBe(2);
  });

  it("runs one segment's saves one at a time, each on the version the previous one stored", async () => {
    const { result } = mount(seg());
    let release!: () => void;
    server.state.hold = new Promise<void>((r) => (release = r));
    let a!: Promise<unknown>, b!: Promise<unknown>;
    act(() => {
      a = result.current.save({ kind: "to_camera" });
      b = result.current.save({ pinnedStartFrame: 300 });
    });
    await settle();
    // The second waits in the mutation scope until the first has its answer.
    expect(server.state.requests).toHaveLength(1);
    server.state.hold = null;
    release();
    await act(async () => {
      await Promise.all([a, b]);
    });
    expect(server.state.requests).toEqual([
      { version: 1, kind: "to_camera" },
      { version: 2, pinnedStartFrame: 300 },
    ]);
    expect(server.state.stored).toMatchObject({ version: 3, kind: "to_camera", pinnedStartFrame: 300 });
  });

  it("a save queued behind another uses the version the first one stored, however the answers interleave", async () => {
    const { result } = mount(seg());
    let a!: Promise<unknown>, b!: Promise<unknown>, c!: Promise<unknown>;
    act(() => {
      a = result.current.save({ text: "Glue" });
      b = result.current.save({ pinnedStartFrame: 1000 });
      c = result.current.save({ kind: "to_camera" });
    });
    await act(async () => {
      await Promise.all([a, b, c]);
    });
    expect(server.state.requests.map((r) => r.version)).toEqual([1, 2, 3]);
    expect(result.current.state).not.toBe("conflict");
  });

  it("sends words typed while a save was on its way right after it", async () => {
    const { result } = mount(seg());
    let release!: () => void;
    server.state.hold = new Promise<void>((r) => (release = r));
    act(() => result.current.change("Glue"));
    await settle(AUTOSAVE_DEBOUNCE_MS);
    act(() => result.current.change("Glue up"));
    let flushed!: Promise<SegmentDto | null>;
    act(() => {
      flushed = result.current.flush();
    });
    server.state.hold = null;
    release();
    await act(async () => {
      await flushed;
    });
    expect(server.state.requests.map((r) => r.text)).toEqual(["Glue", "Glue up"]);
    expect(result.current.state).toBe("saved");
  });

  it("on a stale version stops, offers a three-way merge, and saves the choice on the other writer's version", async () => {
    const { result } = mount(seg({ text: "Glue the panel." }));
    server.state.stored = seg({ text: "Glue the top panel.", version: 2 }); // someone else saved
    act(() => result.current.change("Glue the panel. Then clamp."));
    await settle(AUTOSAVE_DEBOUNCE_MS);
    await settle();
    expect(result.current.state).toBe("conflict");
    expect(result.current.conflict?.theirs.version).toBe(2);
    // node-diff3 merges the two edits of the common base.
    expect(result.current.conflict?.merged).toBe("Glue the top panel. Then clamp.");
    // No further save goes out while the conflict stands.
    act(() => result.current.change("Glue the panel. Then clamp. More"));
    await settle(AUTOSAVE_DEBOUNCE_MS);
    expect(server.state.requests).toHaveLength(1);
    await act(async () => {
      await result.current.resolve("Glue the top panel. Then clamp.");
    });
    expect(server.state.requests.at(-1)).toEqual({ version: 2, text: "Glue the top panel. Then clamp." });
    expect(result.current.state).toBe("saved");
    expect(result.current.conflict).toBeNull();
  });

  it("says offline when the network drops and saves on its own when it is back", async () => {
    const { result } = mount(seg());
    server.state.offline = true;
    act(() => result.current.change("Sand to 180"));
    await settle(AUTOSAVE_DEBOUNCE_MS);
    await settle();
    expect(result.current.state).toBe("offline");
    server.state.offline = false;
    await settle(OFFLINE_RETRY_MS);
    await settle();
    expect(result.current.state).toBe("saved");
    expect(server.state.stored.text).toBe("Sand to 180");
  });

  it("adopts a newer stored version from outside unless it holds unsaved words", async () => {
    const { result, rerender } = mount(seg());
    rerender({ s: seg({ text: "Rewritten elsewhere", version: 4 }) });
    expect(result.current.text).toBe("Rewritten elsewhere");
    act(() => result.current.change("My own words"));
    rerender({ s: seg({ text: "Again elsewhere", version: 5 }) });
    expect(result.current.text).toBe("My own words");
    expect(result.current.base.version).toBe(5);
  });
});
