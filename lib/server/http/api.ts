import "server-only";
import { z } from "zod";
import { AppError, toResponse, validationError } from "./errors";
import { requireUser, type SessionUser } from "../access/session";
import { env } from "../../env";

/** The path of the first string (or key) holding a NUL, which PostgreSQL cannot store in text. */
export function findNul(value: unknown, path: string[] = []): string | null {
  if (typeof value === "string") return value.includes("\u0000") ? path.join(".") || "_" : null;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const p = findNul(value[i], [...path, String(i)]);
      if (p) return p;
    }
    return null;
  }
  if (value && typeof value === "object") {
    for (const [k, v] of Object.entries(value)) {
      if (k.includes("\u0000")) return [...path, k.replace(/\u0000/g, "\\0")].join(".");
      const p = findNul(v, [...path, k]);
      if (p) return p;
    }
  }
  return null;
}

/** Reads and validates a JSON body; bad JSON and bad fields are 400 with the field named. */
export async function parseBody<T extends z.ZodType>(req: Request, schema: T, what = "request body"): Promise<z.output<T>> {
  let raw: unknown;
  try {
    const text = await req.text();
    raw = text ? JSON.parse(text) : {};
  } catch {
    throw new AppError("validation:json", "The request body is not valid JSON.");
  }
  const nul = findNul(raw);
  if (nul) throw new AppError(`validation:${what}`, `Check the ${what}: ${nul}: contains a NUL character, which cannot be stored`, { fields: { [nul]: ["contains a NUL character, which cannot be stored"] } });
  const parsed = schema.safeParse(raw);
  if (!parsed.success) throw validationError(parsed.error, what);
  return parsed.data;
}

export function parseQuery<T extends z.ZodType>(req: Request, schema: T): z.output<T> {
  const params = Object.fromEntries(new URL(req.url).searchParams.entries());
  const parsed = schema.safeParse(params);
  if (!parsed.success) throw validationError(parsed.error, "query");
  return parsed.data;
}

export function parseId(value: string | undefined, what: string): string {
  const parsed = z.uuid().safeParse(value);
  // A malformed id cannot name anything: answer as for a missing record.
  if (!parsed.success) throw new AppError(`not_found:${what}`, `No such ${what}.`);
  return parsed.data;
}

type Ctx<P> = { params: Promise<P> };

const WRITES = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/**
 * Refuses a state-changing request that a browser sent from another site
 * (CSRF): Sec-Fetch-Site, when the browser sends it, must say same-origin
 * (or none, for a request the user typed), and Origin, when present, must be
 * this app.
 */
export function assertSameOrigin(req: Request): void {
  if (!WRITES.has(req.method)) return;
  const site = req.headers.get("sec-fetch-site");
  if (site && site !== "same-origin" && site !== "none") throw new AppError("forbidden:cross-site", "This request came from another site and was refused.");
  const origin = req.headers.get("origin");
  if (origin) {
    let host: string | null = null;
    try {
      host = new URL(origin).host;
    } catch {
      /* "null" or garbage: refused below */
    }
    const own = new Set([new URL(req.url).host, req.headers.get("host"), req.headers.get("x-forwarded-host"), new URL(env().NEXTAUTH_URL).host].filter(Boolean));
    if (!host || !own.has(host)) throw new AppError("forbidden:cross-site", "This request came from another site and was refused.");
  }
}

/** A write's body must come as JSON, or as a type the route names; checked once the caller may write at all. */
export function assertContentType(req: Request, accepts: readonly string[] = ["application/json"]): void {
  if (!WRITES.has(req.method)) return;
  // RFC 9112 §6.3: a request from the wire without Content-Length or Transfer-Encoding has no body (Next still hands an empty stream).
  // A Request made in-process (no Host, no framing headers) has one when it was given one.
  const length = req.headers.get("content-length");
  const hasBody = req.body !== null && (length !== null ? length !== "0" : req.headers.has("transfer-encoding") || !req.headers.has("host"));
  if (!hasBody) return;
  const type = (req.headers.get("content-type") ?? "").split(";")[0]!.trim().toLowerCase();
  if (!accepts.includes(type)) {
    throw new AppError("validation:content-type", `Send the body as ${accepts.join(" or ")}${type ? `, not ${type}` : ""}.`, { fields: { "content-type": [`must be ${accepts.join(" or ")}`] } });
  }
}

/**
 * Wraps a route handler: errors become the standard error shape, and writes
 * pass the cross-site check first. Handlers are written with the route
 * builder (route-builder.ts), which adds the rest. Handlers follow
 * parse → session → load → check → act.
 */
export function route<P = Record<string, string>>(handler: (req: Request, params: P) => Promise<Response>) {
  return async (req: Request, ctx: Ctx<P>): Promise<Response> => {
    try {
      assertSameOrigin(req);
      return await handler(req, ctx ? await ctx.params : ({} as P));
    } catch (e) {
      return toResponse(e);
    }
  };
}

export function sessionUser(req: Request): Promise<SessionUser> {
  return requireUser(req.headers.get("cookie"));
}

export function json(data: unknown, status = 200): Response {
  return Response.json(data, { status });
}

/** A response of JSON already serialized (a cached view), with any headers it needs. */
export function jsonText(body: string | null, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(body, { status, headers: { "content-type": "application/json", ...headers } });
}
