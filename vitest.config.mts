import { defineConfig } from "vitest/config";
import path from "node:path";

// Unit tests (tests/unit) need nothing; integration tests (tests/integration) expect the
// services started by scripts/test.sh (DATABASE_URL, SMTP and the fakes' URLs in the environment).
export default defineConfig({
  resolve: {
    tsconfigPaths: true,
    alias: { "server-only": path.resolve("node_modules/server-only/empty.js") },
  },
  test: {
    include: ["tests/unit/**/*.test.ts", "tests/integration/**/*.test.ts"],
    environment: "node",
    testTimeout: 20_000,
    hookTimeout: 60_000,
    fileParallelism: true,
  },
});
