import tseslint from "typescript-eslint";
import drizzle from "eslint-plugin-drizzle";
import reactHooks from "eslint-plugin-react-hooks";
import nextPlugin from "@next/eslint-plugin-next";

export default tseslint.config(
  { ignores: [".next/**", "node_modules/**", ".data/**", ".test-data/**", "tests/.artifacts/**", "db/migrations/**", "next-env.d.ts"] },
  ...tseslint.configs.recommended,
  // React's rules of hooks and the Next.js rules, as their recommended sets.
  reactHooks.configs.flat["recommended-latest"] ?? reactHooks.configs.flat.recommended,
  { plugins: { "@next/next": nextPlugin }, rules: { ...nextPlugin.configs.recommended.rules, ...nextPlugin.configs["core-web-vitals"].rules } },
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
