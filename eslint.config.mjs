import tseslint from "typescript-eslint";
import drizzle from "eslint-plugin-drizzle";

export default tseslint.config(
  { ignores: [".next/**", "node_modules/**", ".data/**", ".test-data/**", "tests/.artifacts/**", "db/migrations/**", "next-env.d.ts"] },
  ...tseslint.configs.recommended,
  {
    plugins: { drizzle },
    rules: {
      // An update or delete without a where clause is never what we mean.
      "drizzle/enforce-delete-with-where": ["error", { drizzleObjectName: ["db", "tx"] }],
      "drizzle/enforce-update-with-where": ["error", { drizzleObjectName: ["db", "tx"] }],
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
      "@typescript-eslint/no-explicit-any": "off",
    },
  },
  {
    // Pure modules stay free of I/O: no database, storage or server code.
    files: ["lib/*.ts", "lib/schemas/**/*.ts"],
    rules: {
      "no-restricted-imports": ["error", { patterns: ["**/db/**", "**/storage/**", "**/server/**", "pg", "next/*"] }],
    },
  },
);
