import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { CUBIC_METRES_PER_BOARD_FOOT, boardFeet, boardFeetHardwood, cubicMetres, dressedSize, rowFigures, totalsByMaterial, type MaterialRowInput } from "@/lib/materials";

const row = (r: Partial<MaterialRowInput>): MaterialRowInput => ({
  material: "White oak",
  unit: "in",
  thickness: 1,
  width: 12,
  length: 12,
  quantity: 1,
  sizing: "actual",
  pricingUnit: "board_foot",
  unitPriceMinor: 1000,
  wastePercent: 0,
  ...r,
});

describe("board feet", () => {
  // Definition: 1 board foot = 1 in × 12 in × 12 in = 144 in³ (NHLA rules, as explained by AHEC, "Measurement").
  it("1 × 12 × 12 inches is one board foot", () => {
    expect(boardFeet(1, 12, 12)).toBe(1);
  });

  // Hardwood trade form BF = T(in) × W(in) × L(ft) / 12 (NHLA via AHEC): a 1 in × 6 in × 8 ft board is 4 BF.
  it("hardwood trade form agrees with the definition", () => {
    expect(boardFeetHardwood(1, 6, 8)).toBe(4);
    fc.assert(
      fc.property(fc.double({ min: 0.25, max: 8, noNaN: true }), fc.double({ min: 1, max: 24, noNaN: true }), fc.double({ min: 1, max: 20, noNaN: true }), (t, w, lFt) => {
        expect(boardFeetHardwood(t, w, lFt)).toBeCloseTo(boardFeet(t, w, lFt * 12), 9);
      }),
    );
  });

  // 8/4 stock, 10 in wide, 10 ft long: 2 × 10 × 10 / 12 = 16.67 BF (NHLA trade form, worked by hand).
  it("8/4 × 10 in × 10 ft is 16 2/3 BF", () => {
    expect(boardFeetHardwood(2, 10, 10)).toBeCloseTo(50 / 3, 12);
  });

  // 1 BF = 144 in³ = 2.359737 dm³ (exact from 1 in = 25.4 mm).
  it("one board foot is 2.359737 dm³", () => {
    expect(CUBIC_METRES_PER_BOARD_FOOT * 1000).toBeCloseTo(2.359737, 6);
    expect(cubicMetres(1, 12, 12) * 1000).toBeCloseTo(2.359737216, 9);
  });

  // Softwood board measure uses nominal sizes; stock under 1 in counts as 1 in
  // (US Navy builder training manual, board measure). A nominal 1x6, 8 ft long: 1 × 6 × 96 / 144 = 4 BF.
  it("nominal softwood: thin stock counts as 1 inch", () => {
    expect(rowFigures(row({ sizing: "nominal", thickness: 1, width: 6, length: 96 })).boardFeet).toBe(4);
    expect(rowFigures(row({ sizing: "nominal", thickness: 0.5, width: 6, length: 96 })).boardFeet).toBe(4);
    // A nominal 2x4, 8 ft: 2 × 4 × 96 / 144 = 5 1/3 BF.
    expect(rowFigures(row({ sizing: "nominal", thickness: 2, width: 4, length: 96 })).boardFeet).toBeCloseTo(16 / 3, 12);
  });

  // American Softwood Lumber Standard PS 20, dressed dry sizes: 1x = 3/4 in; 2x4 = 1-1/2 × 3-1/2; 2x6 = 1-1/2 × 5-1/2.
  it("nominal to dressed sizes per PS 20", () => {
    expect(dressedSize(1)).toBe(0.75);
    expect(dressedSize(2)).toBe(1.5);
    expect(dressedSize(4)).toBe(3.5);
    expect(dressedSize(6)).toBe(5.5);
  });

  it("volume of nominal stock uses the dressed size", () => {
    const f = rowFigures(row({ sizing: "nominal", thickness: 2, width: 4, length: 96 }));
    expect(f.cubicMetres).toBeCloseTo(cubicMetres(1.5, 3.5, 96), 12);
  });

  it("millimetres convert exactly (25.4 mm per inch)", () => {
    const metric = rowFigures(row({ unit: "mm", thickness: 25.4, width: 304.8, length: 304.8 }));
    expect(metric.boardFeet).toBeCloseTo(1, 12);
  });
});

describe("cost with waste", () => {
  it("board-foot pricing applies waste to the board feet", () => {
    // 4 BF × 1.15 × $10.00 = $46.00
    expect(rowFigures(row({ width: 6, length: 96, wastePercent: 15 })).costMinor).toBe(4600);
  });

  it("linear pricing", () => {
    expect(rowFigures(row({ pricingUnit: "linear_foot", length: 96, quantity: 2, unitPriceMinor: 250 })).costMinor).toBe(4000);
    expect(rowFigures(row({ unit: "mm", pricingUnit: "linear_metre", length: 2000, quantity: 3, unitPriceMinor: 500 })).costMinor).toBe(3000);
  });

  it("each: spares from waste are whole pieces", () => {
    expect(rowFigures(row({ pricingUnit: "each", quantity: 10, wastePercent: 5, unitPriceMinor: 30 })).costMinor).toBe(330);
  });

  it("sheet goods are bought whole per material", () => {
    // Eight 24 × 48 in panels are two full 48 × 96 in sheets (each panel a quarter sheet); with 10 % waste, 2.2 → 3 sheets.
    const panels = row({ material: "Birch plywood 3/4", pricingUnit: "sheet", thickness: 0.75, width: 24, length: 48, quantity: 8, unitPriceMinor: 8500 });
    expect(totalsByMaterial([panels]).byMaterial[0]).toMatchObject({ sheetsToBuy: 2, costMinor: 17000 });
    const withWaste = { ...panels, wastePercent: 10 };
    expect(totalsByMaterial([withWaste]).byMaterial[0]).toMatchObject({ sheetsToBuy: 3, costMinor: 25500 });
  });

  it("totals add up across materials", () => {
    const t = totalsByMaterial([row({}), row({ quantity: 2 }), row({ material: "Pine", sizing: "nominal", thickness: 2, width: 4, length: 96, unitPriceMinor: 300 })]);
    expect(t.byMaterial.find((m) => m.material === "White oak")).toMatchObject({ boardFeet: 3, costMinor: 3000, rows: 2 });
    expect(t.total.costMinor).toBe(3000 + 1600);
  });
});
