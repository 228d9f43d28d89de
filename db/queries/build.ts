import "server-only";
import { and, asc, eq, inArray, isNull, sql } from "drizzle-orm";
import { db, type Tx } from "../client";
import { lockEpisode } from "./episode-lock";
import { buildSteps, episodes, stepDependencies, stepTools, tools, type BuildStep } from "../schema";
import type { StepCreate, StepUpdate } from "../../lib/schemas/build";
import { findCycle } from "../../lib/build-plan";

export interface StepWithLinks extends BuildStep {
  dependsOn: string[];
  toolIds: string[];
}

export async function getStepById({ id }: { id: string }) {
  const [row] = await db()
    .select({ step: buildSteps, channelId: episodes.channelId })
    .from(buildSteps)
    .innerJoin(episodes, eq(episodes.id, buildSteps.episodeId))
    .where(eq(buildSteps.id, id))
    .limit(1);
  return row ?? null;
}

async function stepsWithLinks(q: Tx | ReturnType<typeof db>, episodeId: string): Promise<StepWithLinks[]> {
  const steps = await q.select().from(buildSteps).where(eq(buildSteps.episodeId, episodeId)).orderBy(asc(buildSteps.position), asc(buildSteps.createdAt));
  if (steps.length === 0) return [];
  const ids = steps.map((s) => s.id);
  const deps = await q.select().from(stepDependencies).where(inArray(stepDependencies.stepId, ids));
  const tl = await q.select().from(stepTools).where(inArray(stepTools.stepId, ids));
  return steps.map((s) => ({
    ...s,
    dependsOn: deps.filter((d) => d.stepId === s.id).map((d) => d.dependsOnStepId),
    toolIds: tl.filter((t) => t.stepId === s.id).map((t) => t.toolId),
  }));
}

export function listStepsByEpisode({ episodeId }: { episodeId: string }) {
  return stepsWithLinks(db(), episodeId);
}


async function renumber(tx: Tx, ids: string[]) {
  if (ids.length === 0) return;
  const values = sql.join(
    ids.map((id, i) => sql`(${id}::uuid, ${i}::int)`),
    sql`, `,
  );
  await tx.execute(sql`update build_steps set position = v.pos from (values ${values}) as v(id, pos) where build_steps.id = v.id`);
}

async function writeLinks(tx: Tx, stepId: string, dependsOn?: string[], toolIds?: string[]) {
  if (dependsOn) {
    await tx.delete(stepDependencies).where(eq(stepDependencies.stepId, stepId));
    if (dependsOn.length) await tx.insert(stepDependencies).values(dependsOn.map((d) => ({ stepId, dependsOnStepId: d })));
  }
  if (toolIds) {
    await tx.delete(stepTools).where(eq(stepTools.stepId, stepId));
    if (toolIds.length) await tx.insert(stepTools).values(toolIds.map((toolId) => ({ stepId, toolId })));
  }
}

export interface PlanContext {
  steps: StepWithLinks[];
  /** Tool ids of the channel that are not archived. */
  channelToolIds: Set<string>;
}

async function context(tx: Tx, episodeId: string, channelId: string): Promise<PlanContext> {
  const steps = await stepsWithLinks(tx, episodeId);
  const t = await tx.select({ id: tools.id }).from(tools).where(and(eq(tools.channelId, channelId), isNull(tools.archivedAt)));
  return { steps, channelToolIds: new Set(t.map((x) => x.id)) };
}

/**
 * Adds a step in one transaction. A remedy lands right after the failed step
 * (and its earlier remedies) and depends on it; other steps go last.
 * `check` sees the episode's current plan (locked) and throws to refuse.
 */
export async function createStep({
  episodeId,
  channelId,
  input,
  remedyOf,
  check,
}: {
  episodeId: string;
  channelId: string;
  input: StepCreate;
  remedyOf?: string;
  check: (ctx: PlanContext) => void;
}) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    const ctx = await context(tx, episodeId, channelId);
    check(ctx);
    const { dependsOn, toolIds, ...fields } = input;
    const [row] = await tx
      .insert(buildSteps)
      .values({ ...fields, episodeId, position: ctx.steps.length, remedyOfStepId: remedyOf ?? null })
      .returning();
    const deps = remedyOf && !dependsOn.includes(remedyOf) ? [remedyOf, ...dependsOn] : dependsOn;
    await writeLinks(tx, row!.id, deps, toolIds);
    if (remedyOf) {
      // What waited for the failed step now waits for its remedy too, so the schedule follows the fix.
      let graph = [...ctx.steps.map((s) => ({ id: s.id, dependsOn: s.dependsOn })), { id: row!.id, dependsOn: deps }];
      for (const s of ctx.steps) {
        if (s.id === remedyOf || s.remedyOfStepId === remedyOf || !s.dependsOn.includes(remedyOf)) continue;
        const next = graph.map((g) => (g.id === s.id ? { ...g, dependsOn: [...g.dependsOn, row!.id] } : g));
        if (findCycle(next)) continue;
        graph = next;
        await tx.insert(stepDependencies).values({ stepId: s.id, dependsOnStepId: row!.id });
      }
      const order = ctx.steps.map((s) => s.id);
      let at = order.indexOf(remedyOf) + 1;
      while (at < order.length && ctx.steps[at]!.remedyOfStepId === remedyOf) at++;
      order.splice(at, 0, row!.id);
      await renumber(tx, order);
    }
    return row!;
  });
}

export async function updateStep({
  stepId,
  episodeId,
  channelId,
  patch,
  check,
}: {
  stepId: string;
  episodeId: string;
  channelId: string;
  patch: StepUpdate & { failureNote?: string | null; failurePhotoKey?: string | null };
  check: (ctx: PlanContext, current: StepWithLinks) => void;
}) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    const ctx = await context(tx, episodeId, channelId);
    const current = ctx.steps.find((s) => s.id === stepId);
    if (!current) return null;
    check(ctx, current);
    const { dependsOn, toolIds, ...fields } = patch;
    await tx
      .update(buildSteps)
      .set({ ...fields, updatedAt: new Date() })
      .where(eq(buildSteps.id, stepId));
    await writeLinks(tx, stepId, dependsOn, toolIds);
    const [after] = await stepsWithLinks(tx, episodeId).then((all) => all.filter((s) => s.id === stepId));
    return { before: current, after: after! };
  });
}

export async function deleteStep({ stepId, episodeId }: { stepId: string; episodeId: string }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    const [row] = await tx.delete(buildSteps).where(and(eq(buildSteps.id, stepId), eq(buildSteps.episodeId, episodeId))).returning();
    if (!row) return null;
    // Remedies of a deleted step stay in the plan as ordinary steps.
    await tx.update(buildSteps).set({ remedyOfStepId: null }).where(eq(buildSteps.remedyOfStepId, stepId));
    const rest = await tx.select({ id: buildSteps.id }).from(buildSteps).where(eq(buildSteps.episodeId, episodeId)).orderBy(asc(buildSteps.position));
    await renumber(tx, rest.map((r) => r.id));
    return row;
  });
}

/** Sets the whole order at once; `ids` must be exactly the episode's steps. */
export async function reorderSteps({ episodeId, ids, check }: { episodeId: string; ids: string[]; check: (current: string[]) => void }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    const current = await tx.select({ id: buildSteps.id }).from(buildSteps).where(eq(buildSteps.episodeId, episodeId));
    check(current.map((c) => c.id));
    await renumber(tx, ids);
  });
}
