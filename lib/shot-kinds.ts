/** How a build step should be covered on camera; shared by the build plan and the shot list. */
export const COVERAGE_KINDS = ["to_camera", "broll", "overhead", "close_up", "time_lapse", "slow_motion"] as const;
export type CoverageKind = (typeof COVERAGE_KINDS)[number];
export const COVERAGE_LABELS: Record<CoverageKind, string> = {
  to_camera: "To camera",
  broll: "B-roll",
  overhead: "Overhead",
  close_up: "Close-up",
  time_lapse: "Time-lapse",
  slow_motion: "Slow motion",
};
