import { channelRoute } from "@/lib/server/http/route-builder";
import { parseQuery } from "@/lib/server/http/api";
import { exportQuerySchema } from "@/lib/schemas/script";
import { scriptViewFor } from "@/lib/server/views/script";
import { listStepTitlesByEpisode } from "@/db/queries/build";
import { SEGMENT_KIND_LABELS } from "@/lib/script-timing";
import { fileSlug } from "@/lib/file-name";

export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ episode, req }) => {
  const { format } = parseQuery(req, exportQuerySchema);
  const view = await scriptViewFor(episode);
  const steps = new Map((await listStepTitlesByEpisode({ episodeId: episode.id })).map((s) => [s.id, s.title]));
  const slug = fileSlug(episode.title);
  if (format === "json") {
    const body = {
      episode: { id: episode.id, title: episode.title, frameRate: episode.frameRate, dropFrame: episode.dropFrame, targetRuntimeSeconds: episode.targetRuntimeSeconds },
      wordsPerMinute: view.wordsPerMinute,
      totals: view.totals,
      chapters: view.chapters.text,
      segments: view.segments.map((s) => ({ kind: s.kind, step: s.stepId ? steps.get(s.stepId) ?? null : null, start: s.timing.startTimecode, end: s.timing.endTimecode, text: s.text, editorNotes: s.editorNotes, chapterTitle: s.chapterStart ? s.chapterTitle : null })),
    };
    return new Response(JSON.stringify(body, null, 2), { headers: { "content-type": "application/json; charset=utf-8", "content-disposition": `attachment; filename="script-${slug}.json"` } });
  }
  const lines = [`${episode.title}`, `${episode.frameRate} fps${view.rate.dropFrame ? " drop-frame" : ""} · runtime ${view.totals.timecode} · ${view.wordsPerMinute} wpm`, ""];
  for (const s of view.segments) {
    const step = s.stepId ? ` · ${steps.get(s.stepId) ?? ""}` : "";
    lines.push(`[${s.timing.startTimecode} – ${s.timing.endTimecode}] ${SEGMENT_KIND_LABELS[s.kind]}${step}${s.chapterStart ? ` · chapter: ${s.chapterTitle ?? ""}` : ""}`);
    lines.push(s.text, ...(s.editorNotes ? [`(note to the editor: ${s.editorNotes})`] : []), "");
  }
  if (view.chapters.text) lines.push("Chapters", view.chapters.text, "");
  return new Response(lines.join("\n"), { headers: { "content-type": "text/plain; charset=utf-8", "content-disposition": `attachment; filename="script-${slug}.txt"` } });
});
