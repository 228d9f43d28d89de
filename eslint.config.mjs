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
      // This rule only says when the React Compiler would skip a component (TanStack Table,
      // react-hook-form's watch). The app does not use the compiler; both libraries are used as documented.
      "react-hooks/incompatible-library": "off",
    },
  },
  {
    // Pure modules stay free of I/O: no database, storage or server code.
    files: ["lib/*.ts", "lib/schemas/**/*.ts"],
    rules: {
      "no-restricted-imports": ["error", { patterns: ["**/db/**", "**/storage/**", "**/server/**", "pg", "next/*"] }],
    },
  },
  {
    // The database layer reads and writes rows: it takes types from lib, never code.
    files: ["db/**/*.ts"],
    rules: {
      "@typescript-eslint/no-restricted-imports": ["error", { patterns: [{ group: ["**/lib/**", "@/lib/**"], allowTypeImports: true, message: "db/ may import only types from lib/; put rules in lib/server/services." }] }],
    },
  },
  {
    // Browser code reaches the server only through the JSON API.
    files: ["components/**/*.ts", "components/**/*.tsx"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [{ group: ["@/db/**", "**/db/**", "@/storage/**", "**/storage/**", "@/lib/server/**", "**/lib/server/**"], message: "components run in the browser: call the API instead." }] }],
    },
  },
  {
    // Routes reach storage through storage/, never the SDK.
    files: ["app/**/*.ts", "app/**/*.tsx", "lib/server/services/**/*.ts", "lib/server/views/**/*.ts", "lib/server/http/**/*.ts", "lib/server/access/**/*.ts"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [{ group: ["@aws-sdk/*"], message: "use the storage/ modules" }] }],
    },
  },
  {
    // One client data path: reads are useQuery + fetchJson, writes useWrite (a TanStack mutation).
    files: ["components/**/*.ts", "components/**/*.tsx"],
    ignores: ["components/fetch-json.ts", "components/auth/api-client.ts"],
    rules: {
      "no-restricted-globals": ["error", { name: "fetch", message: "use fetchJson in a query, or useWrite for a write (components/use-write.ts)" }],
    },
  },
  {
    // Colours come from the Tailwind tokens (tailwind.config.ts), never hex literals in screens.
    files: ["components/**/*.tsx", "app/**/*.tsx"],
    rules: {
      "no-restricted-syntax": ["error", { selector: "Literal[value=/#[0-9a-fA-F]{6}\\b|#[0-9a-fA-F]{3}\\b/]", message: "use a colour token (fill-walnut-700, bg-timber-100, ...)" }, { selector: "TemplateElement[value.raw=/#[0-9a-fA-F]{6}\\b/]", message: "use a colour token" }],
    },
  },
);
