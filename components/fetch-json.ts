/**
 * The one way the browser talks to Jigboard's JSON API. Failures become an
 * ApiError carrying the status, the field messages and, for a version
 * conflict, the stored record (error.current). A network failure is status 0.
 */
export class ApiError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly fields?: Record<string, string[]>,
    readonly current?: unknown,
  ) {
    super(message);
  }
}

export async function fetchJson<T = unknown>(url: string, opts: { method?: string; json?: unknown; body?: BodyInit | null; headers?: Record<string, string> } = {}): Promise<T> {
  let res: Response;
  try {
    res = await fetch(url, {
      method: opts.method ?? "GET",
      headers: { ...(opts.json !== undefined ? { "content-type": "application/json" } : {}), ...opts.headers },
      body: opts.json !== undefined ? JSON.stringify(opts.json) : opts.body,
    });
  } catch {
    throw new ApiError("The server could not be reached.", 0);
  }
  const data = await res.json().catch(() => ({}));
  if (!res.ok) throw new ApiError(data?.error?.message ?? `Request failed (${res.status})`, res.status, data?.error?.fields, data?.error?.current);
  return data as T;
}

/** Shorthand: method and JSON body. */
export function send<T = any>(url: string, method: string, body?: unknown): Promise<T> {
  return fetchJson<T>(url, { method, json: body });
}
