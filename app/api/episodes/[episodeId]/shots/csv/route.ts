import Papa from "papaparse";
import { channelRoute } from "@/lib/server/http/route-builder";
import { CSV_EXPORT_OPTIONS } from "@/lib/cut-list-csv";
import { listShotsByEpisode } from "@/db/queries/shots";
import { listStepTitlesByEpisode } from "@/db/queries/build";

export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ episode }) => {
  const [shots, steps] = await Promise.all([listShotsByEpisode({ episodeId: episode.id }), listStepTitlesByEpisode({ episodeId: episode.id })]);
  const title = new Map(steps.map((s) => [s.id, s.title]));
  const csv = Papa.unparse({
    fields: ["kind", "description", "step", "framing", "camera_notes", "priority", "status"],
    data: shots.map((s) => [s.kind, s.description, s.stepId ? (title.get(s.stepId) ?? "") : "", s.framing, s.cameraNotes, s.priority, s.status]),
  }, CSV_EXPORT_OPTIONS);
  return new Response(csv, { headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="shot-list.csv"` } });
});
