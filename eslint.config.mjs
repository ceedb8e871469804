// Flat config (Next 16 has no `next lint`): TypeScript rules, React hooks and Next's own rules.
import nextPlugin from "@next/eslint-plugin-next";
import reactHooks from "eslint-plugin-react-hooks";
import tseslint from "typescript-eslint";

export default tseslint.config(
  { ignores: ["node_modules/**", ".next/**", ".next-test/**", ".next-*/**", ".data/**", "drizzle/**", "next-env.d.ts", "test-results/**"] },
  ...tseslint.configs.recommended,
  {
    files: ["**/*.{ts,tsx}"],
    plugins: { "@next/next": nextPlugin, "react-hooks": reactHooks },
    rules: {
      ...nextPlugin.configs.recommended.rules,
      ...nextPlugin.configs["core-web-vitals"].rules,
      "react-hooks/rules-of-hooks": "error",
      "react-hooks/exhaustive-deps": "warn",
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
      "@typescript-eslint/no-explicit-any": "error",
      "@typescript-eslint/ban-ts-comment": "error",
    },
  },
  {
    // The pure core must not reach for the framework, the database or the machine.
    files: ["lib/core/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            { group: ["next", "next/*", "react", "react-dom", "@/db", "@/db/*", "@/lib/server/*", "node:*", "fs", "path", "pg", "drizzle-orm", "drizzle-orm/*"], message: "lib/core is pure: no framework, database or Node imports." },
          ],
        },
      ],
    },
  },
);
