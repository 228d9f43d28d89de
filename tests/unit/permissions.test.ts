import { describe, expect, it } from "vitest";
import { ACTIONS, can, canMoveEpisode } from "@/lib/permissions";
import { ROLES, type Role } from "@/lib/roles";
import { STAGES } from "@/lib/stages";

// The role table is Jigboard's own product rule (no outside source): it is
// restated here independently of lib/permissions so a change to one shows up.
const EXPECTED: Record<string, Role[]> = {
  "channel.read": ["owner", "presenter", "editor", "producer", "sponsor_liaison"],
  "members.manage": ["owner"],
  "episode.create": ["owner", "presenter", "producer"],
  "episode.edit": ["owner", "presenter", "producer"],
  "episode.archive": ["owner", "presenter", "producer"],
};

describe("permission module", () => {
  for (const [action, allowed] of Object.entries(EXPECTED)) {
    for (const role of ROLES) {
      it(`${role} ${allowed.includes(role) ? "may" : "may not"} ${action}`, () => {
        expect(can([role], action as keyof typeof ACTIONS)).toBe(allowed.includes(role));
      });
    }
  }

  it("denies by default: no roles, no membership", () => {
    for (const action of Object.keys(ACTIONS) as (keyof typeof ACTIONS)[]) {
      expect(can([], action)).toBe(false);
      expect(can(null, action)).toBe(false);
    }
  });

  it("several roles add up", () => {
    expect(can(["editor", "sponsor_liaison"], "footage.manage")).toBe(true);
    expect(can(["editor", "sponsor_liaison"], "sponsors.manage")).toBe(true);
    expect(can(["editor", "sponsor_liaison"], "episode.create")).toBe(false);
  });

  it("editors move only between editing and final check", () => {
    for (const from of STAGES) {
      for (const to of STAGES) {
        const editing = (s: string) => s === "editing" || s === "review";
        expect(canMoveEpisode(["editor"], from, to)).toBe(editing(from) && editing(to));
      }
    }
  });

  it("owner, presenter and producer move anywhere; sponsor liaison nowhere", () => {
    for (const from of STAGES)
      for (const to of STAGES) {
        expect(canMoveEpisode(["owner"], from, to)).toBe(true);
        expect(canMoveEpisode(["presenter"], from, to)).toBe(true);
        expect(canMoveEpisode(["producer"], from, to)).toBe(true);
        expect(canMoveEpisode(["sponsor_liaison"], from, to)).toBe(false);
      }
  });
});
