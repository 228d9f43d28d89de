"use client";
/**
 * The workshop view, for a phone held in one hand at the bench: today's shoot
 * day, the step being built with its cautions and the shots it needs, and the
 * shoot log. Notes go to a queue on the phone first and are sent from there,
 * so none is lost without a signal; the queue's state is always shown.
 */
import { useCallback, useEffect, useState } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { ApiError, fetchJson } from "@/components/fetch-json";
import { useWrite } from "@/components/use-write";
import { enqueue, flush, queued, type QueuedNote } from "./note-queue";
import type { NoteDto } from "@/lib/schemas/shoot-log";

export interface WorkshopStep {
  id: string;
  title: string;
  notes: string;
  activeMinutes: number;
  waitMinutes: number;
  waitReason: string;
  status: string;
  tools: string[];
  cautions: { signal: string; title: string; text: string }[];
  shots: { id: string; description: string; status: string }[];
}

interface Props {
  episodeId: string;
  title: string;
  today: { label: string; hours: string; status: string } | null;
  steps: WorkshopStep[];
  startIndex: number;
  defer: string;
  notes: NoteDto[];
  canNote: boolean;
  canShots: boolean;
  canScript: boolean;
}

const big = "jb-tap min-h-14 rounded-plank px-4 text-lg font-bold";

export function WorkshopView(p: Props) {
  const qc = useQueryClient();
  const write = useWrite({ scope: `workshop:${p.episodeId}` });
  const notesQ = useQuery({ queryKey: ["shoot-log", p.episodeId], queryFn: () => fetchJson<{ notes: NoteDto[] }>(`/api/episodes/${p.episodeId}/shoot-log`), initialData: { notes: p.notes }, retry: false });
  const [index, setIndex] = useState(Math.min(Math.max(0, p.startIndex), Math.max(0, p.steps.length - 1)));
  const [text, setText] = useState("");
  const [waiting, setWaiting] = useState<QueuedNote[]>([]);
  const [online, setOnline] = useState(true);
  const [shotState, setShotState] = useState<Record<string, string>>({});
  const step = p.steps[index];

  const refreshQueue = useCallback(async () => setWaiting(await queued(p.episodeId)), [p.episodeId]);

  const sendAll = useCallback(async () => {
    const r = await flush(async (n) => {
      try {
        await write(`/api/episodes/${n.episodeId}/shoot-log`, "POST", { id: n.id, text: n.text, stepId: n.stepId, notedAt: n.notedAt });
        return { ok: true, status: 201 };
      } catch (e) {
        return e instanceof ApiError ? { ok: false, status: e.status, message: e.message } : { ok: false, status: 0 };
      }
    });
    await refreshQueue();
    if (r.sent) await qc.invalidateQueries({ queryKey: ["shoot-log", p.episodeId] });
  }, [write, refreshQueue, qc, p.episodeId]);

  useEffect(() => {
    // The browser's flag can say online where the server cannot be reached (a workshop
    // network without a way out, a page opened from the worker's copy): ask the server too.
    const reach = async () => {
      if (!navigator.onLine) return setOnline(false);
      try {
        await fetchJson("/api/health");
        setOnline(true);
      } catch (e) {
        setOnline(!(e instanceof ApiError && e.status === 0));
      }
    };
    const update = () => {
      setOnline(navigator.onLine);
      void reach();
      if (navigator.onLine) void sendAll();
    };
    update();
    window.addEventListener("online", update);
    window.addEventListener("offline", update);
    // A send that failed without the browser noticing it was offline is tried again.
    const retry = setInterval(() => {
      void reach();
      void sendAll();
    }, 15_000);
    return () => {
      window.removeEventListener("online", update);
      window.removeEventListener("offline", update);
      clearInterval(retry);
    };
  }, [sendAll]);

  async function addNote() {
    const t = text.trim();
    if (!t) return;
    // Cleared at once, so the next note can be typed while this one is being kept (clearing later would wipe it).
    setText("");
    try {
      await enqueue({ id: crypto.randomUUID(), episodeId: p.episodeId, text: t, stepId: step?.id ?? null, notedAt: new Date().toISOString() });
    } catch {
      setText(t);
      return;
    }
    await refreshQueue();
    if (navigator.onLine) void sendAll();
  }

  async function convert(noteId: string, to: "to-script" | "to-pickup") {
    try {
      await write(`/api/shoot-log-notes/${noteId}/${to}`, "POST", to === "to-script" ? {} : undefined);
    } finally {
      await qc.invalidateQueries({ queryKey: ["shoot-log", p.episodeId] });
    }
  }

  async function toggleShot(id: string, status: string) {
    const next = status === "planned" ? "captured" : "planned";
    setShotState((m) => ({ ...m, [id]: next }));
    try {
      await write(`/api/shots/${id}`, "PATCH", { status: next });
    } catch {
      setShotState((m) => ({ ...m, [id]: status }));
    }
  }

  const stored = notesQ.data?.notes ?? [];
  const storedIds = new Set(stored.map((n) => n.id));
  const pending = waiting.filter((n) => !storedIds.has(n.id));

  return (
    <div className="mx-auto max-w-md space-y-4 pb-8" data-testid="workshop">
      <header className="space-y-1">
        <p className="text-sm text-walnut-700">{p.today ? `${p.today.label} · ${p.today.hours} · ${p.today.status}` : "No shoot day today"}</p>
        <h1 className="text-xl font-bold leading-tight">{p.title}</h1>
        <p className={`text-sm font-medium ${online ? "text-pass-700" : "text-heed-800"}`} data-testid="connection" role="status">
          {online ? "Online" : "No signal: notes are kept on this phone"}
        </p>
      </header>

      {step ? (
        <section aria-labelledby="ws-step" className="space-y-3 rounded-plank border border-timber-300 bg-white p-3">
          <p className="text-sm text-walnut-700">
            Step {index + 1} of {p.steps.length}
            {step.status !== "planned" ? ` · ${step.status.replace(/_/g, " ")}` : ""}
          </p>
          <h2 id="ws-step" className="text-2xl font-bold leading-snug">
            {step.title}
          </h2>
          <p className="num text-sm">
            {step.activeMinutes} min hands-on{step.waitMinutes ? ` · then wait ${step.waitMinutes >= 60 ? `${Math.round(step.waitMinutes / 60)} h` : `${step.waitMinutes} min`}${step.waitReason ? ` (${step.waitReason})` : ""}` : ""}
          </p>
          {step.tools.length ? <p className="text-sm">Tools: {step.tools.join(", ")}</p> : null}
          {step.notes ? <p className="whitespace-pre-line text-base">{step.notes}</p> : null}
          {step.cautions.length ? (
            <div className="space-y-2" data-testid="cautions">
              {step.cautions.map((c) => (
                <div key={c.title} role="note" className={`rounded-plank border-l-4 px-3 py-2 ${c.signal === "WARNING" ? "border-fault-700 bg-fault-50" : "border-heed-600 bg-heed-50"}`}>
                  <p className="font-bold">
                    {c.signal}: {c.title}
                  </p>
                  <p className="text-sm">{c.text}</p>
                </div>
              ))}
              <p className="text-xs text-walnut-700">{p.defer}</p>
            </div>
          ) : null}
          {step.shots.length ? (
            <fieldset className="space-y-1">
              <legend className="font-bold">Shots for this step</legend>
              {step.shots.map((s) => {
                const status = shotState[s.id] ?? s.status;
                return (
                  <label key={s.id} className="flex min-h-12 items-center gap-3 rounded-plank border border-timber-200 px-2 text-base">
                    <input type="checkbox" className="h-7 w-7" checked={status !== "planned"} disabled={!p.canShots || !online} onChange={() => void toggleShot(s.id, status)} />
                    <span>{s.description}</span>
                  </label>
                );
              })}
            </fieldset>
          ) : null}
          <div className="flex gap-2">
            <button type="button" className={`${big} flex-1 border border-timber-300 bg-white`} disabled={index === 0} onClick={() => setIndex((i) => Math.max(0, i - 1))}>
              ← Previous
            </button>
            <button type="button" className={`${big} flex-1 border border-timber-300 bg-white`} disabled={index >= p.steps.length - 1} onClick={() => setIndex((i) => Math.min(p.steps.length - 1, i + 1))}>
              Next →
            </button>
          </div>
        </section>
      ) : (
        <p className="rounded-plank border border-dashed border-timber-400 bg-white p-3">This episode has no build steps yet.</p>
      )}

      <section aria-labelledby="ws-log" className="space-y-2 rounded-plank border border-timber-300 bg-white p-3">
        <h2 id="ws-log" className="text-lg font-bold">
          Shoot log
        </h2>
        {p.canNote ? (
          <>
            <label htmlFor="ws-note" className="block text-sm font-medium">
              Note{step ? ` (step ${index + 1})` : ""}
            </label>
            <textarea id="ws-note" rows={3} className="w-full rounded-plank border border-timber-300 p-2 text-lg" value={text} onChange={(e) => setText(e.target.value)} placeholder="What happened, what to do next time" />
            <button type="button" className={`${big} w-full border border-chalk-700 bg-chalk-600 text-white`} disabled={!text.trim()} onClick={() => void addNote()}>
              Save note
            </button>
          </>
        ) : null}
        <p className={`text-sm font-medium ${pending.length ? "text-heed-800" : "text-pass-700"}`} role="status" data-testid="queue-state" data-waiting={pending.length}>
          {pending.length ? `${pending.length} ${pending.length === 1 ? "note" : "notes"} waiting to send${online ? "…" : "; they go when the signal is back"}` : "All notes saved"}
        </p>
        <ul className="divide-y divide-timber-200" data-testid="notes">
          {pending.map((n) => (
            <li key={n.id} className="py-2" data-state="waiting">
              <p className="text-xs text-heed-800">Waiting · {new Date(n.notedAt).toLocaleTimeString("en-GB", { hour: "2-digit", minute: "2-digit" })}{n.error ? ` · ${n.error}` : ""}</p>
              <p>{n.text}</p>
            </li>
          ))}
          {stored.map((n) => (
            <li key={n.id} className="py-2" data-state="saved">
              <p className="text-xs text-walnut-700">
                {new Date(n.notedAt).toLocaleTimeString("en-GB", { hour: "2-digit", minute: "2-digit" })}
                {n.authorName ? ` · ${n.authorName}` : ""}
                {n.stepId ? ` · ${p.steps.find((s) => s.id === n.stepId)?.title ?? "a step"}` : ""}
              </p>
              <p>{n.text}</p>
              <div className="mt-1 flex flex-wrap gap-2 text-sm">
                {n.segmentId ? <span className="text-pass-700">In the script</span> : p.canScript ? (
                  <button type="button" className="jb-tap rounded-plank border border-timber-300 px-3 py-1" disabled={!online} onClick={() => void convert(n.id, "to-script")}>
                    Make it a voice-over
                  </button>
                ) : null}
                {n.shotId ? <span className="text-pass-700">Pickup on the shot list</span> : p.canShots ? (
                  <button type="button" className="jb-tap rounded-plank border border-timber-300 px-3 py-1" disabled={!online} onClick={() => void convert(n.id, "to-pickup")}>
                    Make it a pickup shot
                  </button>
                ) : null}
              </div>
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
