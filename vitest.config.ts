import { defineConfig } from "vitest/config";

// Three kinds of test, each in its own folder; scripts/test.ts provides the database and the build.
export default defineConfig({
  test: {
    projects: [
      { test: { name: "unit", include: ["tests/unit/**/*.test.ts"] } },
      {
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          testTimeout: 30_000,
          hookTimeout: 30_000,
        },
      },
      {
        test: {
          name: "browser",
          include: ["tests/browser/**/*.test.ts"],
          testTimeout: 60_000,
          hookTimeout: 60_000,
          // One Chromium at a time on a two-core machine.
          fileParallelism: false,
        },
      },
    ],
  },
});
