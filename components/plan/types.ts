import { fetchJson } from "@/components/fetch-json";
import type { Hazard } from "@/lib/safety";
import type { StepStatus } from "@/lib/schemas/build";

export interface PlanStepDto {
  id: string;
  position: number;
  title: string;
  notes: string;
  activeMinutes: number;
  waitMinutes: number;
  waitReason: string;
  crewNeeded: number;
  coverageKinds: string[];
  hazards: string[];
  cautions: Hazard[];
  dependsOn: string[];
  toolIds: string[];
  status: StepStatus;
  failureNote: string | null;
  failurePhotoUrl: string | null;
  remedyOfStepId: string | null;
  timing: { start: number; activeEnd: number; end: number };
  /** The same chain with hands-on time counted against the team's people. */
  crewTiming: { start: number; activeEnd: number; end: number; crewDelayMinutes: number };
}

export interface ToolDto {
  id: string;
  name: string;
  kind: string;
  acquisition: string;
  sponsorId: string | null;
  sponsored: boolean;
  caution: string;
}

export interface PlanDto {
  steps: PlanStepDto[];
  timing: { totalActiveMinutes: number; totalWaitMinutes: number; criticalPathMinutes: number; criticalPath: string[] };
  toolsUsed: (ToolDto & { steps: string[] })[];
  crew: { team: number; finishMinutes: number; overCrew: string[] };
}

export function api<T>(url: string, init?: { method?: string; json?: unknown; body?: BodyInit | null }): Promise<T> {
  return fetchJson<T>(url, init);
}
