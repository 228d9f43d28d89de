"use client";
import { secondsToMinutesText } from "@/lib/schemas/episode";
import { useState } from "react";
import { useRouter } from "next/navigation";
import type { EpisodeDto } from "@/lib/schemas/episode";
import { EpisodeForm } from "./episode-form";
import { Button } from "./ui/button";
import { Notice } from "./ui/field";
import { ApiError, episodesApi } from "./board/api";

export function EpisodeEditor({ episode, canEdit, canArchive, channelId }: { episode: EpisodeDto; canEdit: boolean; canArchive: boolean; channelId: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [confirming, setConfirming] = useState(false);
  if (!canEdit) {
    // Roles that read the episode see its facts as text, not as a locked form.
    return (
      <div className="space-y-3" data-testid="episode-facts">
        <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[max-content_1fr]">
          <dt className="text-walnut-700">Title</dt>
          <dd className="font-medium">{episode.title}</dd>
          <dt className="text-walnut-700">Summary</dt>
          <dd className="whitespace-pre-wrap">{episode.summary || "—"}</dd>
          <dt className="text-walnut-700">Target runtime</dt>
          <dd className="num">{episode.targetRuntimeSeconds != null ? secondsToMinutesText(episode.targetRuntimeSeconds) + " min" : "—"}</dd>
          <dt className="text-walnut-700">Planned publish date</dt>
          <dd className="num">{episode.publishDate ?? "—"}</dd>
          <dt className="text-walnut-700">Frame rate</dt>
          <dd className="num">
            {episode.frameRate} fps{episode.dropFrame ? " drop-frame" : ""}
          </dd>
        </dl>
        <p className="text-sm text-walnut-700">Your role reads this episode; a presenter, producer or the owner edits it.</p>
      </div>
    );
  }
  return (
    <div className="space-y-4">
      <EpisodeForm
        mode="edit"
        initial={episode}
        onSubmit={async (values) => {
          try {
            const ep = await episodesApi.update(episode.id, values);
            router.refresh();
            return { ok: true, episode: ep };
          } catch (e) {
            return e instanceof ApiError ? { ok: false, message: e.message, fields: e.fields } : { ok: false, message: "The server could not be reached." };
          }
        }}
      />
      {canArchive && episode.archivedAt ? (
        <div className="flex items-center gap-2 border-t border-timber-200 pt-4">
          <span className="text-sm">This episode is archived and off the board.</span>
          <Button
            onClick={async () => {
              try {
                await episodesApi.restore(episode.id);
                router.refresh();
              } catch (e) {
                setError(e instanceof Error ? e.message : "Could not restore.");
              }
            }}
          >
            Restore to the board
          </Button>
        </div>
      ) : null}
      {canArchive && !episode.archivedAt ? (
        <div className="border-t border-timber-200 pt-4">
          {error ? <Notice tone="error">{error}</Notice> : null}
          {confirming ? (
            <div className="flex flex-wrap items-center gap-2">
              <span className="text-sm">Archive “{episode.title}”? It leaves the board; nothing is deleted.</span>
              <Button
                variant="danger"
                onClick={async () => {
                  try {
                    await episodesApi.archive(episode.id);
                    router.push(`/c/${channelId}`);
                    router.refresh();
                  } catch (e) {
                    setError(e instanceof Error ? e.message : "Could not archive.");
                  }
                }}
              >
                Yes, archive
              </Button>
              <Button variant="quiet" onClick={() => setConfirming(false)}>
                Keep it
              </Button>
            </div>
          ) : (
            <Button variant="danger" onClick={() => setConfirming(true)}>
              Archive episode
            </Button>
          )}
        </div>
      ) : null}
    </div>
  );
}
