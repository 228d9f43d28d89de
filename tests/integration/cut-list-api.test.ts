import { beforeAll, describe, expect, it } from "vitest";
import * as materialsRoute from "@/app/api/episodes/[episodeId]/materials/route";
import * as materialRoute from "@/app/api/materials/[materialId]/route";
import * as csvRoute from "@/app/api/episodes/[episodeId]/materials/csv/route";
import * as stepsRoute from "@/app/api/episodes/[episodeId]/steps/route";
import { call, makeEpisode, makeWorld } from "../support/fixtures";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;
let episodeId: string;

async function csvCall(ep: string, text: string, user: { id: string }) {
  return call(csvRoute.POST as never, { method: "POST", params: { episodeId: ep }, rawBody: text, user, headers: { "content-type": "text/csv" } });
}

beforeAll(async () => {
  w = await makeWorld();
  episodeId = (await makeEpisode(w.channel.id, "planning", 0, "Side table")).id;
});

describe("cut list rows", () => {
  it("accepts fractions and mixed numbers and computes board feet and cost", async () => {
    // 1-3/4 × 1-3/4 × 24 in, 4 pieces: 4 × 73.5 / 144 = 2.0417 BF; at $14.50 with 20 % waste = $35.53.
    const r = await call(materialsRoute.POST as never, {
      method: "POST",
      params: { episodeId },
      body: { partName: "Leg", material: "Black walnut", thickness: "1-3/4", width: "1 3/4", length: 24, quantity: 4, unitPriceMinor: 1450, wastePercent: 20 },
      user: w.members.presenter,
    });
    expect(r.status).toBe(201);
    expect(r.json.material).toMatchObject({ thickness: 1.75, width: 1.75, length: 24 });
    expect(r.json.material.figures.boardFeet).toBeCloseTo((4 * 1.75 * 1.75 * 24) / 144, 9);
    expect(r.json.material.figures.costMinor).toBe(Math.round(((4 * 1.75 * 1.75 * 24) / 144) * 1.2 * 1450));
  });

  it("names the bad field", async () => {
    const r = await call(materialsRoute.POST as never, { method: "POST", params: { episodeId }, body: { partName: "", thickness: "3/0", width: "abc", length: -1, currency: "dollars" }, user: w.members.presenter });
    expect(r.status).toBe(400);
    expect(Object.keys(r.json.error.fields)).toEqual(expect.arrayContaining(["partName", "thickness", "width", "length", "currency"]));
  });

  it("roles and isolation", async () => {
    const body = { partName: "Shelf", thickness: "3/4", width: 8, length: 30 };
    for (const [role, status] of [["owner", 201], ["presenter", 201], ["producer", 403], ["editor", 403], ["sponsor_liaison", 403]] as const) {
      const r = await call(materialsRoute.POST as never, { method: "POST", params: { episodeId }, body, user: w.members[role] });
      expect(r.status, role).toBe(status);
    }
    const list = await call(materialsRoute.GET as never, { params: { episodeId }, user: w.members.sponsor_liaison });
    expect(list.status).toBe(200);
    const id = list.json.rows[0].id;
    expect((await call(materialsRoute.GET as never, { params: { episodeId }, user: w.outsider })).status).toBe(404);
    expect((await call(materialRoute.PATCH as never, { method: "PATCH", params: { materialId: id }, body: { quantity: 9 }, user: w.outsider })).status).toBe(404);
    expect((await call(materialRoute.DELETE as never, { method: "DELETE", params: { materialId: id }, user: w.outsider })).status).toBe(404);
    expect((await call(csvRoute.GET as never, { params: { episodeId }, user: w.outsider })).status).toBe(404);
    const edit = await call(materialRoute.PATCH as never, { method: "PATCH", params: { materialId: id }, body: { thickness: "5/8" }, user: w.members.presenter });
    expect(edit.json.material.thickness).toBe(0.625);
  });

  it("a step of another episode cannot be linked", async () => {
    const other = (await makeEpisode(w.channel.id, "idea", 3, "Other")).id;
    const step = await call(stepsRoute.POST as never, { method: "POST", params: { episodeId: other }, body: { title: "Elsewhere" }, user: w.members.presenter });
    const r = await call(materialsRoute.POST as never, { method: "POST", params: { episodeId }, body: { partName: "X", thickness: 1, width: 1, length: 1, stepId: step.json.step.id }, user: w.members.presenter });
    expect(r.status).toBe(422);
  });
});

describe("CSV", () => {
  it("export then import gives the same rows", async () => {
    const src = (await makeEpisode(w.channel.id, "planning", 4, "Round trip")).id;
    const step = await call(stepsRoute.POST as never, { method: "POST", params: { episodeId: src }, body: { title: "Mill, rough" }, user: w.members.presenter });
    const rows = [
      { partName: "Apron, long", material: "White oak", thickness: "3/4", width: "3-1/2", length: "31-3/8", quantity: 2, unitPriceMinor: 1125, wastePercent: 15, stepId: step.json.step.id, supplierNote: 'Ask for "rift" boards' },
      { partName: "Panel", material: "Birch ply", unit: "mm", thickness: 18, width: 600, length: 1200.5, pricingUnit: "sheet", unitPriceMinor: 8900, wastePercent: 10 },
      { partName: "Stud", material: "SPF", sizing: "nominal", thickness: 2, width: 4, length: 96, pricingUnit: "linear_foot", unitPriceMinor: 99 },
    ];
    for (const body of rows) expect((await call(materialsRoute.POST as never, { method: "POST", params: { episodeId: src }, body, user: w.members.presenter })).status).toBe(201);
    const exported = await call(csvRoute.GET as never, { params: { episodeId: src }, user: w.members.editor });
    expect(exported.status).toBe(200);
    expect(exported.headers.get("content-type")).toMatch(/text\/csv/);
    const text = exported.json as string;
    // RFC 4180 line ends (CRLF), as papaparse writes them.
    expect(text.split("\r\n")[0]).toBe("part,material,unit,thickness,width,length,quantity,sizing,pricing_unit,unit_price,currency,waste_percent,step,supplier_note");

    // Import into a second episode with a step of the same title.
    const dst = (await makeEpisode(w.channel.id, "planning", 5, "Copy")).id;
    await call(stepsRoute.POST as never, { method: "POST", params: { episodeId: dst }, body: { title: "Mill, rough" }, user: w.members.presenter });
    const imported = await csvCall(dst, text, w.members.presenter);
    expect(imported.status).toBe(201);
    expect(imported.json.imported).toBe(3);

    const pick = (r: Record<string, unknown>) => ({ ...r, id: undefined, stepId: r.stepId ? "linked" : null });
    const a = (await call(materialsRoute.GET as never, { params: { episodeId: src }, user: w.members.owner })).json.rows.map(pick);
    const b = (await call(materialsRoute.GET as never, { params: { episodeId: dst }, user: w.members.owner })).json.rows.map(pick);
    expect(b).toEqual(a);
    // And exporting the copy gives the same file, byte for byte (step titles match).
    const again = await call(csvRoute.GET as never, { params: { episodeId: dst }, user: w.members.owner });
    expect(again.json).toBe(text);
  });

  it("a file with bad rows imports nothing and lists each line and field", async () => {
    const ep = (await makeEpisode(w.channel.id, "planning", 6, "Bad import")).id;
    const header = "part,material,unit,thickness,width,length,quantity,sizing,pricing_unit,unit_price,currency,waste_percent,step,supplier_note";
    const text = [
      header,
      "Leg,Oak,in,1-3/4,1-3/4,24,4,actual,board_foot,12.00,USD,15,,",
      "Rail,Oak,in,3/0,2,20,2,actual,board_foot,12.00,USD,15,,",
      "Top,Oak,in,3/4,wide,20,1,actual,per_plank,12.00,USD,15,No such step,",
    ].join("\n");
    const r = await csvCall(ep, text, w.members.presenter);
    expect(r.status).toBe(422);
    expect(r.json.error.message).toMatch(/Nothing was imported/);
    expect(Object.keys(r.json.error.fields)).toEqual(expect.arrayContaining(["line 3: thickness", "line 4: width", "line 4: pricing_unit", "line 4: step"]));
    const after = await call(materialsRoute.GET as never, { params: { episodeId: ep }, user: w.members.owner });
    expect(after.json.rows).toEqual([]);
  });

  it("refuses a wrong header and an empty file; only editors of the plan import", async () => {
    const bad = await csvCall(episodeId, "name,size\nx,1", w.members.presenter);
    expect(bad.status).toBe(400);
    expect(bad.json.error.message).toMatch(/missing: part/);
    const empty = await csvCall(episodeId, "part,material,unit,thickness,width,length,quantity,sizing,pricing_unit,unit_price,currency,waste_percent,step,supplier_note\n", w.members.presenter);
    expect(empty.status).toBe(400);
    const ok = "part,material,unit,thickness,width,length,quantity,sizing,pricing_unit,unit_price,currency,waste_percent,step,supplier_note\nX,Oak,in,1,2,3,1,actual,board_foot,1.00,USD,0,,";
    expect((await csvCall(episodeId, ok, w.members.producer)).status).toBe(403);
    expect((await csvCall(episodeId, ok, w.outsider)).status).toBe(404);
  });
});
