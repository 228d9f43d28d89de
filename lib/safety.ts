/**
 * Shop-safety cautions shown beside build steps. Signal words follow the
 * safety-sign conventions (ANSI Z535.4 / ISO 3864-2): WARNING (orange) and
 * CAUTION (yellow), always with words and a symbol, never colour alone.
 * They are reminders, not instructions: the manufacturer's instructions,
 * local codes and licensed practice always come first.
 */
export const HAZARDS = ["power_tool", "finish", "fire"] as const;
export type Hazard = (typeof HAZARDS)[number];

export const TOOL_KINDS = ["hand_tool", "power_tool", "finish", "heat", "clamp", "measuring", "other"] as const;
export type ToolKind = (typeof TOOL_KINDS)[number];
export const TOOL_KIND_LABELS: Record<ToolKind, string> = {
  hand_tool: "Hand tool",
  power_tool: "Power tool",
  finish: "Finish or adhesive",
  heat: "Heat or flame",
  clamp: "Clamp or holding",
  measuring: "Measuring and marking",
  other: "Other",
};

export const CAUTIONS: Record<Hazard, { signal: "WARNING" | "CAUTION"; title: string; text: string }> = {
  power_tool: {
    signal: "WARNING",
    title: "Power tools",
    text: "Wear eye and hearing protection, and dust protection where dust is made. Keep guards and riving knives in place, keep hands out of the cutting path, and unplug before changing blades or bits.",
  },
  finish: {
    signal: "CAUTION",
    title: "Finishes and solvents",
    text: "Ventilate well and wear gloves and a respirator suited to the product. Oily rags can heat up and catch fire by themselves: lay them flat to dry outdoors or keep them in a closed metal container filled with water.",
  },
  fire: {
    signal: "WARNING",
    title: "Heat and open flame",
    text: "Keep an extinguisher within reach, clear shavings, dust and solvents away, and never leave a flame or hot surface unattended.",
  },
};

export const DEFER = "Follow the manufacturer's instructions, local codes and licensed practice; these notes do not replace them.";

const TOOL_HAZARD: Partial<Record<ToolKind, Hazard>> = { power_tool: "power_tool", finish: "finish", heat: "fire" };

/** A step's hazards: those flagged on the step plus those its tools bring. */
export function stepHazards(flags: readonly string[], toolKinds: readonly string[]): Hazard[] {
  const set = new Set<Hazard>();
  for (const f of flags) if ((HAZARDS as readonly string[]).includes(f)) set.add(f as Hazard);
  for (const k of toolKinds) {
    const h = TOOL_HAZARD[k as ToolKind];
    if (h) set.add(h);
  }
  return HAZARDS.filter((h) => set.has(h));
}
