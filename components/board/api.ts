import type { EpisodeDto } from "@/lib/schemas/episode";

export class ApiError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly fields?: Record<string, string[]>,
  ) {
    super(message);
  }
}

async function call<T>(url: string, init?: RequestInit): Promise<T> {
  const res = await fetch(url, { ...init, headers: { "content-type": "application/json", ...(init?.headers ?? {}) } });
  const data = await res.json().catch(() => ({}));
  if (!res.ok) throw new ApiError(data?.error?.message ?? `Request failed (${res.status})`, res.status, data?.error?.fields);
  return data as T;
}

export const episodesApi = {
  list: (channelId: string) => call<{ episodes: EpisodeDto[] }>(`/api/channels/${channelId}/episodes`).then((r) => r.episodes),
  create: (channelId: string, body: unknown) =>
    call<{ episode: EpisodeDto }>(`/api/channels/${channelId}/episodes`, { method: "POST", body: JSON.stringify(body) }).then((r) => r.episode),
  update: (id: string, body: unknown) => call<{ episode: EpisodeDto }>(`/api/episodes/${id}`, { method: "PATCH", body: JSON.stringify(body) }).then((r) => r.episode),
  restore: (id: string) => call<{ episode: EpisodeDto }>(`/api/episodes/${id}/restore`, { method: "POST" }).then((r) => r.episode),
  listArchived: (channelId: string) => call<{ episodes: EpisodeDto[] }>(`/api/channels/${channelId}/episodes?archived=true`).then((r) => r.episodes),
  archive: (id: string) => call<{ episode: EpisodeDto }>(`/api/episodes/${id}`, { method: "DELETE" }).then((r) => r.episode),
};
