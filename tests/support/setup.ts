import { afterAll } from "vitest";

// Integration tests need the services that `npm test` starts (tests/run.ts).
if (!process.env.NEXTAUTH_SECRET) process.env.NEXTAUTH_SECRET = "unit-tests-only-secret-unit-tests-only-secret";

afterAll(async () => {
  const { closeDb } = await import("../../db/client");
  await closeDb();
});
