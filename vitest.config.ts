import { defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    include: ["test/**/*.test.ts"],
    reporters: ["default", "./test/helpers/closing-line-reporter.ts"],
    testTimeout: 30_000,
    hookTimeout: 60_000,
    coverage: {
      provider: "v8",
      include: ["core/**/*.ts", "server/**/*.ts"],
      exclude: ["server/main.ts", "server/openapi-write.ts"],
      reporter: ["text-summary"],
      thresholds: { lines: 85, functions: 85, branches: 75, statements: 85 },
    },
  },
});
