export interface SegmentDto {
  id: string;
  position: number;
  kind: "to_camera" | "voice_over" | "sponsor_read" | "on_screen_text";
  text: string;
  stepId: string | null;
  pinnedStartFrame: number | null;
  explicitDurationFrames: number | null;
  editorNotes: string;
  chapterStart: boolean;
  chapterTitle: string | null;
  version: number;
  updatedBy: string | null;
  updatedAt: string;
}

export interface ScriptDto {
  rate: { id: string; dropFrame: boolean; num: number; den: number };
  wordsPerMinute: number;
  segments: SegmentDto[];
}

export class SaveError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly current?: SegmentDto,
    readonly fields?: Record<string, string[]>,
  ) {
    super(message);
  }
}

export async function send<T>(url: string, method: string, body?: unknown): Promise<T> {
  let res: Response;
  try {
    res = await fetch(url, { method, headers: { "content-type": "application/json" }, body: body === undefined ? undefined : JSON.stringify(body) });
  } catch {
    throw new SaveError("offline", 0);
  }
  const data = await res.json().catch(() => ({}));
  if (!res.ok) throw new SaveError(data?.error?.message ?? `Request failed (${res.status})`, res.status, data?.error?.current, data?.error?.fields);
  return data as T;
}
