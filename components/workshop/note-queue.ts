/**
 * Notes written at the bench wait here (IndexedDB, through idb-keyval) until
 * they reach the server. Each note carries the id made when it was written,
 * so sending it twice (a retry after a dropped connection) stores it once.
 */
import { createStore, del, entries, set } from "idb-keyval";

export interface QueuedNote {
  id: string;
  episodeId: string;
  text: string;
  stepId: string | null;
  notedAt: string;
  /** Why the last send failed, when it did. */
  error?: string;
}

let store: ReturnType<typeof createStore> | null = null;
const db = () => (store ??= createStore("jigboard-workshop", "notes"));

export async function enqueue(note: QueuedNote) {
  await set(note.id, note, db());
}

export async function queued(episodeId?: string): Promise<QueuedNote[]> {
  const all = (await entries<string, QueuedNote>(db())).map(([, v]) => v);
  return all.filter((n) => !episodeId || n.episodeId === episodeId).sort((a, b) => a.notedAt.localeCompare(b.notedAt));
}

/**
 * Sends every queued note, oldest first. A note leaves the queue only when
 * the server has it (201, or 200 for one it had already); a refusal (4xx)
 * stays with its reason, a network failure stops the round.
 */
export async function flush(send: (n: QueuedNote) => Promise<{ ok: boolean; status: number; message?: string }>): Promise<{ sent: number; left: number }> {
  let sent = 0;
  for (const n of await queued()) {
    let r: { ok: boolean; status: number; message?: string };
    try {
      r = await send(n);
    } catch {
      break;
    }
    if (r.ok) {
      await del(n.id, db());
      sent++;
    } else if (r.status === 0 || r.status >= 500) {
      break;
    } else {
      await set(n.id, { ...n, error: r.message ?? `refused (${r.status})` }, db());
    }
  }
  return { sent, left: (await queued()).length };
}
