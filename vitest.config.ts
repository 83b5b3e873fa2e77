import { configDefaults, defineConfig } from "vitest/config";
import react from "@vitejs/plugin-react";
import { fileURLToPath, URL } from "node:url";

const alias = {
  "@": fileURLToPath(new URL("./src", import.meta.url)),
  "@engine": fileURLToPath(new URL("./workers/engine", import.meta.url)),
};

/** The S3 client's notice that its releases after January 2027 need Node 22 (we pin one that
 * runs on Node 20): printed once per test worker, it would bury the results. */
const QUIET_AWS_SDK = { AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: "true" };

export default defineConfig({
  test: {
    projects: [
      {
        plugins: [react()],
        resolve: { alias },
        test: {
          name: "client",
          environment: "jsdom",
          include: ["src/**/*.test.{ts,tsx}"],
          setupFiles: ["src/testing/setup.ts"],
        },
      },
      {
        resolve: { alias },
        test: {
          name: "server",
          environment: "node",
          include: ["server/**/*.test.ts", "workers/**/*.test.ts", "scripts/**/*.test.ts"],
          // *.pg.test.ts need PostgreSQL: they run in server-pg only.
          exclude: [...configDefaults.exclude, "**/*.pg.test.ts"],
          env: QUIET_AWS_SDK,
          testTimeout: 20000,
          hookTimeout: 30000,
        },
      },
      {
        // The server suite again on a real PostgreSQL (a throwaway cluster, or the server at
        // TEST_DATABASE_URL): see server/testing/database.ts. Pure code (workers/**) runs once.
        resolve: { alias },
        test: {
          name: "server-pg",
          environment: "node",
          include: ["server/**/*.test.ts"],
          env: { SPREADSIGHT_TEST_DB: "postgres", ...QUIET_AWS_SDK },
          globalSetup: ["server/testing/pg-global-setup.ts"],
          testTimeout: 20000,
          hookTimeout: 30000,
        },
      },
    ],
  },
});
