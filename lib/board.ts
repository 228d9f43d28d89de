/**
 * Pure board arithmetic shared by the client (optimistic updates) and tests:
 * moving one episode to a stage and index, with dense positions per stage.
 */
import { STAGES, type Stage } from "./stages";

export interface BoardItem {
  id: string;
  stage: Stage;
  position: number;
}

export function columnsOf<T extends BoardItem>(items: T[]): Record<Stage, T[]> {
  const cols = Object.fromEntries(STAGES.map((s) => [s, [] as T[]])) as Record<Stage, T[]>;
  for (const item of items) cols[item.stage].push(item);
  for (const s of STAGES) cols[s].sort((a, b) => a.position - b.position);
  return cols;
}

export function moveItem<T extends BoardItem>(items: T[], id: string, toStage: Stage, toIndex: number): T[] {
  const cols = columnsOf(items);
  const moving = items.find((i) => i.id === id);
  if (!moving) return items;
  const from = cols[moving.stage].filter((i) => i.id !== id);
  cols[moving.stage] = from;
  const target = moving.stage === toStage ? from : cols[toStage].filter((i) => i.id !== id);
  const at = Math.max(0, Math.min(toIndex, target.length));
  target.splice(at, 0, { ...moving, stage: toStage });
  cols[toStage] = target;
  return STAGES.flatMap((s) => cols[s].map((item, position) => ({ ...item, stage: s, position })));
}

/** Puts `id` into a column's ids at `index`, clamped to the column. */
export function placeInColumn(ids: string[], id: string, index: number): string[] {
  const rest = ids.filter((x) => x !== id);
  const at = Math.max(0, Math.min(index, rest.length));
  return [...rest.slice(0, at), id, ...rest.slice(at)];
}
