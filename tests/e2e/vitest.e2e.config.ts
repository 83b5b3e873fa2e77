import { defineConfig } from "vitest/config";
import { fileURLToPath, URL } from "node:url";

/** End-to-end tests: the built client served by the real server, driven by Debian's Chromium. */
export default defineConfig({
  resolve: {
    alias: {
      "@": fileURLToPath(new URL("../../src", import.meta.url)),
      "@engine": fileURLToPath(new URL("../../workers/engine", import.meta.url)),
    },
  },
  test: {
    name: "e2e",
    root: fileURLToPath(new URL("../..", import.meta.url)),
    include: ["tests/e2e/**/*.e2e.ts"],
    environment: "node",
    testTimeout: 90_000,
    hookTimeout: 120_000,
    fileParallelism: false,
    pool: "forks",
  },
});
