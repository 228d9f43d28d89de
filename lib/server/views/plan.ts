import "server-only";
/** The build plan as the API shows it: timing, crew timing, cautions, tools used. */
import { crewTiming, planTiming } from "../../build-plan";
import { stepHazards } from "../../safety";
import { isSponsoredAcquisition, type PlanDto, type ToolDto } from "../../schemas/build";
import type { StepWithLinks } from "../../../db/queries/build";
import type { Tool } from "../../../db/schema";
import { presignGet } from "../../../storage/presign";

/** `team` is how many people the channel has: hands-on time is counted against it. */
export async function planView(steps: StepWithLinks[], shelf: Tool[], team: number): Promise<PlanDto> {
  const toolById = new Map(shelf.map((t) => [t.id, t]));
  const input = steps.map((s) => ({ id: s.id, activeMinutes: s.activeMinutes, waitMinutes: s.waitMinutes, dependsOn: s.dependsOn, status: s.status, crewNeeded: s.crewNeeded }));
  const timing = planTiming(input);
  const counted = crewTiming(input, team);
  const out = await Promise.all(
    steps.map(async (s) => ({
      id: s.id,
      position: s.position,
      title: s.title,
      notes: s.notes,
      activeMinutes: s.activeMinutes,
      waitMinutes: s.waitMinutes,
      waitReason: s.waitReason,
      crewNeeded: s.crewNeeded,
      coverageKinds: s.coverageKinds,
      hazards: s.hazards,
      cautions: stepHazards(s.hazards, s.toolIds.map((t) => toolById.get(t)?.kind ?? "")),
      dependsOn: s.dependsOn,
      toolIds: s.toolIds,
      status: s.status,
      failureNote: s.failureNote,
      failurePhotoUrl: s.failurePhotoKey ? await presignGet(s.failurePhotoKey) : null,
      remedyOfStepId: s.remedyOfStepId,
      mustFilm: s.mustFilm,
      pinnedShootDayId: s.pinnedShootDayId,
      timing: timing.steps[s.id]!,
      crewTiming: counted.steps[s.id]!,
    })),
  );
  const used = new Map<string, string[]>();
  for (const s of steps) for (const t of s.toolIds) used.set(t, [...(used.get(t) ?? []), s.title]);
  const toolsUsed = [...used.entries()]
    .map(([id, stepTitles]) => ({ tool: toolById.get(id), stepTitles }))
    .filter((x): x is { tool: Tool; stepTitles: string[] } => Boolean(x.tool))
    .map(({ tool, stepTitles }) => ({ ...toolDto(tool), steps: stepTitles }));
  return {
    steps: out,
    timing: { totalActiveMinutes: timing.totalActiveMinutes, totalWaitMinutes: timing.totalWaitMinutes, criticalPathMinutes: timing.criticalPathMinutes, criticalPath: timing.criticalPath },
    crew: { team, finishMinutes: counted.finishMinutes, overCrew: counted.overCrew },
    toolsUsed,
  };
}

export function toolDto(t: Tool): ToolDto {
  return {
    id: t.id,
    name: t.name,
    kind: t.kind,
    acquisition: t.acquisition,
    sponsorId: t.sponsorId,
    sponsored: isSponsoredAcquisition(t.acquisition),
    caution: t.caution,
    photoKey: t.photoKey,
  };
}
