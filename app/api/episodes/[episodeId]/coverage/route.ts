import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { coverageFor } from "@/lib/server/views/coverage";
import type { CoverageDto } from "@/lib/schemas/footage";

/** The script timeline with B-roll ranges, computed and marked gaps, and voice-over coverage. */
export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ episode }) => {
  const { view, coverage } = await coverageFor(episode);
  const { stillComputed: _s, ...rest } = coverage;
  const body: CoverageDto = {
    rate: view.rate,
    totalFrames: view.totals.frames,
    segments: view.segments.map((s) => ({ id: s.id, kind: s.kind, stepId: s.stepId, text: s.text.slice(0, 120), start: s.timing.start, end: s.timing.end, startTimecode: s.timing.startTimecode, endTimecode: s.timing.endTimecode })),
    ...rest,
  };
  return json(body);
});
