import { defineConfig } from "vitest/config";

// Four kinds of test, each in its own folder; scripts/test.ts provides the database and the build.
// The faults (kills, outages, the fuzz) run one file at a time: each stops or kills what it started.
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
      {
        test: {
          name: "faults",
          include: ["tests/faults/**/*.test.ts"],
          testTimeout: 120_000,
          hookTimeout: 300_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
