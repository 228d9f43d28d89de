import { episodePage } from "@/lib/server/access/episode-page";
import { scriptViewFor } from "@/lib/server/views/script";
import { listStepTitlesByEpisode } from "@/db/queries/build";
import { ReadThrough } from "@/components/script/read-through";

export const metadata = { title: "Read-through" };

export default async function ReadPage({ params }: { params: Promise<{ channelId: string; episodeId: string }> }) {
  const { channelId, episodeId } = await params;
  const { episode } = await episodePage(channelId, episodeId, `/c/${channelId}/episodes/${episodeId}/script/read`);
  const [view, steps] = await Promise.all([scriptViewFor(episode), listStepTitlesByEpisode({ episodeId: episode.id })]);
  const title = new Map(steps.map((s) => [s.id, s.title]));
  if (view.segments.length === 0) return <p className="text-walnut-700">The script is empty; write it on the Script tab first.</p>;
  return (
    <ReadThrough
      wpm={view.wordsPerMinute}
      items={view.segments.map((s) => ({ id: s.id, kind: s.kind, text: s.text, start: s.timing.startTimecode, durationMs: Math.round(s.timing.durationSeconds * 1000), step: s.stepId ? (title.get(s.stepId) ?? null) : null }))}
    />
  );
}
