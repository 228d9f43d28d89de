import "server-only";
/**
 * Live updates across app instances. Each process keeps one PostgreSQL
 * connection that LISTENs on "jigboard_live"; triggers (migration 0012) write
 * every change to live_events and NOTIFY on commit, so a change committed
 * through any instance reaches the browsers connected to every instance.
 * The subscriber list is only the open connections of this process.
 */
import { EventEmitter } from "node:events";
import pg from "pg";
import { databaseConfig } from "../../../db/config";

export interface LiveEvent {
  /** Absent on presence events, which are not stored. */
  id?: number;
  channelId: string;
  episodeId: string | null;
  kind: string;
  op: string;
  count?: number;
  recordIds: string[];
  /** Presence: who is on which segment. */
  userId?: string;
  userName?: string;
  segmentId?: string | null;
}

export const LIVE_CHANNEL = "jigboard_live";

const g = globalThis as unknown as { __jigboardLive?: { bus: EventEmitter; client: pg.Client | null; connecting: Promise<void> | null } };

function hub() {
  if (!g.__jigboardLive) {
    const bus = new EventEmitter();
    bus.setMaxListeners(0);
    g.__jigboardLive = { bus, client: null, connecting: null };
  }
  return g.__jigboardLive;
}

/** Connects the listening client once; after an error it is made again on the next subscribe or after a short wait. */
async function ensureListening(): Promise<void> {
  const h = hub();
  if (h.client) return;
  if (h.connecting) return h.connecting;
  h.connecting = (async () => {
    const client = new pg.Client({ connectionString: databaseConfig().url });
    const drop = () => {
      if (h.client === client) h.client = null;
      client.end().catch(() => undefined);
      h.bus.emit("lost");
      // Come back by itself while anyone is listening.
      if (h.bus.listenerCount("event") > 0) setTimeout(() => void ensureListening().catch(() => undefined), 1000).unref();
    };
    client.on("error", drop);
    client.on("end", drop);
    client.on("notification", (n) => {
      if (n.channel !== LIVE_CHANNEL || !n.payload) return;
      try {
        h.bus.emit("event", JSON.parse(n.payload) as LiveEvent);
      } catch {
        /* a payload we did not write */
      }
    });
    await client.connect();
    await client.query(`listen ${LIVE_CHANNEL}`);
    h.client = client;
  })().finally(() => {
    h.connecting = null;
  });
  return h.connecting;
}

/** Calls `fn` for every live event of this process until the returned function is called. */
export async function subscribeLive(fn: (e: LiveEvent) => void, onLost?: () => void): Promise<() => void> {
  const h = hub();
  h.bus.on("event", fn);
  if (onLost) h.bus.on("lost", onLost);
  try {
    await ensureListening();
  } catch (e) {
    h.bus.off("event", fn);
    if (onLost) h.bus.off("lost", onLost);
    throw e;
  }
  return () => {
    h.bus.off("event", fn);
    if (onLost) h.bus.off("lost", onLost);
  };
}
