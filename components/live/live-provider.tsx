"use client";
/**
 * One server-sent event stream per tab for the channel. Each change names
 * the table and records that changed; the queries that show them are
 * invalidated, so TanStack Query refetches what is on screen. Presence (who
 * is editing which segment) is kept here for the script editor.
 */
import { createContext, useContext, useEffect, useState } from "react";
import { useQueryClient, type QueryKey } from "@tanstack/react-query";

interface LiveChange {
  id?: number;
  channelId: string;
  episodeId: string | null;
  kind: string;
  op: string;
  recordIds: string[];
  userId?: string;
  userName?: string;
  segmentId?: string | null;
}

export type LiveState = "connecting" | "live" | "offline" | "revoked";
export interface Presence {
  userName: string;
  episodeId: string | null;
  segmentId: string | null;
}

const LiveContext = createContext<{ state: LiveState; presence: Record<string, Presence>; me: string }>({ state: "connecting", presence: {}, me: "" });

/** The queries a change makes stale. */
export function keysFor(e: LiveChange, channelId: string): QueryKey[] {
  const ep = e.episodeId;
  switch (e.kind) {
    case "episodes":
      return [["episodes", channelId], ["overview", channelId], ...e.recordIds.map((id) => ["publish", id])];
    case "script_segments":
      return ep ? [["script", ep], ["coverage", ep], ["publish", ep], ["sponsor-checks", ep], ["revisions", ep]] : [];
    case "shots":
      return ep ? [["shots", ep], ["publish", ep]] : [];
    case "gaps":
    case "coverage_ranges":
      return ep ? [["coverage", ep], ["publish", ep]] : [];
    case "build_steps":
      return ep ? [["plan", ep]] : [];
    case "shoot_log_notes":
      return ep ? [["shoot-log", ep]] : [];
    case "memberships":
      return [["members", channelId]];
    default:
      return [];
  }
}

export function LiveProvider({ channelId, me, children }: { channelId: string; me: string; children: React.ReactNode }) {
  const qc = useQueryClient();
  const [state, setState] = useState<LiveState>("connecting");
  const [presence, setPresence] = useState<Record<string, Presence>>({});

  useEffect(() => {
    if (typeof EventSource === "undefined") return;
    // The browser reconnects by itself and sends Last-Event-ID, so nothing committed meanwhile is missed.
    const es = new EventSource(`/api/channels/${channelId}/live`);
    es.addEventListener("ready", () => setState("live"));
    es.addEventListener("change", (m) => {
      const e = JSON.parse((m as MessageEvent).data) as LiveChange;
      for (const queryKey of keysFor(e, channelId)) void qc.invalidateQueries({ queryKey });
    });
    es.addEventListener("presence", (m) => {
      const e = JSON.parse((m as MessageEvent).data) as LiveChange;
      if (!e.userId || e.userId === me) return;
      setPresence((p) => ({ ...p, [e.userId!]: { userName: e.userName ?? "Someone", episodeId: e.episodeId, segmentId: e.segmentId ?? null } }));
    });
    es.addEventListener("revoked", () => {
      setState("revoked");
      es.close();
    });
    es.onerror = () => setState((s) => (s === "revoked" ? s : "offline"));
    return () => es.close();
  }, [channelId, me, qc]);

  return (
    <LiveContext.Provider value={{ state, presence, me }}>
      <p className="sr-only" role="status" data-testid="live-state" data-state={state}>
        {state === "live" ? "Live updates on" : state === "offline" ? "Live updates paused; reconnecting" : state === "revoked" ? "You are no longer a member of this channel" : ""}
      </p>
      {state === "revoked" ? (
        <div role="alert" className="mx-auto mt-2 max-w-[1600px] rounded-plank border-l-4 border-fault-700 bg-fault-50 px-3 py-2 text-sm" data-testid="live-revoked">
          You are no longer a member of this channel, so changes stop reaching you here. Ask the owner if this is a mistake.
        </div>
      ) : null}
      {children}
    </LiveContext.Provider>
  );
}

export function useLive() {
  return useContext(LiveContext);
}
