import { channelRoute } from "@/lib/server/http/route-builder";
import { AppError } from "@/lib/server/http/errors";
import { liveQuerySchema } from "@/lib/schemas/shoot-log";
import { getEpisodeInChannel } from "@/db/queries/episodes";
import { getMembership } from "@/db/queries/channels";
import { listLiveEventsAfter } from "@/db/queries/live";
import { db } from "@/db/client";
import { subscribeLive, type LiveEvent } from "@/lib/server/infra/live";

export const dynamic = "force-dynamic";

/** Seconds between keep-alive comments (and membership checks) on a quiet stream (common practice for proxies that close idle connections, no published source). */
const HEARTBEAT_MS = 15_000;

/**
 * Server-sent events for the channel (or one episode of it): which records
 * changed, as they commit on any app instance. A reconnect with
 * Last-Event-ID first gets what it missed. Membership is checked on connect,
 * before every event and on every heartbeat; a member removed from the
 * channel gets "revoked" and the stream ends.
 */
export const GET = channelRoute({ load: "channel", action: "channel.read", query: liveQuerySchema }, async ({ channelId, user, req, query }) => {
  const episodeId = query.episodeId ?? null;
  if (episodeId && !(await getEpisodeInChannel(db(), episodeId, channelId))) throw new AppError("not_found:episode", "No such episode.");
  const after = Number(req.headers.get("last-event-id") ?? query.lastEventId ?? 0) || 0;
  const enc = new TextEncoder();
  const wanted = (e: LiveEvent) => e.channelId === channelId && (!episodeId || e.episodeId === null || e.episodeId === episodeId);
  let stop: () => void = () => undefined;
  let shutdown: () => void = () => undefined;

  const stream = new ReadableStream<Uint8Array>({
    async start(controller) {
      let open = true;
      let chain = Promise.resolve();
      const write = (text: string) => {
        if (open) controller.enqueue(enc.encode(text));
      };
      const close = () => {
        if (!open) return;
        open = false;
        stop();
        clearInterval(beat);
        try {
          controller.close();
        } catch {
          /* already closed by the client */
        }
      };
      const member = async () => Boolean(await getMembership({ userId: user.id, channelId }).catch(() => null));
      const revoke = () => {
        write(`event: revoked\ndata: {"reason":"not a member of this channel"}\n\n`);
        close();
      };
      const send = (e: LiveEvent) => {
        const data = JSON.stringify(e);
        write(e.id ? `id: ${e.id}\nevent: change\ndata: ${data}\n\n` : `event: ${e.kind}\ndata: ${data}\n\n`);
      };
      // Events are handled one after another, each after its own membership check, so order is kept.
      const onEvent = (e: LiveEvent) => {
        if (!wanted(e)) return;
        chain = chain.then(async () => {
          if (!open) return;
          if (!(await member())) return revoke();
          send(e);
        });
      };
      const beat = setInterval(() => {
        chain = chain.then(async () => {
          if (!open) return;
          if (!(await member())) return revoke();
          write(": keep-alive\n\n");
        });
      }, HEARTBEAT_MS);
      shutdown = close;
      req.signal.addEventListener("abort", close);
      write("retry: 2000\n\n");
      stop = await subscribeLive(onEvent, () => write(`event: lost\ndata: {}\n\n`));
      for (const row of after ? await listLiveEventsAfter({ channelId, afterId: after }) : []) {
        const e: LiveEvent = { id: row.id, channelId: row.channelId, episodeId: row.episodeId, kind: row.kind, op: row.op, recordIds: row.recordIds };
        if (wanted(e)) send(e);
      }
      write(`event: ready\ndata: {}\n\n`);
    },
    cancel() {
      shutdown();
      stop();
    },
  });
  return new Response(stream, { headers: { "content-type": "text/event-stream; charset=utf-8", "cache-control": "no-store, no-transform", connection: "keep-alive", "x-accel-buffering": "no" } });
});
