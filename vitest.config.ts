import { defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    include: ["tests/unit/**/*.test.ts", "tests/unit/**/*.test.tsx"],
    setupFiles: ["tests/unit/setup/fastCheckSeed.ts"],
    environment: "node",
    testTimeout: 60000,
    pool: "threads",
  },
});
