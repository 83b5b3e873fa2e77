/**
 * Builds the server into build/server/ with esbuild (npm run build runs it after `vite build`):
 *   main.js   the process entry (npm start), with the Express app, TypeORM and the domain
 *   tasks.js  the worker-thread pool's tasks (reports, upload checks)
 * Each file is self-contained (no shared chunks), so `import.meta.url` in any module is the
 * file's own place: build/server/, two levels under the project root like server/<folder>/.
 * npm packages stay external (loaded from node_modules at run time); our own TypeScript,
 * including workers/engine and the @/ and @engine aliases of tsconfig.json, is bundled.
 * TypeORM entities give every column an explicit type, so no decorator metadata is needed.
 */
import { build } from "esbuild";
import { rmSync } from "node:fs";
import { fileURLToPath } from "node:url";

const root = fileURLToPath(new URL("..", import.meta.url));
const outdir = `${root}build/server`;
rmSync(outdir, { recursive: true, force: true });

await build({
  absWorkingDir: root,
  entryPoints: { main: "server/main.ts", tasks: "server/workers/tasks.ts" },
  outdir,
  bundle: true,
  format: "esm",
  platform: "node",
  target: "node20",
  packages: "external",
  tsconfig: "tsconfig.json",
  sourcemap: "linked",
  logLevel: "warning",
});
console.log(`server built into ${outdir}`);
