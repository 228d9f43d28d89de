/**
 * Production stages of an episode, in board order. Names are Jigboard's own
 * plain words for where a build-and-film project stands.
 */
export const STAGES = ["idea", "planning", "shooting", "editing", "review", "scheduled", "published"] as const;
export type Stage = (typeof STAGES)[number];

export const STAGE_INFO: Record<Stage, { label: string; hint: string; step: number }> = {
  idea: { label: "Sketchbook", hint: "Ideas worth a build", step: 1 },
  planning: { label: "Planning", hint: "Steps, cut list, script", step: 2 },
  shooting: { label: "In the shop", hint: "Building and filming", step: 3 },
  editing: { label: "Editing", hint: "Cutting the footage", step: 4 },
  review: { label: "Final check", hint: "Sponsor and team review", step: 5 },
  scheduled: { label: "Queued", hint: "Waiting for its publish date", step: 6 },
  published: { label: "Published", hint: "Out in the world", step: 7 },
};

/** Stages the editor may move episodes between. */
export const EDITING_STAGES: readonly Stage[] = ["editing", "review"];

export function isStage(value: unknown): value is Stage {
  return typeof value === "string" && (STAGES as readonly string[]).includes(value);
}

/** Secondary cue only: stages are told apart by name and position first (WCAG 1.4.1). */
export const STAGE_COLOURS: Record<Stage, string> = {
  idea: "#8a7a5c",
  planning: "#5f7a4e",
  shooting: "#a4572f",
  editing: "#4b6587",
  review: "#7a5a86",
  scheduled: "#2f7a78",
  published: "#3e4a3d",
};
