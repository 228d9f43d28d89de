import "server-only";
import { rowFigures, totalsByMaterial } from "../../materials";
import { toMaterialInput } from "../../../db/queries/materials";
import type { MaterialRow } from "../../../db/schema";

export function materialsView(rows: MaterialRow[]) {
  const inputs = rows.map(toMaterialInput);
  return {
    rows: inputs.map((r) => ({ ...r, figures: rowFigures(r) })),
    totals: totalsByMaterial(inputs),
  };
}
