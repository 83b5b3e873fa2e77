/**
 * The server's module structure, checked on the import graph (server/testing/import-graph.ts):
 * no import circle among the use cases, and what a production start loads.
 */
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { cycles, importGraph, sourceFiles } from "./testing/import-graph";

const root = fileURLToPath(new URL("..", import.meta.url));
const pkg = JSON.parse(readFileSync(`${root}package.json`, "utf8")) as {
  dependencies: Record<string, string>;
};

describe("server/domain", () => {
  it("has no import circle (plan visibility is one module the others depend on)", () => {
    const graph = importGraph(root, sourceFiles(root, "server/domain"));
    const found = cycles(graph, (file) => file.startsWith("server/domain/"));
    expect(found.map((c) => c.join(" → "))).toEqual([]);
  });

  it("plan-visibility imports no other use case", () => {
    const graph = importGraph(root, ["server/domain/plan-visibility.ts"]);
    const uses = (graph.files.get("server/domain/plan-visibility.ts") ?? []).filter((f) =>
      f.startsWith("server/domain/"),
    );
    expect(uses.sort()).toEqual(["server/domain/errors.ts"]);
  });
});

describe("a production start", () => {
  const graph = importGraph(root, ["server/main.ts", "server/workers/tasks.ts"]);
  const packages = new Set([...graph.packages.values()].flat());

  it("loads the demo-only mail catcher (smtp-server, mailparser) only on demand", () => {
    expect(packages.has("smtp-server")).toBe(false);
    expect(packages.has("mailparser")).toBe(false);
    // …and the catcher is still there for demo mode, behind a dynamic import.
    expect(readFileSync(`${root}server/start.ts`, "utf8")).toMatch(
      /await import\("\.\/mail\/fake-smtp"\)/,
    );
  });

  it("needs only production dependencies (an install without dev dependencies runs)", () => {
    const missing = [...packages].filter((p) => !(p in pkg.dependencies)).sort();
    expect(missing).toEqual([]);
  });

  it("reads nothing from node_modules by path (the report fonts come from public/fonts)", () => {
    const offenders = [...graph.files.keys()].filter(
      (file) =>
        file.startsWith("server/") && /node_modules/.test(readFileSync(root + file, "utf8")),
    );
    expect(offenders).toEqual([]);
  });
});
