"use client";
import { fetchJson } from "@/components/fetch-json";
import Link from "next/link";
import { useRef, useState } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { formatBytes, MEDIA_TYPES } from "@/lib/schemas/footage";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/field";
import { Upload, type UploadState } from "./upload-engine";
import type { ClipDto } from "@/lib/schemas/footage";
import { useWrite } from "@/components/use-write";

function clock(s: number | null) {
  if (s == null || !Number.isFinite(s)) return "—";
  const m = Math.floor(s / 60);
  return `${m}:${String(Math.round(s % 60)).padStart(2, "0")}`;
}

function Bar({ value, label }: { value: number; label: string }) {
  return (
    <div role="progressbar" aria-label={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(value * 100)} className="h-2.5 w-full overflow-hidden rounded-plank bg-timber-200">
      <div className="h-full bg-chalk-600 transition-[width]" style={{ width: `${Math.min(100, value * 100)}%` }} />
    </div>
  );
}

export function FootagePanel({ episodeId, channelBase, canManage, shots }: { episodeId: string; channelBase: string; canManage: boolean; shots: { id: string; description: string }[] }) {
  const write = useWrite({ scope: `footage:${episodeId}` });
  const qc = useQueryClient();
  const key = ["clips", episodeId];
  const { data } = useQuery({ queryKey: key, queryFn: () => fetchJson<{ clips: ClipDto[] }>(`/api/episodes/${episodeId}/clips`) });
  const [uploads, setUploads] = useState<UploadState[]>([]);
  const engines = useRef(new Map<string, Upload>());
  const [message, setMessage] = useState<string | null>(null);

  function add(files: FileList | null) {
    if (!files) return;
    for (const file of Array.from(files)) {
      const u = new Upload(file, episodeId, (s) => {
        setUploads((list) => {
          const i = list.findIndex((x) => x.key === s.key);
          return i < 0 ? [...list, s] : list.map((x, j) => (j === i ? s : x));
        });
        if (s.status === "done") void qc.invalidateQueries({ queryKey: key });
      });
      engines.current.set(u.state.key, u);
      setUploads((list) => [...list.filter((x) => x.key !== u.state.key), u.state]);
      void u.start();
    }
  }

  const active = uploads.filter((u) => u.status !== "cancelled");
  const total = active.reduce((a, u) => a + u.size, 0);
  const sent = active.reduce((a, u) => a + u.sent, 0);
  const speed = active.reduce((a, u) => a + (u.status === "uploading" ? u.speed : 0), 0);
  const shotName = new Map(shots.map((s) => [s.id, s.description]));

  return (
    <div className="space-y-4">
      {canManage ? (
        <section className="space-y-3 rounded-plank border border-timber-300 bg-white p-4">
          <div className="flex flex-wrap items-center gap-3">
            <label className="cursor-pointer rounded-plank border border-chalk-700 bg-chalk-600 px-3 py-1.5 text-sm font-medium text-white">
              Choose footage…
              <input type="file" multiple className="sr-only" accept={MEDIA_TYPES.join(",")} onChange={(e) => (add(e.target.files), (e.target.value = ""))} data-testid="footage-input" />
            </label>
            <span className="text-xs text-walnut-600">Video, sound or stills. Files go straight to storage in parts; an interrupted upload picks up where it stopped when you choose the same file again.</span>
          </div>
          {active.length ? (
            <div className="space-y-1" data-testid="overall-progress">
              <div className="flex justify-between text-xs text-walnut-700">
                <span>
                  All files: {formatBytes(sent)} of {formatBytes(total)}
                </span>
                <span className="num">
                  {speed > 0 ? `${formatBytes(speed)}/s · ${clock(speed ? (total - sent) / speed : null)} left` : ""}
                </span>
              </div>
              <Bar value={total ? sent / total : 0} label="All uploads" />
            </div>
          ) : null}
          <ul className="space-y-2">
            {uploads.map((u) => {
              // Looked up when clicked, not while rendering.
              const engine = () => engines.current.get(u.key);
              return (
                <li key={u.key} className="rounded-plank border border-timber-200 p-2 text-sm" data-testid="upload-row" data-status={u.status}>
                  <div className="flex flex-wrap items-center gap-2">
                    <strong className="min-w-0 flex-1 truncate">{u.name}</strong>
                    <span className="num text-xs">
                      {formatBytes(u.sent)} / {formatBytes(u.size)} · parts {u.partsDone}/{u.partCount || "…"}
                    </span>
                    <span className="num text-xs text-walnut-700">{u.status === "uploading" && u.speed > 0 ? `${formatBytes(u.speed)}/s · ${clock(u.secondsLeft)} left` : ""}</span>
                    <span className="text-xs" data-testid="upload-status">
                      {u.status === "done" ? "Done" : u.status === "paused" ? "Paused" : u.status === "waiting" ? "Waiting for storage…" : u.status === "error" ? "Stopped" : u.status === "cancelled" ? "Cancelled" : u.status === "finishing" ? "Finishing…" : u.status === "preparing" ? "Preparing…" : "Uploading"}
                      {u.resumed && u.status !== "cancelled" ? " (resumed)" : ""}
                    </span>
                    {u.status === "uploading" ? <Button onClick={() => engine()?.pause()}>Pause</Button> : null}
                    {u.status === "paused" || u.status === "error" ? <Button onClick={() => void engine()?.resume()}>Resume</Button> : null}
                    {u.status !== "done" && u.status !== "cancelled" ? (
                      <Button variant="quiet" onClick={() => void engine()?.cancel()}>
                        Cancel
                      </Button>
                    ) : null}
                  </div>
                  <div className="mt-1">
                    <Bar value={u.size ? u.sent / u.size : 0} label={`Upload of ${u.name}`} />
                  </div>
                  {u.error ? (
                    <p role="alert" className="mt-1 text-fault-700">
                      {u.error}
                    </p>
                  ) : null}
                </li>
              );
            })}
          </ul>
        </section>
      ) : null}
      {message ? <Notice tone="error">{message}</Notice> : null}
      {data && data.clips.length === 0 ? (
        <div className="rounded-plank border border-dashed border-timber-400 bg-white p-4 text-sm">
          <strong>No footage yet.</strong> {canManage ? "Choose files above; link each clip to a shot on the shot list." : "The editor uploads the footage."}
        </div>
      ) : null}
      {data && data.clips.length ? (
        <table className="w-full border-collapse rounded-plank bg-white text-sm" data-testid="clips">
          <thead>
            <tr className="border-b border-timber-300 bg-timber-100 text-left">
              <th className="px-2 py-1.5">Clip</th>
              <th className="px-2">Length</th>
              <th className="px-2">Picture</th>
              <th className="px-2">Starts at</th>
              <th className="px-2">Shot</th>
              <th className="px-2">
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {data.clips.map((c) => (
              <tr key={c.id} className="border-b border-timber-200 align-top" data-testid="clip-row">
                <td className="px-2 py-1.5">
                  <Link className="text-chalk-600 underline" href={`${channelBase}/footage/${c.id}`}>
                    {c.originalName}
                  </Link>
                  <div className="num text-xs text-walnut-600">
                    {formatBytes(c.sizeBytes)} · {c.contentType} {c.state === "uploading" ? "· unfinished" : ""}
                  </div>
                </td>
                <td className="num px-2" data-testid="clip-duration">
                  {c.durationMs != null ? `${(c.durationMs / 1000).toFixed(2)} s` : "—"}
                </td>
                <td className="num px-2" data-testid="clip-picture">
                  {c.width && c.height ? `${c.width}×${c.height}` : "—"} {c.frameRate ? `@ ${c.frameRate} fps` : ""}
                </td>
                <td className="num px-2">{c.startTimecode ?? "—"}</td>
                <td className="px-2">
                  {canManage ? (
                    <select
                      aria-label={`Shot for ${c.originalName}`}
                      className="max-w-56 rounded-plank border border-timber-300 bg-white px-1 py-0.5"
                      value={c.shotId ?? ""}
                      onChange={async (e) => {
                        await write(`/api/clips/${c.id}`, "PATCH", { shotId: e.target.value || null }).catch((err: Error) => setMessage(err.message));
                        await qc.invalidateQueries({ queryKey: key });
                        await qc.invalidateQueries({ queryKey: ["shots", episodeId] });
                      }}
                    >
                      <option value="">Not linked</option>
                      {shots.map((s) => (
                        <option key={s.id} value={s.id}>
                          {s.description.slice(0, 60)}
                        </option>
                      ))}
                    </select>
                  ) : (
                    (c.shotId && shotName.get(c.shotId)) || "—"
                  )}
                </td>
                <td className="px-2">
                  {canManage ? (
                    <Button
                      variant="quiet"
                      onClick={async () => {
                        if (!window.confirm(`Delete ${c.originalName}? The stored file is removed too.`)) return;
                        await write(`/api/clips/${c.id}`, "DELETE").catch((err: Error) => setMessage(err.message));
                        await qc.invalidateQueries({ queryKey: key });
                      }}
                    >
                      Delete
                    </Button>
                  ) : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
    </div>
  );
}
