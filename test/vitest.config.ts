import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

// Kept under test/ so the repository's top level stays as agreed. Browser and PDF tests need longer
// time-outs than unit tests; each such test sets its own.
export default defineConfig({
  test: {
    root: fileURLToPath(new URL("..", import.meta.url)),
    include: ["test/**/*.test.ts"],
    testTimeout: 20_000,
    hookTimeout: 60_000,
    pool: "forks",
    maxWorkers: 2,
  },
});
