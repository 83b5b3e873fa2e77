import { spawnSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import * as Comlink from "comlink";
import { describe, expect, it } from "vitest";
import { modellerApi, type ModellerApi } from "../engine";
import { jsonErrorOffset, lineColumn, runAnalyzeCli, type CliIo } from "./analyze";

const root = fileURLToPath(new URL("../../", import.meta.url));
const example = (name: string) => `${root}docs/examples/${name}`;

function fakeIo(files: Record<string, string> = {}, stdin = "") {
  const out: string[] = [];
  const err: string[] = [];
  const io: CliIo = {
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    readFile: (p) => {
      if (p in files) return files[p];
      return readFileSync(p, "utf8");
    },
    readStdin: async () => stdin,
  };
  return { io, out, err };
}

describe("analyze command (in process)", () => {
  it("prints the analysis as JSON and exits 0", async () => {
    const { io, out, err } = fakeIo();
    expect(await runAnalyzeCli([example("two-layer-simple.json")], io)).toBe(0);
    expect(err).toEqual([]);
    const a = JSON.parse(out.join(""));
    expect(a.models[0].refractors[0]).toMatchObject({ layer: 2, status: "resolved", depth: 6 });
  });

  it("reads the plan from stdin when FILE is -", async () => {
    const { io, out } = fakeIo({}, readFileSync(example("velocity-inversion.json"), "utf8"));
    expect(await runAnalyzeCli(["-"], io)).toBe(0);
    expect(JSON.parse(out.join("")).worstStatus).toBe("inverted");
  });

  it("names each bad field on stderr and exits 2", async () => {
    const plan = {
      models: [{ name: "m", layers: [{ velocity: 0, thickness: -1 }, { velocity: "fast" }] }],
      spread: {
        spacing: 0,
        channels: 0,
        firstGeophone: 0,
        shots: [{ position: 0 }],
        colour: "red",
      },
    };
    const { io, out, err } = fakeIo({ "bad.json": JSON.stringify(plan) });
    expect(await runAnalyzeCli(["bad.json"], io)).toBe(2);
    expect(out).toEqual([]);
    const text = err.join("");
    for (const field of [
      "models[0].layers[0].velocity",
      "models[0].layers[0].thickness",
      "models[0].layers[1].velocity",
      "spread.spacing",
      "spread.channels",
      "spread.colour: unknown field",
    ]) {
      expect(text).toContain(field);
    }
  });

  it("names the line and column of broken JSON", async () => {
    const { io, err } = fakeIo({ "broken.json": '{\n  "name": "x",\n  "models": [,]\n}' });
    expect(await runAnalyzeCli(["broken.json"], io)).toBe(2);
    expect(err.join("")).toContain("broken.json: invalid JSON at line 3, column 14");
  });

  it("explains a missing file and a missing argument", async () => {
    const a = fakeIo();
    expect(await runAnalyzeCli(["/no/such/plan.json"], a.io)).toBe(2);
    expect(a.err.join("")).toContain("no such file");
    const b = fakeIo();
    expect(await runAnalyzeCli([], b.io)).toBe(2);
    expect(b.err.join("")).toMatch(/^usage:/);
  });
});

describe("JSON error location", () => {
  it.each([
    ['{"a": 1}', -1],
    ['{"a": 1,}', 8],
    ['{"a" 1}', 5],
    ["[1, 2", 5],
    ['{"a": "b\\x"}', 9],
    ["  ", 2],
  ])("finds the first error in %j at %d", (text, offset) => {
    expect(jsonErrorOffset(text)).toBe(offset);
  });

  it("agrees with JSON.parse on what is valid", () => {
    for (const t of [
      '{"a":[1,2.5e3,-0.1,true,false,null,"\\u00e9"]}',
      "[]",
      '"x"',
      "01",
      "[1,]",
      "{'a':1}",
    ]) {
      let valid = true;
      try {
        JSON.parse(t);
      } catch {
        valid = false;
      }
      expect(jsonErrorOffset(t) === -1).toBe(valid);
    }
  });

  it("turns offsets into 1-based lines and columns", () => {
    expect(lineColumn("ab\ncd", 4)).toEqual({ line: 2, column: 2 });
  });
});

describe("analyze command (as run by npm)", () => {
  const run = (args: string[], input?: string) =>
    spawnSync(process.execPath, ["--import", "tsx", "workers/cli/analyze.ts", ...args], {
      cwd: root,
      input,
      encoding: "utf8",
      timeout: 60000,
    });

  it("gives exactly the numbers the worker gives", async () => {
    const file = example("dipping-reversed.json");
    const r = run([file]);
    expect(r.status).toBe(0);
    const cli = JSON.parse(r.stdout);
    const { port1, port2 } = new MessageChannel();
    Comlink.expose(modellerApi, port1);
    const worker = Comlink.wrap<ModellerApi>(port2);
    const parsed = await worker.parsePlan(JSON.parse(readFileSync(file, "utf8")));
    if (!parsed.ok) throw new Error("example does not parse");
    expect(cli).toEqual(JSON.parse(JSON.stringify(await worker.analyzePlan(parsed.plan))));
    port1.close();
    port2.close();
  });

  it("exits 2 with field messages for a bad plan on stdin", () => {
    const r = run(["-"], JSON.stringify({ models: [], spread: { spacing: -2 } }));
    expect(r.status).toBe(2);
    expect(r.stdout).toBe("");
    expect(r.stderr).toContain("models: a plan needs at least one ground model");
    expect(r.stderr).toContain("spread.spacing: spacing must be > 0");
  });
});

describe("analyze command: shot positions", () => {
  it("reports where anchored shots stand on the spread, keeping every other field", async () => {
    const plan = {
      models: [{ name: "m", layers: [{ velocity: 500, thickness: 5 }, { velocity: 2000 }] }],
      spread: {
        spacing: 3,
        channels: 48,
        firstGeophone: 0,
        shots: [
          { position: -1.5, label: "end A", anchor: { to: "start", offset: -1.5 } },
          { position: 70.5, label: "end B", anchor: { to: "end", offset: 1.5 } },
          { position: 30 },
        ],
      },
    };
    const { io, out } = fakeIo({ "p.json": JSON.stringify(plan) });
    expect(await runAnalyzeCli(["p.json"], io)).toBe(0);
    const a = JSON.parse(out.join(""));
    // 48 geophones at 3 m end at 47 × 3 = 141 m (by hand); end B is 1.5 m beyond.
    expect(a.shots).toEqual([
      { position: -1.5, label: "end A", anchor: { to: "start", offset: -1.5 } },
      { position: 142.5, label: "end B", anchor: { to: "end", offset: 1.5 } },
      { position: 30 },
    ]);
    for (const field of ["format", "plan", "criteria", "worstStatus", "models", "recommendation"])
      expect(a).toHaveProperty(field);
  });
});
