// The interpret command: contract names, closed-form numbers (two flat layers, Telford,
// Geldart & Sheriff 1990 §4.3: t = x/v2 + 2h cos θ/v1), the same numbers as the shared
// function the screen calls, and clear refusals of bad input.
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { interpretPlanPicks, interpretationJson } from "../field";
import type { CliIo } from "./analyze";
import { runInterpretCli } from "./interpret";

const root = fileURLToPath(new URL("../../", import.meta.url));

const plan = {
  name: "Invented pilot line",
  models: [
    { name: "six metres of fill", layers: [{ velocity: 500, thickness: 6 }, { velocity: 2200 }] },
    { name: "shallow rock", layers: [{ velocity: 500, thickness: 3 }, { velocity: 3000 }] },
  ],
  spread: {
    spacing: 2,
    channels: 48,
    firstGeophone: 0,
    shots: [{ position: -1 }, { position: 95 }],
  },
};

function picksCsv(): string {
  const v1 = 500;
  const v2 = 2200;
  const ti = (2 * 6 * Math.sqrt(1 - (v1 / v2) ** 2)) / v1;
  const lines = ["shot_m,geophone_m,time_ms"];
  for (const s of [-1, 95]) {
    for (let k = 0; k < 48; k++) {
      const x = Math.abs(2 * k - s);
      lines.push(`${s},${2 * k},${(Math.min(x / v1, x / v2 + ti) * 1000).toFixed(4)}`);
    }
  }
  return lines.join("\n") + "\n";
}

function fakeIo(files: Record<string, string>) {
  const out: string[] = [];
  const err: string[] = [];
  const io: CliIo = {
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    readFile: (p) => {
      if (p in files) return files[p];
      throw Object.assign(new Error("missing"), { code: "ENOENT" });
    },
    readStdin: async () => "",
  };
  return { io, out, err };
}

describe("interpret command", () => {
  const files = { "plan.json": JSON.stringify(plan), "picks.csv": picksCsv() };

  it("prints refractors and reciprocal checks with exactly the contract's names, depths within 1 %", async () => {
    const { io, out } = fakeIo(files);
    expect(await runInterpretCli(["plan.json", "picks.csv"], io)).toBe(0);
    const json = JSON.parse(out.join(""));
    expect(Object.keys(json)).toEqual(["refractors", "reciprocal"]);
    const [ref] = json.refractors;
    expect(ref).toMatchObject({ layer: 2, method: "plus-minus" });
    expect(ref.depth.length).toBeGreaterThan(20);
    for (const d of ref.depth) {
      expect(Object.keys(d)).toEqual(["position", "depth", "elevation", "sigma"]);
      expect(Math.abs(d.depth - 6) / 6).toBeLessThan(0.01);
    }
    for (const v of ref.velocity) expect(Math.abs(v.value - 2200) / 2200).toBeLessThan(0.01);
    expect(json.reciprocal[0].shots).toEqual([-1, 95]);
    expect(Math.abs(json.reciprocal[0].difference)).toBeLessThan(1e-6);
  });

  it("gives the numbers of the shared function the Field check screen calls", async () => {
    const { io, out } = fakeIo(files);
    await runInterpretCli(["plan.json", "picks.csv", "--method", "grm"], io);
    const rows = picksCsv()
      .trim()
      .split("\n")
      .slice(1)
      .map((l) => l.split(",").map(Number));
    const direct = interpretationJson(
      interpretPlanPicks(
        { models: plan.models, criteria: { pickError: 0.0005 } },
        rows.map(([s, g, t]) => ({ sourcePosition: s, receiverPosition: g, time: t / 1000 })),
        { method: "grm" },
      ).result,
    );
    expect(JSON.parse(out.join(""))).toEqual(JSON.parse(JSON.stringify(direct)));
  });

  it("refuses a bad method, a missing file and a bad picks line, naming them", async () => {
    let r = fakeIo(files);
    expect(await runInterpretCli(["plan.json", "picks.csv", "--method", "guess"], r.io)).toBe(2);
    expect(r.err.join("")).toMatch(/--method must be one of plus-minus, delay-time, grm/);
    r = fakeIo(files);
    expect(await runInterpretCli(["plan.json", "nope.csv"], r.io)).toBe(2);
    expect(r.err.join("")).toMatch(/nope\.csv: cannot read the picks \(no such file\)/);
    r = fakeIo({ ...files, "bad.csv": "shot_m,geophone_m,time_ms\n0,2,abc\n" });
    expect(await runInterpretCli(["plan.json", "bad.csv"], r.io)).toBe(2);
    expect(r.err.join("")).toMatch(/line 2, column time_ms: 'abc' is not a number/);
    r = fakeIo(files);
    expect(await runInterpretCli(["plan.json"], r.io)).toBe(2);
    expect(r.err.join("")).toMatch(/^usage:/);
  });

  it("runs as the npm script does (node --import tsx)", () => {
    const dir = mkdtempSync(join(tmpdir(), "interpret-"));
    writeFileSync(join(dir, "plan.json"), files["plan.json"]);
    writeFileSync(join(dir, "picks.csv"), files["picks.csv"]);
    const run = spawnSync(
      process.execPath,
      [
        "--import",
        "tsx",
        "workers/cli/interpret.ts",
        join(dir, "plan.json"),
        join(dir, "picks.csv"),
      ],
      { cwd: root, encoding: "utf8", timeout: 60000 },
    );
    rmSync(dir, { recursive: true, force: true });
    expect(run.status).toBe(0);
    expect(JSON.parse(run.stdout).refractors[0].layer).toBe(2);
  });
});
