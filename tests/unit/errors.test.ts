/**
 * What a request gets when the database is away: 503 with a clear message,
 * never a 500. Codes from PostgreSQL's documentation, Appendix A "Error
 * Codes" (class 08 connection exception; 57P01 admin_shutdown, 57P03
 * cannot_connect_now) and Node's socket error codes.
 */
import { describe, expect, it } from "vitest";
import { databaseUnavailable, toResponse } from "@/lib/server/http/errors";

const withCode = (code: string, message = "x") => Object.assign(new Error(message), { code });

describe("database unavailable", () => {
  it.each(["57P01", "57P03", "08006", "08001", "ECONNREFUSED", "ECONNRESET"])("%s is the database being away", (code) => {
    expect(databaseUnavailable(withCode(code))).toBe(true);
  });

  it("sees it through a wrapped cause and in the pool's own messages", () => {
    expect(databaseUnavailable(Object.assign(new Error("Failed query"), { cause: withCode("57P01") }))).toBe(true);
    expect(databaseUnavailable(new Error("Connection terminated unexpectedly"))).toBe(true);
  });

  it("is not a constraint or syntax error", () => {
    expect(databaseUnavailable(withCode("23505"))).toBe(false);
    expect(databaseUnavailable(withCode("42601"))).toBe(false);
    expect(databaseUnavailable(new Error("boom"))).toBe(false);
  });

  it("answers 503 with a message and Retry-After", async () => {
    const r = toResponse(withCode("57P01", "terminating connection due to administrator command"));
    expect(r.status).toBe(503);
    expect(r.headers.get("retry-after")).toBe("5");
    expect((await r.json()).error).toEqual({ code: "unavailable:database", message: "The database is not answering just now, so nothing was saved. Try again in a moment." });
  });
});
