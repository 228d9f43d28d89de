/**
 * Cut-list arithmetic: board feet, volume, sheet counts and cost with waste.
 * Pure; inches inside, millimetres converted at the edge (1 in = 25.4 mm exactly).
 */
export const MM_PER_INCH = 25.4;
/** 1 board foot = 144 in³ = 144 × 16.387064 cm³ = 2.359737216 dm³. */
export const CUBIC_METRES_PER_BOARD_FOOT = (144 * MM_PER_INCH ** 3) / 1e9;

export type DimUnit = "in" | "mm";
export type Sizing = "nominal" | "actual";
export const PRICING_UNITS = ["board_foot", "linear_foot", "linear_metre", "sheet", "each"] as const;
export type PricingUnit = (typeof PRICING_UNITS)[number];

export const PRICING_LABELS: Record<PricingUnit, string> = {
  board_foot: "per board foot",
  linear_foot: "per linear foot",
  linear_metre: "per metre",
  sheet: "per sheet",
  each: "each",
};

/** A full sheet of plywood or MDF: 4 ft × 8 ft, or 1220 × 2440 mm where metric (common practice). */
export const SHEET_AREA_SQ_IN = { in: 48 * 96, mm: (1220 * 2440) / MM_PER_INCH ** 2 } as const;

export function toInches(value: number, unit: DimUnit): number {
  return unit === "mm" ? value / MM_PER_INCH : value;
}

/** BF = T × W × L / 144, all in inches. */
export function boardFeet(tIn: number, wIn: number, lIn: number): number {
  return (tIn * wIn * lIn) / 144;
}

/** Hardwood trade form: BF = T(in) × W(in) × L(ft) / 12. */
export function boardFeetHardwood(tIn: number, wIn: number, lFt: number): number {
  return (tIn * wIn * lFt) / 12;
}

export function cubicMetres(tIn: number, wIn: number, lIn: number): number {
  return (tIn * wIn * lIn * MM_PER_INCH ** 3) / 1e9;
}

/**
 * Dressed dry size of a nominal dimension (American Softwood Lumber Standard,
 * PS 20): 1 → 3/4, 2 → 1-1/2, 3 → 2-1/2, 4 → 3-1/2, 6 → 5-1/2, 8 → 7-1/4,
 * 10 → 9-1/4, 12 → 11-1/4.
 */
export function dressedSize(nominalIn: number): number | null {
  const table: Record<number, number> = { 1: 0.75, 2: 1.5, 3: 2.5, 4: 3.5, 5: 4.5, 6: 5.5, 8: 7.25, 10: 9.25, 12: 11.25 };
  return table[nominalIn] ?? null;
}

export interface MaterialRowInput {
  material: string;
  unit: DimUnit;
  thickness: number;
  width: number;
  length: number;
  quantity: number;
  sizing: Sizing;
  pricingUnit: PricingUnit;
  unitPriceMinor: number;
  wastePercent: number;
}

export interface MaterialRowFigures {
  /** Board feet for all pieces of the row, before waste. */
  boardFeet: number;
  cubicMetres: number;
  /** Fraction of a full sheet used by the row, with waste (sheet goods). */
  sheets: number;
  linearFeet: number;
  /** Cost in minor units, waste included. */
  costMinor: number;
}

/**
 * Board measure of one row. Nominal (softwood) sizes use the nominal figures
 * and count stock under 1 in as 1 in; actual sizes use the measured figures.
 */
export function rowFigures(r: MaterialRowInput): MaterialRowFigures {
  const t = toInches(r.thickness, r.unit);
  const w = toInches(r.width, r.unit);
  const l = toInches(r.length, r.unit);
  const q = r.quantity;
  const waste = 1 + r.wastePercent / 100;
  const bmThickness = r.sizing === "nominal" ? Math.max(1, t) : t;
  const bf = boardFeet(bmThickness, w, l) * q;
  // Volume is physical: nominal stock is smaller than its name.
  const actualT = r.sizing === "nominal" ? (dressedSize(t) ?? t) : t;
  const actualW = r.sizing === "nominal" ? (dressedSize(w) ?? w) : w;
  const m3 = cubicMetres(actualT, actualW, l) * q;
  const sheetArea = SHEET_AREA_SQ_IN[r.unit];
  const sheets = ((w * l * q) / sheetArea) * waste;
  const linearFeet = (l / 12) * q;
  let units: number;
  switch (r.pricingUnit) {
    case "board_foot":
      units = bf * waste;
      break;
    case "linear_foot":
      units = linearFeet * waste;
      break;
    case "linear_metre":
      units = ((l * MM_PER_INCH) / 1000) * q * waste;
      break;
    case "sheet":
      units = sheets;
      break;
    case "each":
      units = Math.ceil(q * waste);
      break;
  }
  return { boardFeet: bf, cubicMetres: m3, sheets, linearFeet, costMinor: Math.round(units * r.unitPriceMinor) };
}

export interface MaterialTotal {
  material: string;
  boardFeet: number;
  cubicMetres: number;
  /** Whole sheets to buy for sheet goods (the summed fractions, rounded up). */
  sheetsToBuy: number;
  costMinor: number;
  rows: number;
}

export function totalsByMaterial(rows: MaterialRowInput[]): { byMaterial: MaterialTotal[]; total: Omit<MaterialTotal, "material" | "sheetsToBuy"> & { sheetsToBuy: number } } {
  const map = new Map<string, MaterialTotal & { sheetFraction: number; sheetPrice: number; otherCost: number }>();
  for (const r of rows) {
    const f = rowFigures(r);
    const key = r.material.trim() || "(unnamed)";
    const t = map.get(key) ?? { material: key, boardFeet: 0, cubicMetres: 0, sheetsToBuy: 0, costMinor: 0, rows: 0, sheetFraction: 0, sheetPrice: 0, otherCost: 0 };
    t.boardFeet += f.boardFeet;
    t.cubicMetres += f.cubicMetres;
    t.rows += 1;
    if (r.pricingUnit === "sheet") {
      t.sheetFraction += f.sheets;
      t.sheetPrice = Math.max(t.sheetPrice, r.unitPriceMinor);
    } else {
      t.otherCost += f.costMinor;
    }
    map.set(key, t);
  }
  const byMaterial = [...map.values()].map((t) => {
    // Sheets are bought whole; tolerate float noise so 2.0000000001 is 2.
    const sheetsToBuy = t.sheetFraction > 0 ? Math.ceil(t.sheetFraction - 1e-9) : 0;
    return { material: t.material, boardFeet: t.boardFeet, cubicMetres: t.cubicMetres, sheetsToBuy, costMinor: t.otherCost + sheetsToBuy * t.sheetPrice, rows: t.rows };
  });
  const total = byMaterial.reduce(
    (a, m) => ({ boardFeet: a.boardFeet + m.boardFeet, cubicMetres: a.cubicMetres + m.cubicMetres, sheetsToBuy: a.sheetsToBuy + m.sheetsToBuy, costMinor: a.costMinor + m.costMinor, rows: a.rows + m.rows }),
    { boardFeet: 0, cubicMetres: 0, sheetsToBuy: 0, costMinor: 0, rows: 0 },
  );
  return { byMaterial, total };
}

export function formatMoney(minor: number, currency: string): string {
  return new Intl.NumberFormat("en", { style: "currency", currency }).format(minor / 100);
}
