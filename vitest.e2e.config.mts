import { defineConfig } from "vitest/config";

// End-to-end tests drive Chromium against the production build started by scripts/test.sh.
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    include: ["tests/e2e/**/*.test.ts"],
    environment: "node",
    fileParallelism: false,
    testTimeout: 90_000,
    hookTimeout: 90_000,
  },
});
