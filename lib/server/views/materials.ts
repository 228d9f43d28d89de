import "server-only";
import { rowFigures, totalsByMaterial, type MaterialRowInput } from "../../materials";
import type { CutListDto, MaterialDto } from "../../schemas/build";
import type { MaterialRow } from "../../../db/schema";

/** A stored cut-list row as numbers (sizes and percentages are exact decimals in the database). */
export function toMaterialInput(r: MaterialRow): MaterialRowInput & Omit<MaterialDto, "figures"> {
  return {
    id: r.id,
    partName: r.partName,
    material: r.material,
    unit: r.unit,
    thickness: Number(r.thickness),
    width: Number(r.width),
    length: Number(r.length),
    quantity: r.quantity,
    sizing: r.sizing,
    pricingUnit: r.pricingUnit,
    unitPriceMinor: r.unitPriceMinor,
    currency: r.currency,
    wastePercent: Number(r.wastePercent),
    stepId: r.stepId,
    supplierNote: r.supplierNote,
  };
}

export function toMaterialDto(r: MaterialRow): MaterialDto {
  const input = toMaterialInput(r);
  return { ...input, figures: rowFigures(input) };
}

/** The cut list with each row's figures and the totals by material. */
export function materialsView(rows: MaterialRow[]): CutListDto {
  const inputs = rows.map(toMaterialInput);
  return {
    rows: inputs.map((r) => ({ ...r, figures: rowFigures(r) })),
    totals: totalsByMaterial(inputs),
  };
}
