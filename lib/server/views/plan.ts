import "server-only";
/** Shared checks and views for build-plan routes. */
import { crewTiming, findCycle, planTiming } from "../../build-plan";
import { stepHazards } from "../../safety";
import { isSponsoredAcquisition, TIMING_FIELDS, type StepUpdate } from "../../schemas/build";
import type { ChannelAccess } from "../access/access";
import { assertCan } from "../access/access";
import { AppError } from "../http/errors";
import type { PlanContext, StepWithLinks } from "../../../db/queries/build";
import type { Tool } from "../../../db/schema";
import { presignGet } from "../../../storage/presign";

export function checkLinks(ctx: PlanContext, stepId: string | null, dependsOn?: string[], toolIds?: string[]) {
  const fields: Record<string, string[]> = {};
  if (dependsOn) {
    const known = new Set(ctx.steps.map((s) => s.id));
    if (stepId && dependsOn.includes(stepId)) (fields.dependsOn ??= []).push("a step cannot depend on itself");
    const unknown = dependsOn.filter((d) => !known.has(d));
    if (unknown.length) (fields.dependsOn ??= []).push(`${unknown.length} of these steps are not in this episode`);
  }
  if (toolIds) {
    const unknown = toolIds.filter((t) => !ctx.channelToolIds.has(t));
    if (unknown.length) (fields.toolIds ??= []).push(`${unknown.length} of these tools are not on this channel's shelf`);
  }
  if (Object.keys(fields).length) throw new AppError("unprocessable:step.links", "Some linked steps or tools do not belong here.", { fields });
  if (dependsOn && stepId) {
    const next = ctx.steps.map((s) => (s.id === stepId ? { id: s.id, dependsOn } : { id: s.id, dependsOn: s.dependsOn }));
    const cycle = findCycle(next);
    if (cycle) {
      const name = (id: string) => ctx.steps.find((s) => s.id === id)?.title ?? id;
      const loop = [...cycle, cycle[0]!].map(name).join(" → ");
      throw new AppError("conflict:step.cycle", `These dependencies would make a loop: ${loop}. A step cannot wait for itself.`, {
        fields: { dependsOn: [`would make a loop: ${loop}`] },
      });
    }
  }
}

/** Presenter and owner edit everything; a producer only durations, waits and crew. */
export function assertStepPatchAllowed(access: ChannelAccess, patch: StepUpdate) {
  const keys = Object.keys(patch);
  const timingOnly = keys.every((k) => (TIMING_FIELDS as readonly string[]).includes(k));
  assertCan(access, timingOnly ? "build.timing" : "build.edit");
}

/** `team` is how many people the channel has: hands-on time is counted against it. */
export async function planView(steps: StepWithLinks[], shelf: Tool[], team: number) {
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

export function toolDto(t: Tool) {
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
