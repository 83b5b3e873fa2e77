/**
 * A small static import graph of the server's TypeScript (a madge-like check for tests):
 * `import … from "x"` and `export … from "x"` statements, without `import type`, `export type`
 * and dynamic `import()` (which loads only when that code runs).
 */
import { existsSync, readdirSync, readFileSync, statSync } from "node:fs";
import { dirname, join, relative, resolve } from "node:path";

const STATIC_IMPORT =
  /(?:^|\n)\s*(import|export)\s+(type\s+)?(?:[^'";]*?\s+from\s+)?["']([^"']+)["']/g;

export interface ImportGraph {
  /** Project-relative file → project-relative files it imports (at run time). */
  files: Map<string, string[]>;
  /** Project-relative file → npm packages it imports (at run time). */
  packages: Map<string, string[]>;
}

function resolveLocal(root: string, from: string, spec: string): string | null {
  let base: string;
  if (spec.startsWith(".")) base = resolve(dirname(join(root, from)), spec);
  else if (spec.startsWith("@/")) base = join(root, "src", spec.slice(2));
  else if (spec === "@engine") base = join(root, "workers/engine/index");
  else if (spec.startsWith("@engine/")) base = join(root, "workers/engine", spec.slice(8));
  else return null;
  const candidates = [base, `${base}.ts`, `${base}.tsx`, join(base, "index.ts")];
  for (const c of candidates) {
    if (existsSync(c) && statSync(c).isFile()) return relative(root, c);
  }
  return relative(root, `${base}.ts`);
}

function packageName(spec: string): string {
  const parts = spec.split("/");
  return spec.startsWith("@") ? parts.slice(0, 2).join("/") : parts[0];
}

/** The run-time import graph reachable from `entries` (project-relative paths). */
export function importGraph(root: string, entries: string[]): ImportGraph {
  const files = new Map<string, string[]>();
  const packages = new Map<string, string[]>();
  const queue = [...entries];
  while (queue.length) {
    const file = queue.pop()!;
    if (files.has(file)) continue;
    const path = join(root, file);
    if (!existsSync(path)) {
      files.set(file, []);
      continue;
    }
    const text = readFileSync(path, "utf8");
    const local: string[] = [];
    const npm: string[] = [];
    for (const match of text.matchAll(STATIC_IMPORT)) {
      if (match[2]) continue; // import type / export type
      const spec = match[3];
      if (spec.startsWith("node:")) continue;
      const target = resolveLocal(root, file, spec);
      if (target) local.push(target);
      else npm.push(packageName(spec));
    }
    files.set(file, local);
    packages.set(file, npm);
    queue.push(...local);
  }
  return { files, packages };
}

/** Every TypeScript file (not tests) under a project-relative folder. */
export function sourceFiles(root: string, folder: string): string[] {
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const name of readdirSync(join(root, dir))) {
      const rel = join(dir, name);
      if (statSync(join(root, rel)).isDirectory()) walk(rel);
      else if (/\.tsx?$/.test(name) && !/\.test\.tsx?$/.test(name)) out.push(rel);
    }
  };
  walk(folder);
  return out;
}

/** The import cycles among `files` (each as a list of files, first repeated at the end). */
export function cycles(graph: ImportGraph, within: (file: string) => boolean): string[][] {
  const found: string[][] = [];
  const state = new Map<string, "open" | "done">();
  const stack: string[] = [];
  const visit = (file: string) => {
    state.set(file, "open");
    stack.push(file);
    for (const next of graph.files.get(file) ?? []) {
      if (!within(next)) continue;
      if (state.get(next) === "open") found.push([...stack.slice(stack.indexOf(next)), next]);
      else if (!state.has(next)) visit(next);
    }
    stack.pop();
    state.set(file, "done");
  };
  for (const file of graph.files.keys()) if (within(file) && !state.has(file)) visit(file);
  return found;
}
