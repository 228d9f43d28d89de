import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { columnsOf, moveItem, type BoardItem } from "@/lib/board";
import { STAGES } from "@/lib/stages";

function dense(items: BoardItem[]) {
  const cols = columnsOf(items);
  return STAGES.every((s) => cols[s].every((item, i) => item.position === i));
}

describe("board moves (property tests with fast-check)", () => {
  const stage = fc.constantFrom(...STAGES);
  const board = fc.array(stage, { minLength: 1, maxLength: 30 }).map((stages) => {
    const counters: Record<string, number> = {};
    return stages.map((s, i) => ({ id: `e${i}`, stage: s, position: (counters[s] = (counters[s] ?? -1) + 1) }));
  });

  it("keeps every column dense and loses no card over any sequence of moves", () => {
    fc.assert(
      fc.property(board, fc.array(fc.tuple(fc.nat(40), stage, fc.integer({ min: -3, max: 40 })), { maxLength: 25 }), (items, moves) => {
        let cur: BoardItem[] = items;
        for (const [pick, to, index] of moves) {
          const id = cur[pick % cur.length]!.id;
          cur = moveItem(cur, id, to, index);
        }
        expect(cur.length).toBe(items.length);
        expect(new Set(cur.map((c) => c.id))).toEqual(new Set(items.map((c) => c.id)));
        expect(dense(cur)).toBe(true);
      }),
      { numRuns: 300 },
    );
  });

  it("puts the card exactly at the asked index (clamped)", () => {
    fc.assert(
      fc.property(board, fc.nat(40), stage, fc.integer({ min: -5, max: 50 }), (items, pick, to, index) => {
        const id = items[pick % items.length]!.id;
        const after = moveItem(items, id, to, index);
        const col = columnsOf(after)[to];
        const expected = Math.max(0, Math.min(index, col.length - 1));
        expect(col[expected]!.id).toBe(id);
      }),
      { numRuns: 300 },
    );
  });
});
