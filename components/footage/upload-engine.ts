/**
 * Browser side of resumable footage uploads. The app server only signs and
 * records; the bytes go from the browser straight to storage as multipart
 * parts, several at a time, each retried on failure. Progress, speed and time
 * left are reported through `onChange`. A paused or interrupted upload asks
 * the server which parts are already stored and sends only the rest; the
 * clip id is kept in localStorage so a reload can pick the same file up again.
 */
import { send } from "@/components/fetch-json";

/** "waiting": storage is not answering; the upload keeps trying by itself and goes on when it is back. */
export type UploadStatus = "preparing" | "uploading" | "waiting" | "paused" | "finishing" | "done" | "error" | "cancelled";

export interface UploadState {
  key: string;
  name: string;
  size: number;
  status: UploadStatus;
  sent: number;
  partsDone: number;
  partCount: number;
  speed: number;
  secondsLeft: number | null;
  error: string | null;
  clipId: string | null;
  resumed: boolean;
}

export const CONCURRENCY = 4;
export const MAX_TRIES = 5;
/** Waits before retrying a part: retryBaseMs × 2^attempt. */
export const RETRY_BASE_MS = 500;

const api = <T>(url: string, method: string, body?: unknown) => send<T>(url, method, body);

const EXT_TYPES: Record<string, string> = { mp4: "video/mp4", m4v: "video/mp4", mov: "video/quicktime", webm: "video/webm", mkv: "video/x-matroska", avi: "video/x-msvideo", mxf: "application/mxf", wav: "audio/wav", mp3: "audio/mpeg", m4a: "audio/mp4", aac: "audio/aac", flac: "audio/flac", jpg: "image/jpeg", jpeg: "image/jpeg", png: "image/png", webp: "image/webp", tif: "image/tiff", tiff: "image/tiff" };

export function contentTypeOf(file: File): string {
  if (file.type) return file.type;
  return EXT_TYPES[file.name.split(".").pop()?.toLowerCase() ?? ""] ?? "application/octet-stream";
}

export class Upload {
  state: UploadState;
  private partSize = 0;
  private done = new Set<number>();
  private inflight = new Map<number, XMLHttpRequest>();
  private partSent = new Map<number, number>();
  private urls = new Map<number, string>();
  private samples: { t: number; sent: number }[] = [];
  private stopped = false;
  private signing: Promise<void> | null = null;

  constructor(
    private file: File,
    private episodeId: string,
    private onChange: (s: UploadState) => void,
    private shotId: string | null = null,
    private retryBaseMs = RETRY_BASE_MS,
  ) {
    this.state = { key: `${file.name}:${file.size}:${file.lastModified}`, name: file.name, size: file.size, status: "preparing", sent: 0, partsDone: 0, partCount: 0, speed: 0, secondsLeft: null, error: null, clipId: null, resumed: false };
  }

  private get storeKey() {
    return `jigboard-upload:${this.episodeId}:${this.state.key}`;
  }

  private emit(patch: Partial<UploadState>) {
    this.state = { ...this.state, ...patch };
    this.onChange(this.state);
  }

  private progress() {
    const sent = [...this.done].reduce((a, n) => a + this.sizeOf(n), 0) + [...this.partSent.values()].reduce((a, b) => a + b, 0);
    const now = performance.now();
    this.samples.push({ t: now, sent });
    while (this.samples.length > 2 && now - this.samples[0]!.t > 5000) this.samples.shift();
    const first = this.samples[0]!;
    const speed = now > first.t ? ((sent - first.sent) * 1000) / (now - first.t) : 0;
    this.emit({ sent, partsDone: this.done.size, speed, secondsLeft: speed > 0 ? (this.state.size - sent) / speed : null });
  }

  private sizeOf(n: number) {
    return n < this.state.partCount ? this.partSize : this.state.size - this.partSize * (this.state.partCount - 1);
  }

  async start() {
    this.stopped = false;
    this.emit({ status: "preparing", error: null });
    try {
      const saved = typeof localStorage !== "undefined" ? localStorage.getItem(this.storeKey) : null;
      if (saved && !this.state.clipId) {
        // Same file, same episode: continue the earlier upload.
        try {
          await this.syncParts(saved);
          this.emit({ clipId: saved, resumed: true });
        } catch {
          localStorage.removeItem(this.storeKey);
        }
      }
      if (!this.state.clipId) {
        const r = await api<{ clip: { id: string }; partSize: number; partCount: number }>(`/api/episodes/${this.episodeId}/uploads`, "POST", {
          fileName: this.file.name,
          size: this.file.size,
          contentType: contentTypeOf(this.file),
          shotId: this.shotId,
        });
        this.partSize = r.partSize;
        localStorage.setItem(this.storeKey, r.clip.id);
        this.emit({ clipId: r.clip.id, partCount: r.partCount });
      } else if (!this.partSize) {
        await this.syncParts(this.state.clipId);
      }
      await this.run();
    } catch (e) {
      if (!this.stopped) this.emit({ status: "error", error: (e as Error).message });
    }
  }

  /** Asks the server which parts are stored, so only the rest are sent. */
  private async syncParts(clipId: string) {
    const r = await api<{ partSize: number; partCount: number; parts: { partNumber: number; size: number }[] }>(`/api/clips/${clipId}/parts`, "GET");
    this.partSize = r.partSize;
    this.state.partCount = r.partCount;
    this.done = new Set(r.parts.filter((p) => p.size === this.sizeOf(p.partNumber)).map((p) => p.partNumber));
    this.emit({ partCount: r.partCount });
    this.progress();
  }

  private async run() {
    this.emit({ status: "uploading" });
    const todo = Array.from({ length: this.state.partCount }, (_, i) => i + 1).filter((n) => !this.done.has(n));
    const worker = async () => {
      while (!this.stopped && todo.length) {
        const n = todo.shift()!;
        await this.sendPart(n);
      }
    };
    await Promise.all(Array.from({ length: Math.min(CONCURRENCY, todo.length || 1) }, worker));
    if (this.stopped) return;
    this.emit({ status: "finishing" });
    await api(`/api/clips/${this.state.clipId}/complete`, "POST");
    localStorage.removeItem(this.storeKey);
    this.emit({ status: "done", sent: this.state.size, secondsLeft: 0 });
  }

  /** A part's presigned URL. Parts are signed in batches, and workers share one signing request at a time. */
  private async signed(n: number): Promise<string> {
    for (let round = 0; !this.urls.has(n); round++) {
      if (round > 2) throw new Error(`part ${n} could not be signed`);
      if (!this.signing) {
        // Sign a batch ahead to save round trips.
        const batch = Array.from({ length: 20 }, (_, i) => n + i).filter((p) => p <= this.state.partCount && !this.done.has(p) && !this.urls.has(p));
        this.signing = api<{ urls: { partNumber: number; url: string }[] }>(`/api/clips/${this.state.clipId}/parts`, "POST", { partNumbers: batch })
          .then((r) => {
            for (const u of r.urls) this.urls.set(u.partNumber, u.url);
          })
          .finally(() => {
            this.signing = null;
          });
      }
      await this.signing;
    }
    return this.urls.get(n)!;
  }

  private async sendPart(n: number) {
    for (let attempt = 1; !this.stopped; attempt++) {
      try {
        const url = await this.signed(n);
        const blob = this.file.slice((n - 1) * this.partSize, Math.min(this.file.size, n * this.partSize));
        await new Promise<void>((resolve, reject) => {
          const xhr = new XMLHttpRequest();
          this.inflight.set(n, xhr);
          xhr.open("PUT", url);
          xhr.upload.onprogress = (e) => {
            this.partSent.set(n, e.loaded);
            this.progress();
          };
          xhr.onload = () => (xhr.status >= 200 && xhr.status < 300 ? resolve() : reject(Object.assign(new Error(`storage answered ${xhr.status}`), { status: xhr.status })));
          xhr.onerror = () => reject(new Error("connection lost"));
          xhr.onabort = () => reject(Object.assign(new Error("stopped"), { aborted: true }));
          xhr.send(blob);
        });
        this.inflight.delete(n);
        this.partSent.delete(n);
        this.done.add(n);
        if (this.state.status === "waiting") this.emit({ status: "uploading", error: null });
        this.progress();
        return;
      } catch (e) {
        this.inflight.delete(n);
        this.partSent.delete(n);
        if ((e as { aborted?: boolean }).aborted || this.stopped) return;
        const status = (e as { status?: number }).status;
        if (status === 403) this.urls.delete(n); // expired signature: sign again
        // Storage not answering (no reply, or a 5xx): after the usual tries, wait for it, probing, instead of giving up.
        const unreachable = status === undefined || status >= 500;
        if (attempt >= MAX_TRIES && !unreachable) throw new Error(`part ${n} failed ${MAX_TRIES} times (${(e as Error).message}); press Resume to try again`);
        if (attempt >= MAX_TRIES && this.state.status !== "waiting") this.emit({ status: "waiting", speed: 0, secondsLeft: null, error: "Storage is not answering. The upload waits and goes on by itself when it is back." });
        if (typeof navigator !== "undefined" && !navigator.onLine) await new Promise((r) => window.addEventListener("online", r, { once: true }));
        await new Promise((r) => setTimeout(r, this.retryBaseMs * 2 ** Math.min(attempt, MAX_TRIES)));
      }
    }
  }

  pause() {
    this.stopped = true;
    for (const x of this.inflight.values()) x.abort();
    this.inflight.clear();
    this.partSent.clear();
    this.emit({ status: "paused", speed: 0, secondsLeft: null });
    this.progress();
  }

  async resume() {
    if (!this.state.clipId) return this.start();
    this.stopped = false;
    this.urls.clear();
    try {
      await this.syncParts(this.state.clipId);
      this.emit({ resumed: true });
      await this.run();
    } catch (e) {
      if (!this.stopped) this.emit({ status: "error", error: (e as Error).message });
    }
  }

  async cancel() {
    this.pause();
    if (this.state.clipId) await api(`/api/clips/${this.state.clipId}`, "DELETE").catch(() => {});
    localStorage.removeItem(this.storeKey);
    this.emit({ status: "cancelled" });
  }
}
