import { json, route, sessionUser } from "@/lib/server/api";
import { loadEpisode } from "@/lib/server/loaders";
import { coverageFor } from "@/lib/server/coverage-loader";

type P = { episodeId: string };

/** The script timeline with B-roll ranges, computed and marked gaps, and voice-over coverage. */
export const GET = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const { episode } = await loadEpisode(user.id, params.episodeId);
  const { view, coverage } = await coverageFor(episode);
  const { stillComputed: _s, ...rest } = coverage;
  return json({
    rate: view.rate,
    totalFrames: view.totals.frames,
    segments: view.segments.map((s) => ({ id: s.id, kind: s.kind, stepId: s.stepId, text: s.text.slice(0, 120), start: s.timing.start, end: s.timing.end, startTimecode: s.timing.startTimecode, endTimecode: s.timing.endTimecode })),
    ...rest,
  });
});
