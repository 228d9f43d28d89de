import { describe, expect, it } from "vitest";
import fs from "node:fs";
import path from "node:path";
import { openApiDocument, ROUTES } from "@/lib/openapi";

function handlerFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    return e.isDirectory() ? handlerFiles(p) : e.name === "route.ts" ? [p] : [];
  });
}

describe("OpenAPI document", () => {
  const doc = openApiDocument();

  it("is OpenAPI 3.1 with the shared error shape", () => {
    expect(doc.openapi).toBe("3.1.0");
    expect((doc.components.schemas as any).Error).toMatchObject({ type: "object", required: ["error"] });
  });

  it("lists every route handler and each of its methods", () => {
    const root = path.resolve("app");
    for (const file of handlerFiles(path.join(root, "api"))) {
      const rel = "/" + path.relative(root, path.dirname(file)).split(path.sep).join("/");
      if (rel.startsWith("/api/auth/")) continue; // next-auth's own endpoints; the credentials post is listed by hand
      const apiPath = rel.replace(/\[(\w+)\]/g, "{$1}");
      const src = fs.readFileSync(file, "utf8");
      const methods = [...src.matchAll(/export (?:const|async function|function) (GET|POST|PATCH|PUT|DELETE)\b/g)].map((m) => m[1]!.toLowerCase());
      expect(methods.length, file).toBeGreaterThan(0);
      for (const m of methods) expect(doc.paths[apiPath]?.[m], `${m.toUpperCase()} ${apiPath}`).toBeTruthy();
    }
  });

  it("takes request bodies from the same zod schemas", () => {
    const post = doc.paths["/api/channels/{channelId}/episodes"]!.post as any;
    const ref = post.requestBody.content["application/json"].schema.$ref as string;
    const body = (doc.components.schemas as any)[ref.split("/").pop()!];
    expect(body.properties.title).toMatchObject({ type: "string", minLength: 1 });
    expect(body.properties.frameRate.enum).toContain("59.94");
    expect(ROUTES.length).toBeGreaterThanOrEqual(17);
  });
});
