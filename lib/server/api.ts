import "server-only";
import { z } from "zod";
import { AppError, toResponse, validationError } from "./errors";
import { requireUser, type SessionUser } from "./session";

/** Reads and validates a JSON body; bad JSON and bad fields are 400 with the field named. */
export async function parseBody<T extends z.ZodType>(req: Request, schema: T, what = "request body"): Promise<z.output<T>> {
  let raw: unknown;
  try {
    const text = await req.text();
    raw = text ? JSON.parse(text) : {};
  } catch {
    throw new AppError("validation:json", "The request body is not valid JSON.");
  }
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

/**
 * Wraps a route handler: errors become the standard error shape. Handlers
 * follow parse → session → load → check → act.
 */
export function route<P = Record<string, string>>(handler: (req: Request, params: P) => Promise<Response>) {
  return async (req: Request, ctx: Ctx<P>): Promise<Response> => {
    try {
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
