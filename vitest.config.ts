import { defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    include: ["test/**/*.test.ts"],
    testTimeout: 120_000,
    hookTimeout: 120_000,
    // In CI also write a JSON summary, from which .ci/run prints a plain "N passed, N failed" line.
    reporters: process.env.CI ? ["default", "json"] : ["default"],
    ...(process.env.CI ? { outputFile: { json: "test-results/vitest.json" } } : {}),
  },
});
