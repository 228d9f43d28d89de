import { z } from "zod";
import { COVERAGE_KINDS } from "../shot-kinds";
import { HAZARDS, TOOL_KINDS } from "../safety";
import { PRICING_UNITS } from "../materials";
import { parseMeasure } from "../fraction";

export const STEP_STATUSES = ["planned", "in_progress", "done", "failed", "skipped"] as const;
export type StepStatus = (typeof STEP_STATUSES)[number];
export const STEP_STATUS_LABELS: Record<StepStatus, string> = {
  planned: "Planned",
  in_progress: "In progress",
  done: "Done",
  failed: "Failed",
  skipped: "Skipped",
};

const minutes = (max: number, what: string) =>
  z.number({ message: `${what} must be a number of minutes` }).int("use whole minutes").min(0, "cannot be negative").max(max, `at most ${max} minutes`);

const ids = z.array(z.uuid({ message: "must be a valid id" })).max(200).refine((a) => new Set(a).size === a.length, "list each once");

const stepFields = {
  title: z.string().trim().min(1, "give the step a title").max(200),
  notes: z.string().max(8000),
  activeMinutes: minutes(7 * 24 * 60, "active time"),
  waitMinutes: minutes(60 * 24 * 60, "wait"),
  waitReason: z.string().trim().max(200),
  crewNeeded: z.number().int("whole people").min(1, "at least 1 person").max(10, "at most 10 people"),
  coverageKinds: z.array(z.enum(COVERAGE_KINDS)).max(COVERAGE_KINDS.length),
  hazards: z.array(z.enum(HAZARDS)).max(HAZARDS.length),
  dependsOn: ids,
  toolIds: ids,
  status: z.enum(STEP_STATUSES),
  mustFilm: z.boolean(),
  pinnedShootDayId: z.uuid({ message: "must be a valid shoot day id" }).nullable(),
};

/** Fields a producer may change on a step: durations, waits and crew, and how it is scheduled. */
export const TIMING_FIELDS = ["activeMinutes", "waitMinutes", "waitReason", "crewNeeded", "mustFilm", "pinnedShootDayId"] as const;

export const stepCreateSchema = z
  .object({
    ...stepFields,
    notes: stepFields.notes.default(""),
    activeMinutes: stepFields.activeMinutes.default(0),
    waitMinutes: stepFields.waitMinutes.default(0),
    waitReason: stepFields.waitReason.default(""),
    crewNeeded: stepFields.crewNeeded.default(1),
    coverageKinds: stepFields.coverageKinds.default([]),
    hazards: stepFields.hazards.default([]),
    dependsOn: stepFields.dependsOn.default([]),
    toolIds: stepFields.toolIds.default([]),
    status: stepFields.status.default("planned"),
    mustFilm: stepFields.mustFilm.default(true),
    pinnedShootDayId: stepFields.pinnedShootDayId.default(null),
  })
  .strict()
  .meta({ id: "StepCreate" });
export type StepCreate = z.output<typeof stepCreateSchema>;

export const stepUpdateSchema = z
  .object(stepFields)
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: "send at least one field to change" })
  .meta({ id: "StepUpdate" });
export type StepUpdate = z.output<typeof stepUpdateSchema>;

export const stepFailureSchema = z
  .object({
    note: z.string().trim().min(1, "say what went wrong").max(4000),
    photoKey: z.string().max(300).nullable().default(null),
  })
  .strict()
  .meta({ id: "StepFailure" });

export const stepOrderSchema = z.object({ ids: ids.min(1, "send the steps in their new order") }).strict().meta({ id: "StepOrder" });

export const photoUploadSchema = z
  .object({
    contentType: z.enum(["image/jpeg", "image/png", "image/webp"], { message: "use a JPEG, PNG or WebP photo" }),
    size: z.number().int().min(1, "the file is empty").max(20 * 1024 * 1024, "photos can be at most 20 MB"),
  })
  .strict()
  .meta({ id: "PhotoUpload" });

/** A size typed as 3/4, 1-1/2, 12.5 or sent as a number. */
export const measureSchema = z.union([z.number(), z.string()]).transform((v, ctx) => {
  if (typeof v === "number") {
    if (!Number.isFinite(v) || v < 0) ctx.addIssue({ code: "custom", message: "must be 0 or more" });
    return v;
  }
  const r = parseMeasure(v);
  if (!r.ok) {
    ctx.addIssue({ code: "custom", message: r.message });
    return z.NEVER;
  }
  return r.value;
});

const positiveMeasure = measureSchema.refine((v) => v > 0, "must be more than 0").refine((v) => v <= 100000, "is too large");

const materialFields = {
  partName: z.string().trim().min(1, "name the part").max(120),
  material: z.string().trim().max(120),
  unit: z.enum(["in", "mm"]),
  thickness: positiveMeasure,
  width: positiveMeasure,
  length: positiveMeasure,
  quantity: z.number().int("whole pieces").min(1, "at least 1").max(10000),
  sizing: z.enum(["nominal", "actual"]),
  pricingUnit: z.enum(PRICING_UNITS),
  unitPriceMinor: z.number().int("price in cents (minor units)").min(0, "cannot be negative").max(100_000_000),
  currency: z.string().regex(/^[A-Z]{3}$/, "use a 3-letter currency code such as USD"),
  wastePercent: z.number().min(0, "cannot be negative").max(100, "at most 100 %"),
  stepId: z.uuid({ message: "must be a valid step id" }).nullable(),
  supplierNote: z.string().max(500),
};

export const materialCreateSchema = z
  .object({
    ...materialFields,
    material: materialFields.material.default(""),
    unit: materialFields.unit.default("in"),
    quantity: materialFields.quantity.default(1),
    sizing: materialFields.sizing.default("actual"),
    pricingUnit: materialFields.pricingUnit.default("board_foot"),
    unitPriceMinor: materialFields.unitPriceMinor.default(0),
    currency: materialFields.currency.default("USD"),
    wastePercent: materialFields.wastePercent.default(0),
    stepId: materialFields.stepId.default(null),
    supplierNote: materialFields.supplierNote.default(""),
  })
  .strict()
  .meta({ id: "MaterialCreate" });
export type MaterialCreate = z.output<typeof materialCreateSchema>;

export const materialUpdateSchema = z
  .object(materialFields)
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: "send at least one field to change" })
  .meta({ id: "MaterialUpdate" });
export type MaterialUpdate = z.output<typeof materialUpdateSchema>;

export const ACQUISITIONS = ["bought", "gifted", "loaned", "paid_placement"] as const;
export type Acquisition = (typeof ACQUISITIONS)[number];
export const ACQUISITION_LABELS: Record<Acquisition, string> = {
  bought: "Bought by the channel",
  gifted: "Gifted by a sponsor",
  loaned: "Loaned by a sponsor",
  paid_placement: "Paid placement",
};

const toolFields = {
  name: z.string().trim().min(1, "name the tool").max(120),
  kind: z.enum(TOOL_KINDS),
  acquisition: z.enum(ACQUISITIONS),
  sponsorId: z.uuid({ message: "must be a valid sponsor id" }).nullable(),
  caution: z.string().max(2000),
  photoKey: z.string().max(300).nullable(),
};

export const toolCreateSchema = z
  .object({
    ...toolFields,
    kind: toolFields.kind.default("other"),
    acquisition: toolFields.acquisition.default("bought"),
    sponsorId: toolFields.sponsorId.default(null),
    caution: toolFields.caution.default(""),
    photoKey: toolFields.photoKey.default(null),
  })
  .strict()
  .meta({ id: "ToolCreate" });
export type ToolCreate = z.output<typeof toolCreateSchema>;

export const toolUpdateSchema = z
  .object(toolFields)
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: "send at least one field to change" })
  .meta({ id: "ToolUpdate" });
export type ToolUpdate = z.output<typeof toolUpdateSchema>;

/** A tool that came from a sponsor will need credit and disclosure. */
export function isSponsoredAcquisition(a: string): boolean {
  return a === "gifted" || a === "loaned" || a === "paid_placement";
}

// ---- Responses: one schema per resource, used by the views (typed), the OpenAPI document and the browser.

export const toolSchema = z
  .object({ id: z.string(), name: z.string(), kind: z.enum(TOOL_KINDS), acquisition: z.enum(ACQUISITIONS), sponsorId: z.string().nullable(), sponsored: z.boolean(), caution: z.string(), photoKey: z.string().nullable() })
  .meta({ id: "Tool" });
export type ToolDto = z.infer<typeof toolSchema>;

const stepTimingSchema = z.object({ start: z.number(), activeEnd: z.number(), end: z.number() });
export const planStepSchema = z
  .object({
    id: z.string(),
    position: z.number(),
    title: z.string(),
    notes: z.string(),
    activeMinutes: z.number(),
    waitMinutes: z.number(),
    waitReason: z.string(),
    crewNeeded: z.number(),
    coverageKinds: z.array(z.enum(COVERAGE_KINDS)),
    hazards: z.array(z.string()),
    cautions: z.array(z.enum(HAZARDS)),
    dependsOn: z.array(z.string()),
    toolIds: z.array(z.string()),
    status: z.enum(STEP_STATUSES),
    failureNote: z.string().nullable(),
    failurePhotoUrl: z.string().nullable(),
    remedyOfStepId: z.string().nullable(),
    mustFilm: z.boolean(),
    pinnedShootDayId: z.string().nullable(),
    /** Elapsed minutes from the first step, with enough people for everything. */
    timing: stepTimingSchema,
    /** The same chain with hands-on time counted against the team's people. */
    crewTiming: stepTimingSchema.extend({ crewDelayMinutes: z.number() }),
  })
  .meta({ id: "PlanStep" });
export type PlanStepDto = z.infer<typeof planStepSchema>;

export const planSchema = z
  .object({
    steps: z.array(planStepSchema),
    timing: z.object({ totalActiveMinutes: z.number(), totalWaitMinutes: z.number(), criticalPathMinutes: z.number(), criticalPath: z.array(z.string()) }),
    crew: z.object({ team: z.number(), finishMinutes: z.number(), overCrew: z.array(z.string()) }),
    toolsUsed: z.array(toolSchema.extend({ steps: z.array(z.string()) })),
  })
  .meta({ id: "BuildPlan" });
export type PlanDto = z.infer<typeof planSchema>;

const figuresSchema = z.object({ boardFeet: z.number(), cubicMetres: z.number(), sheets: z.number(), linearFeet: z.number(), costMinor: z.number() });
export const materialSchema = z
  .object({
    id: z.string(),
    partName: z.string(),
    material: z.string(),
    unit: z.enum(["in", "mm"]),
    thickness: z.number(),
    width: z.number(),
    length: z.number(),
    quantity: z.number(),
    sizing: z.enum(["nominal", "actual"]),
    pricingUnit: z.enum(PRICING_UNITS),
    unitPriceMinor: z.number(),
    currency: z.string(),
    wastePercent: z.number(),
    stepId: z.string().nullable(),
    supplierNote: z.string(),
    figures: figuresSchema,
  })
  .meta({ id: "MaterialRow" });
export type MaterialDto = z.infer<typeof materialSchema>;

const materialTotalSchema = z.object({ material: z.string(), boardFeet: z.number(), cubicMetres: z.number(), sheetsToBuy: z.number(), costMinor: z.number(), rows: z.number() });
export const cutListSchema = z
  .object({ rows: z.array(materialSchema), totals: z.object({ byMaterial: z.array(materialTotalSchema), total: materialTotalSchema.omit({ material: true }) }) })
  .meta({ id: "CutList" });
export type CutListDto = z.infer<typeof cutListSchema>;
