/**
 * Cut-list CSV: one row per part, prices in major units ("12.50"), sizes as
 * written on a tape ("3/4", "1-1/2"). Export and import use the same columns,
 * so an export imports back to the same rows.
 */
import Papa from "papaparse";
import { formatInches } from "./fraction";
import type { MaterialRowInput } from "./materials";

export const CSV_COLUMNS = [
  "part",
  "material",
  "unit",
  "thickness",
  "width",
  "length",
  "quantity",
  "sizing",
  "pricing_unit",
  "unit_price",
  "currency",
  "waste_percent",
  "step",
  "supplier_note",
] as const;

export interface CsvRow extends MaterialRowInput {
  partName: string;
  currency: string;
  stepTitle: string | null;
  supplierNote: string;
}

function size(v: number, unit: "in" | "mm"): string {
  if (unit === "in" && Math.abs(v * 16 - Math.round(v * 16)) < 1e-9) return formatInches(v);
  return String(Number(v.toFixed(4)));
}

/**
 * Export options for every CSV Jigboard writes. A cell starting with =, +, -,
 * @, tab or CR would run as a formula in a spreadsheet (OWASP "CSV
 * Injection"); papaparse's escapeFormulae puts a ' before it. Import keeps
 * whatever text the file holds.
 */
export const CSV_EXPORT_OPTIONS = { escapeFormulae: true } as const;

export function toCsv(rows: CsvRow[]): string {
  return Papa.unparse({
    fields: [...CSV_COLUMNS],
    data: rows.map((r) => [
      r.partName,
      r.material,
      r.unit,
      size(r.thickness, r.unit),
      size(r.width, r.unit),
      size(r.length, r.unit),
      r.quantity,
      r.sizing,
      r.pricingUnit,
      (r.unitPriceMinor / 100).toFixed(2),
      r.currency,
      r.wastePercent,
      r.stepTitle ?? "",
      r.supplierNote,
    ]),
  }, CSV_EXPORT_OPTIONS);
}

export interface CsvRecord {
  line: number;
  values: Record<(typeof CSV_COLUMNS)[number], string>;
}

/** Parses the text into records keyed by column, or says which header is wrong. */
export function parseCsv(text: string): { ok: true; records: CsvRecord[] } | { ok: false; message: string } {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ""), { header: true, skipEmptyLines: "greedy", transformHeader: (h) => h.trim().toLowerCase() });
  const missing = CSV_COLUMNS.filter((c) => !(parsed.meta.fields ?? []).includes(c));
  if (missing.length) return { ok: false, message: `The header is missing: ${missing.join(", ")}. Export a cut list to see the expected columns.` };
  const broken = parsed.errors.find((e) => e.type !== "FieldMismatch" || e.code === "TooManyFields");
  if (broken) return { ok: false, message: `Line ${(broken.row ?? 0) + 2}: ${broken.message}` };
  return {
    ok: true,
    records: parsed.data.map((d, i) => ({
      line: i + 2, // line 1 is the header
      values: Object.fromEntries(CSV_COLUMNS.map((c) => [c, (d[c] ?? "").trim()])) as CsvRecord["values"],
    })),
  };
}

/** Turns a CSV record into the API's material body; the route validates it with the shared schema. */
export function recordToBody(r: CsvRecord, stepIdByTitle: Map<string, string>) {
  const v = r.values;
  const num = (s: string) => (s === "" ? Number.NaN : Number(s));
  const price = num(v.unit_price);
  return {
    body: {
      partName: v.part,
      material: v.material,
      unit: v.unit || "in",
      thickness: v.thickness,
      width: v.width,
      length: v.length,
      quantity: v.quantity === "" ? 1 : num(v.quantity),
      sizing: v.sizing || "actual",
      pricingUnit: v.pricing_unit || "board_foot",
      unitPriceMinor: v.unit_price === "" ? 0 : Number.isFinite(price) ? Math.round(price * 100) : Number.NaN,
      currency: v.currency || "USD",
      wastePercent: v.waste_percent === "" ? 0 : num(v.waste_percent),
      stepId: v.step ? (stepIdByTitle.get(v.step.toLowerCase()) ?? "unknown-step") : null,
      supplierNote: v.supplier_note,
    },
    unknownStep: v.step && !stepIdByTitle.has(v.step.toLowerCase()) ? v.step : null,
  };
}
