import "server-only";
import { and, asc, eq, inArray, isNull, sql } from "drizzle-orm";
import { db, type Q, type Tx } from "../client";
import { buildSteps, episodes, stepDependencies, stepTools, tools, type BuildStep } from "../schema";

/**
 * Rows of build steps and their links. Rules (loops, remedies, who may edit
 * what) live in lib/server/services/build-plan.ts, which opens the
 * transaction and passes it in.
 */
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

export async function listStepsWithLinks(q: Q, episodeId: string): Promise<StepWithLinks[]> {
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

/** Ids and titles of an episode's steps (to check a link to a step, or to name it). */
export async function listStepTitlesByEpisode({ episodeId }: { episodeId: string }) {
  return db().select({ id: buildSteps.id, title: buildSteps.title }).from(buildSteps).where(eq(buildSteps.episodeId, episodeId));
}

export function listStepsByEpisode({ episodeId }: { episodeId: string }) {
  return listStepsWithLinks(db(), episodeId);
}

/** Ids of the channel's tools that are not archived. */
export async function listActiveToolIds(q: Q, channelId: string) {
  const rows = await q.select({ id: tools.id }).from(tools).where(and(eq(tools.channelId, channelId), isNull(tools.archivedAt)));
  return new Set(rows.map((x) => x.id));
}

export async function listStepIdsInOrder(q: Q, episodeId: string) {
  const rows = await q.select({ id: buildSteps.id }).from(buildSteps).where(eq(buildSteps.episodeId, episodeId)).orderBy(asc(buildSteps.position), asc(buildSteps.createdAt));
  return rows.map((r) => r.id);
}

/** Writes positions 0..n-1 in the given order, in one statement. */
export async function writeStepPositions(tx: Tx, ids: string[]) {
  if (ids.length === 0) return;
  const values = sql.join(
    ids.map((id, i) => sql`(${id}::uuid, ${i}::int)`),
    sql`, `,
  );
  await tx.execute(sql`update build_steps set position = v.pos from (values ${values}) as v(id, pos) where build_steps.id = v.id`);
}

/** Replaces a step's dependencies and/or tools (a list left out is kept). */
export async function replaceStepLinks(tx: Tx, stepId: string, dependsOn?: string[], toolIds?: string[]) {
  if (dependsOn) {
    await tx.delete(stepDependencies).where(eq(stepDependencies.stepId, stepId));
    if (dependsOn.length) await tx.insert(stepDependencies).values(dependsOn.map((d) => ({ stepId, dependsOnStepId: d })));
  }
  if (toolIds) {
    await tx.delete(stepTools).where(eq(stepTools.stepId, stepId));
    if (toolIds.length) await tx.insert(stepTools).values(toolIds.map((toolId) => ({ stepId, toolId })));
  }
}

export async function addStepDependency(tx: Tx, stepId: string, dependsOnStepId: string) {
  await tx.insert(stepDependencies).values({ stepId, dependsOnStepId });
}

export async function insertStep(tx: Tx, values: typeof buildSteps.$inferInsert) {
  const [row] = await tx.insert(buildSteps).values(values).returning();
  return row!;
}

export async function updateStepRow(tx: Tx, stepId: string, fields: Partial<typeof buildSteps.$inferInsert>) {
  await tx
    .update(buildSteps)
    .set({ ...fields, updatedAt: new Date() })
    .where(eq(buildSteps.id, stepId));
}

export async function deleteStepRow(tx: Tx, stepId: string, episodeId: string) {
  const [row] = await tx.delete(buildSteps).where(and(eq(buildSteps.id, stepId), eq(buildSteps.episodeId, episodeId))).returning();
  return row ?? null;
}

/** Remedies of a step that goes become ordinary steps. */
export async function detachRemedies(tx: Tx, stepId: string) {
  await tx.update(buildSteps).set({ remedyOfStepId: null }).where(eq(buildSteps.remedyOfStepId, stepId));
}
