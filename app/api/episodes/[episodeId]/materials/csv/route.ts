import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { materialCreateSchema, type MaterialCreate } from "@/lib/schemas/build";
import { listMaterialsByEpisode } from "@/db/queries/materials";
import { listStepTitlesByEpisode } from "@/db/queries/build";
import { createMaterials } from "@/lib/server/services/materials";
import { toMaterialInput } from "@/lib/server/views/materials";
import { parseCsv, recordToBody, toCsv } from "@/lib/cut-list-csv";
import { AppError } from "@/lib/server/http/errors";
import { fileSlug } from "@/lib/file-name";

const MAX_CSV_BYTES = 2 * 1024 * 1024;

export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ episode }) => {
  const [rows, steps] = await Promise.all([listMaterialsByEpisode({ episodeId: episode.id }), listStepTitlesByEpisode({ episodeId: episode.id })]);
  const title = new Map(steps.map((s) => [s.id, s.title]));
  const csv = toCsv(rows.map(toMaterialInput).map((r) => ({ ...r, stepTitle: r.stepId ? (title.get(r.stepId) ?? null) : null })));
  const name = fileSlug(episode.title);
  return new Response(csv, { headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="cut-list-${name}.csv"` } });
});

/**
 * Imports rows from CSV text (the body). Every row is checked with the same
 * schema as the API; if any row is wrong nothing is imported and each error
 * names its line and field.
 */
export const POST = channelRoute({ load: "episode", action: "build.edit", accepts: ["text/csv", "application/csv"] }, async ({ episode, req }) => {
  const text = await req.text();
  if (text.length > MAX_CSV_BYTES) throw new AppError("validation:csv", "The file is larger than 2 MB; split it.");
  const nulAt = text.indexOf("\u0000");
  if (nulAt >= 0) throw new AppError("validation:csv", `Line ${text.slice(0, nulAt).split("\n").length} contains a NUL character, which cannot be stored. Save the file again as plain CSV text.`);
  const parsed = parseCsv(text);
  if (!parsed.ok) throw new AppError("validation:csv", parsed.message);
  if (parsed.records.length === 0) throw new AppError("validation:csv", "The file has a header but no rows.");
  const steps = await listStepTitlesByEpisode({ episodeId: episode.id });
  const byTitle = new Map(steps.map((s) => [s.title.toLowerCase(), s.id]));
  const fields: Record<string, string[]> = {};
  const rows: MaterialCreate[] = [];
  for (const rec of parsed.records) {
    const { body, unknownStep } = recordToBody(rec, byTitle);
    if (unknownStep) (fields[`line ${rec.line}: step`] ??= []).push(`no build step called “${unknownStep}” in this episode`);
    const r = materialCreateSchema.safeParse({ ...body, stepId: unknownStep ? null : body.stepId });
    if (!r.success) {
      for (const issue of r.error.issues) (fields[`line ${rec.line}: ${csvName(String(issue.path[0] ?? "row"))}`] ??= []).push(issue.message);
    } else rows.push(r.data);
  }
  const problems = Object.keys(fields).length;
  if (problems) {
    throw new AppError("unprocessable:csv", `Nothing was imported: ${problems} problem${problems > 1 ? "s" : ""} in the file. Fix them and import again.`, { fields });
  }
  const created = await createMaterials({ episodeId: episode.id, rows });
  return json({ imported: created.length }, 201);
});

function csvName(field: string): string {
  const map: Record<string, string> = { partName: "part", pricingUnit: "pricing_unit", unitPriceMinor: "unit_price", wastePercent: "waste_percent", stepId: "step", supplierNote: "supplier_note" };
  return map[field] ?? field;
}
