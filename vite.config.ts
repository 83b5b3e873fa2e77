import { defineConfig } from "vite";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";
import { fileURLToPath, URL } from "node:url";

const apiPort = process.env.SPREADSIGHT_API_PORT ?? "3001";

export default defineConfig({
  plugins: [react(), tailwindcss()],
  resolve: {
    alias: {
      "@": fileURLToPath(new URL("./src", import.meta.url)),
      "@engine": fileURLToPath(new URL("./workers/engine", import.meta.url)),
    },
  },
  worker: { format: "es" },
  server: {
    port: 5173,
    proxy: { "/api": { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false } },
  },
  build: {
    outDir: "dist",
    // No source maps in dist/: they would publish the whole source. Build a private copy with
    // `--sourcemap` to read a stack trace.
    sourcemap: false,
    rolldownOptions: {
      treeshake: {
        // The numerical core is pure (DEVELOPERS.md): a module of it that nothing uses is
        // dropped even when reached through the engine's index, so the main thread carries
        // only the constants and schemas it needs; the computations live in the workers.
        moduleSideEffects: (id: string) =>
          /\/workers\/(engine|field)\//.test(id) ? false : undefined,
      },
    },
  },
});
