import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { listShotsByEpisode } from "@/db/queries/shots";
import { createShots } from "@/lib/server/services/shots";
import { toShotDto } from "@/lib/server/views/shots";
import { COVERAGE_LABELS, type CoverageKind } from "@/lib/shot-kinds";
import { AppError } from "@/lib/server/http/errors";
import type { ShotKind } from "@/lib/schemas/footage";

/** Creates one planned shot per coverage kind the build step asks for (skipping kinds it already has). */
export const POST = channelRoute({ load: "step", action: "shots.edit" }, async ({ step }) => {
  if (step.coverageKinds.length === 0) throw new AppError("unprocessable:step.coverage", "This step has no planned coverage; tick how to cover it in the build plan first.");
  const existing = (await listShotsByEpisode({ episodeId: step.episodeId })).filter((s) => s.stepId === step.id);
  const missing = step.coverageKinds.filter((k) => !existing.some((s) => s.kind === k));
  const rows = await createShots({
    episodeId: step.episodeId,
    rows: missing.map((k) => ({
      kind: k as ShotKind,
      description: `${COVERAGE_LABELS[k as CoverageKind] ?? k}: ${step.title}`,
      framing: "",
      cameraNotes: "",
      priority: 2,
      status: "planned" as const,
      stepId: step.id,
      segmentId: null,
      shootDayId: null,
    })),
  });
  return json({ shots: rows.map(toShotDto), skipped: step.coverageKinds.length - missing.length }, 201);
});
