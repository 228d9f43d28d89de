import { z } from "zod";

const STATUS = {
  validation: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  unprocessable: 422,
  rate_limited: 429,
  internal: 500,
  /** A service we depend on (payments) refused or did not answer. */
  unavailable: 502,
} as const;
export type ErrorKind = keyof typeof STATUS;

/**
 * The one application error. `code` reads like "forbidden:episode"; the kind
 * before the colon decides the HTTP status. Messages are safe to show.
 */
export class AppError extends Error {
  readonly kind: ErrorKind;
  readonly code: string;
  readonly fields?: Record<string, string[]>;
  readonly headers?: Record<string, string>;
  /** The stored record a conflict was about, so the client can show both sides. */
  readonly current?: unknown;

  constructor(
    code: `${ErrorKind}${string}`,
    message: string,
    opts: { fields?: Record<string, string[]>; headers?: Record<string, string>; current?: unknown } = {},
  ) {
    super(message);
    this.code = code;
    this.kind = code.split(":")[0] as ErrorKind;
    this.fields = opts.fields;
    this.headers = opts.headers;
    this.current = opts.current;
  }

  get status(): number {
    return STATUS[this.kind] ?? 500;
  }
}

export function fieldsFromZod(error: z.ZodError): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}

export function validationError(error: z.ZodError, what = "request"): AppError {
  const fields = fieldsFromZod(error);
  const summary = Object.entries(fields)
    .map(([k, v]) => (k === "_" ? v.join("; ") : `${k}: ${v.join("; ")}`))
    .join(", ");
  return new AppError(`validation:${what}`, `Check the ${what}: ${summary}`, { fields });
}

export function errorBody(e: AppError) {
  return { error: { code: e.code, message: e.message, ...(e.fields ? { fields: e.fields } : {}), ...(e.current !== undefined ? { current: e.current } : {}) } };
}

export function toResponse(e: unknown): Response {
  if (e instanceof AppError) {
    return Response.json(errorBody(e), { status: e.status, headers: e.headers });
  }
  // PostgreSQL refused a character the input carried (a NUL that slipped past parsing): the input's fault, not ours.
  const pgCode = (e as { code?: unknown } | null)?.code ?? (e as { cause?: { code?: unknown } } | null)?.cause?.code;
  if (pgCode === "22P05" || pgCode === "22021") {
    return Response.json({ error: { code: "validation:text", message: "The text contains a character that cannot be stored (such as NUL). Remove it and try again." } }, { status: 400 });
  }
  // The database is down or restarting: say so (503, try again), never a 500. Nothing was committed: a failed transaction rolls back.
  if (databaseUnavailable(e)) {
    return Response.json({ error: { code: "unavailable:database", message: "The database is not answering just now, so nothing was saved. Try again in a moment." } }, { status: 503, headers: { "retry-after": "5" } });
  }
  // Database and other unexpected errors are logged, never returned.
  console.error("[api] unexpected error", e);
  return Response.json({ error: { code: "internal", message: "Something went wrong on our side. Try again." } }, { status: 500 });
}

/**
 * A connection that could not be made or was cut: the socket errors Node
 * gives, and PostgreSQL's class 08 (connection exception) and 57P0x
 * (operator intervention: admin_shutdown, crash_shutdown, cannot_connect_now),
 * from PostgreSQL's documentation, Appendix A "Error Codes".
 */
export function databaseUnavailable(e: unknown): boolean {
  const seen = new Set<unknown>();
  for (let x: unknown = e; x && typeof x === "object" && !seen.has(x); x = (x as { cause?: unknown }).cause) {
    seen.add(x);
    const code = String((x as { code?: unknown }).code ?? "");
    if (["ECONNREFUSED", "ECONNRESET", "EPIPE", "ETIMEDOUT", "57P01", "57P02", "57P03"].includes(code) || code.startsWith("08")) return true;
    const msg = String((x as { message?: unknown }).message ?? "");
    if (/Connection terminated|connection timeout|timeout exceeded when trying to connect|Client has encountered a connection error/i.test(msg)) return true;
  }
  return false;
}
