import { defineConfig } from "drizzle-kit";
import { databaseConfig } from "./db/config";

export default defineConfig({
  dialect: "postgresql",
  schema: "./db/schema.ts",
  out: "./db/migrations",
  dbCredentials: { url: databaseConfig().url },
  strict: true,
  verbose: false,
});
