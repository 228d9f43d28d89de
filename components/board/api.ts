import type { EpisodeDto } from "@/lib/schemas/episode";
import { ApiError, fetchJson } from "@/components/fetch-json";

export { ApiError };

function call<T>(url: string, init?: { method?: string; body?: string }): Promise<T> {
  return fetchJson<T>(url, { method: init?.method, body: init?.body, headers: { "content-type": "application/json" } });
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
