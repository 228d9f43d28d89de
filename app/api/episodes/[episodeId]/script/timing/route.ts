import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { timingQuerySchema } from "@/lib/schemas/script";
import { scriptViewFor } from "@/lib/server/views/script";
import { AppError } from "@/lib/server/http/errors";
import { allowsDropFrame } from "@/lib/frame-rate";

/** Computed timing at a chosen frame rate (?rate=25&dropFrame=false); the episode's rate by default. */
export const GET = channelRoute({ load: "episode", action: "channel.read", query: timingQuerySchema }, async ({ episode, query }) => {
  const q = query;
  const dropFrame = q.dropFrame === "true";
  if (dropFrame && q.rate && !allowsDropFrame(q.rate)) {
    throw new AppError("validation:query", "Drop-frame exists only at 29.97 and 59.94 fps.", { fields: { dropFrame: ["drop-frame applies only at 29.97 and 59.94 fps"] } });
  }
  const view = await scriptViewFor(episode, q.rate ? { rate: q.rate, dropFrame } : q.dropFrame ? { dropFrame } : undefined);
  return json({ rate: view.rate, wordsPerMinute: view.wordsPerMinute, totals: view.totals, chapters: view.chapters, segments: view.segments.map((s) => ({ ...s.timing, id: s.id, kind: s.kind, stepId: s.stepId })) });
});
