import { afterEach, describe, expect, it } from "vitest";
import { env, resetEnvCache } from "@/lib/env";

describe("environment", () => {
  const saved = { ...process.env };
  afterEach(() => {
    process.env = { ...saved };
    resetEnvCache();
  });

  it("defaults to the local services on 127.0.0.1", () => {
    for (const k of ["DATABASE_URL", "S3_ENDPOINT", "SMTP_URL"]) delete process.env[k];
    process.env.NEXTAUTH_SECRET = "x".repeat(40);
    resetEnvCache();
    const e = env();
    expect(e.DATABASE_URL).toMatch(/^postgres:\/\/jigboard@127\.0\.0\.1:/);
    expect(e.S3_ENDPOINT).toMatch(/^http:\/\/127\.0\.0\.1:/);
    expect(e.S3_FORCE_PATH_STYLE).toBe(true);
  });

  it("names the bad variable", () => {
    process.env.NEXTAUTH_SECRET = "short";
    process.env.S3_FORCE_PATH_STYLE = "maybe";
    resetEnvCache();
    expect(() => env()).toThrow(/NEXTAUTH_SECRET[\s\S]*S3_FORCE_PATH_STYLE|S3_FORCE_PATH_STYLE[\s\S]*NEXTAUTH_SECRET/);
  });
});
