import "server-only";
/**
 * Build-plan writes and their rules: links must stay inside the episode and
 * the channel's shelf, dependencies must not loop, a remedy rewires what
 * waited for the failed step, and a producer may change only timing. Each
 * write is one transaction that takes the episode lock first.
 */
import { findCycle, placeRemedy } from "../../build-plan";
import { TIMING_FIELDS, type StepCreate, type StepUpdate } from "../../schemas/build";
import { assertCan, type ChannelAccess } from "../access/access";
import { AppError } from "../http/errors";
import { db, type Tx } from "../../../db/client";
import { lockEpisode } from "../../../db/queries/episode-lock";
import { getShootDayById } from "../../../db/queries/shoot-days";
import {
  addStepDependency,
  deleteStepRow,
  detachRemedies,
  insertStep,
  listActiveToolIds,
  listStepIdsInOrder,
  listStepsWithLinks,
  replaceStepLinks,
  updateStepRow,
  writeStepPositions,
  type StepWithLinks,
} from "../../../db/queries/build";

interface PlanContext {
  steps: StepWithLinks[];
  channelToolIds: Set<string>;
  channelId: string;
}

async function lockedPlan(tx: Tx, episodeId: string, channelId: string): Promise<PlanContext> {
  await lockEpisode(tx, episodeId);
  const [steps, channelToolIds] = await Promise.all([listStepsWithLinks(tx, episodeId), listActiveToolIds(tx, channelId)]);
  return { steps, channelToolIds, channelId };
}

/** A step may be pinned only to one of its channel's shoot days. */
async function checkPin(channelId: string, pinnedShootDayId: string | null | undefined) {
  if (!pinnedShootDayId) return;
  const day = await getShootDayById({ id: pinnedShootDayId });
  if (!day || day.channelId !== channelId) throw new AppError("unprocessable:step.pin", "That shoot day is not on this channel.", { fields: { pinnedShootDayId: ["not a shoot day of this channel"] } });
}

/** Refuses links to steps of other episodes, tools of other channels, and dependency loops (naming the loop). */
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

/** Adds a step at the end of the plan. */
export async function addStep({ episodeId, channelId, input }: { episodeId: string; channelId: string; input: StepCreate }) {
  await checkPin(channelId, input.pinnedShootDayId);
  if (input.status === "failed") {
    throw new AppError("unprocessable:step.status", "Add the step first, then mark it failed with what went wrong.", { fields: { status: ["mark a step failed through its failure form"] } });
  }
  return db().transaction(async (tx) => {
    const ctx = await lockedPlan(tx, episodeId, channelId);
    checkLinks(ctx, null, input.dependsOn, input.toolIds);
    const { dependsOn, toolIds, ...fields } = input;
    const row = await insertStep(tx, { ...fields, episodeId, position: ctx.steps.length });
    await replaceStepLinks(tx, row.id, dependsOn, toolIds);
    return row;
  });
}

/** Adds a remedy right after a failed step; see placeRemedy for what it rewires. */
export async function addRemedy({ failed, channelId, input }: { failed: { id: string; episodeId: string; status: string }; channelId: string; input: StepCreate }) {
  await checkPin(channelId, input.pinnedShootDayId);
  if (failed.status !== "failed") throw new AppError("conflict:step.not-failed", "Only a failed step gets remedies. Mark it failed first.");
  return db().transaction(async (tx) => {
    const ctx = await lockedPlan(tx, failed.episodeId, channelId);
    checkLinks(ctx, null, input.dependsOn, input.toolIds);
    const { dependsOn, toolIds, ...fields } = input;
    const row = await insertStep(tx, { ...fields, status: fields.status === "failed" ? "planned" : fields.status, episodeId: failed.episodeId, position: ctx.steps.length, remedyOfStepId: failed.id });
    const placed = placeRemedy(ctx.steps, failed.id, row.id, dependsOn);
    await replaceStepLinks(tx, row.id, placed.dependsOn, toolIds);
    for (const id of placed.rewired) await addStepDependency(tx, id, row.id);
    await writeStepPositions(tx, placed.order);
    return row;
  });
}

/** Field and link edits; returns the step before and after, or null when it is gone. */
export async function editStep({
  stepId,
  episodeId,
  channelId,
  access,
  patch,
}: {
  stepId: string;
  episodeId: string;
  channelId: string;
  access: ChannelAccess;
  patch: StepUpdate;
}) {
  assertStepPatchAllowed(access, patch);
  if (patch.status === "failed") {
    throw new AppError("unprocessable:step.status", "Mark a step failed with its failure form, so the team knows what went wrong.", { fields: { status: ["use POST /api/steps/{stepId}/failure"] } });
  }
  await checkPin(channelId, patch.pinnedShootDayId);
  // A step that leaves "failed" keeps its failure note: it is part of the build's story.
  return writeStep(episodeId, channelId, stepId, patch, (ctx) => checkLinks(ctx, stepId, patch.dependsOn, patch.toolIds));
}

/** Marks a step failed with what went wrong (the photo, if any, already claimed by the caller). */
export async function failStep({ stepId, episodeId, channelId, note, photoKey }: { stepId: string; episodeId: string; channelId: string; note: string; photoKey?: string | null }) {
  return writeStep(episodeId, channelId, stepId, { status: "failed", failureNote: note, failurePhotoKey: photoKey }, () => {});
}

async function writeStep(
  episodeId: string,
  channelId: string,
  stepId: string,
  patch: StepUpdate & { failureNote?: string | null; failurePhotoKey?: string | null },
  check: (ctx: PlanContext) => void,
) {
  return db().transaction(async (tx) => {
    const ctx = await lockedPlan(tx, episodeId, channelId);
    const current = ctx.steps.find((s) => s.id === stepId);
    if (!current) return null;
    check(ctx);
    const { dependsOn, toolIds, ...fields } = patch;
    await updateStepRow(tx, stepId, fields);
    await replaceStepLinks(tx, stepId, dependsOn, toolIds);
    const after = (await listStepsWithLinks(tx, episodeId)).find((s) => s.id === stepId)!;
    return { before: current, after };
  });
}

/** Removes a step; its remedies stay in the plan as ordinary steps. */
export async function removeStep({ stepId, episodeId }: { stepId: string; episodeId: string }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    const row = await deleteStepRow(tx, stepId, episodeId);
    if (!row) return null;
    await detachRemedies(tx, stepId);
    await writeStepPositions(tx, await listStepIdsInOrder(tx, episodeId));
    return row;
  });
}

/** Sets the whole order at once; `ids` must be exactly the episode's steps as they are now. */
export async function reorderSteps({ episodeId, ids }: { episodeId: string; ids: string[] }) {
  await db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    const current = await listStepIdsInOrder(tx, episodeId);
    const same = current.length === ids.length && current.every((id) => ids.includes(id));
    if (!same) throw new AppError("conflict:step.order", "The plan changed since you loaded it: reload and reorder again.", { fields: { ids: ["must list every step of this episode exactly once"] } });
    await writeStepPositions(tx, ids);
  });
}
