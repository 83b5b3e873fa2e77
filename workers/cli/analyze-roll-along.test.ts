// The analyze command on a roll-along plan (docs/examples/roll-along.json): the output is the
// worker's analysis, `rollAlong` included, and `--spread N` picks the spread given in detail.
// Station numbers and positions are worked by hand (common practice: spread k starts
// (k − 1)·(N − overlap) stations, i.e. (k − 1)·(N − overlap)·Δx metres, after the first).
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import * as Comlink from "comlink";
import { describe, expect, it } from "vitest";
import { analyzePlan, modellerApi, parsePlan, type ModellerApi } from "../engine";
import { runAnalyzeCli, type CliIo } from "./analyze";

const root = fileURLToPath(new URL("../../", import.meta.url));
const file = `${root}docs/examples/roll-along.json`;

function fakeIo(files: Record<string, string> = {}) {
  const out: string[] = [];
  const err: string[] = [];
  const io: CliIo = {
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    readFile: (p) => (p in files ? files[p] : readFileSync(p, "utf8")),
    readStdin: async () => "",
  };
  return { io, out, err };
}

async function run(args: string[], files: Record<string, string> = {}) {
  const { io, out, err } = fakeIo(files);
  const code = await runAnalyzeCli(args, io);
  return { code, out: out.join(""), err: err.join("") };
}

describe("analyze command: roll-along", () => {
  it("prints the worker's analysis, rollAlong included", async () => {
    const r = await run([file]);
    expect(r.code).toBe(0);
    expect(r.err).toBe("");
    const cli = JSON.parse(r.out);
    const { port1, port2 } = new MessageChannel();
    Comlink.expose(modellerApi, port1);
    const worker = Comlink.wrap<ModellerApi>(port2);
    const parsed = await worker.parsePlan(JSON.parse(readFileSync(file, "utf8")));
    if (!parsed.ok) throw new Error("example does not parse");
    expect(cli).toEqual(JSON.parse(JSON.stringify(await worker.analyzePlan(parsed.plan))));
    port1.close();
    port2.close();
  });

  it("numbers 78 stations along the 4 spreads of 24 sharing 6 (24 + 3 × 18)", async () => {
    const a = JSON.parse((await run([file])).out);
    expect(a.rollAlong.stations).toBe(78);
    expect(a.rollAlong.step).toBe(18);
    // spread 4: stations 3 × 18 + 1 = 55 to 78; first geophone 3 × 18 × 3 m = 162 m, last 231 m
    expect(a.rollAlong.spreads[3]).toMatchObject({
      index: 4,
      firstStation: 55,
      lastStation: 78,
      firstGeophone: 162,
      lastGeophone: 231,
    });
    // the anchored shots repeat on every spread: start 1.5 m before, end 1.5 m after
    expect(a.rollAlong.spreads[3].shots.map((s: { position: number }) => s.position)).toEqual([
      160.5, 196.5, 232.5,
    ]);
  });

  it("shows the deepest spread by default: rockhead deepening at 5° is out of reach under spread 4", async () => {
    const a = JSON.parse((await run([file])).out);
    expect(a.rollAlong.spreads.map((s: { worstStatus: string }) => s.worstStatus)).toEqual([
      "resolved",
      "resolved",
      "resolved",
      "under-sampled",
    ]);
    expect(a.worstStatus).toBe("under-sampled");
    expect(a.rollAlong.shown).toBe(4);
    expect(a.recommendation.text).toMatch(/4 roll-along spreads/);
  });

  it("gives spread N in detail with --spread N, before or after the file", async () => {
    const parsed = parsePlan(JSON.parse(readFileSync(file, "utf8")));
    if (!parsed.ok) throw new Error("example does not parse");
    for (const args of [
      ["--spread", "2", file],
      [file, "--spread", "2"],
    ]) {
      const r = await run(args);
      expect(r.code).toBe(0);
      const a = JSON.parse(r.out);
      expect(a.rollAlong.shown).toBe(2);
      expect(a.worstStatus).toBe("under-sampled");
      expect(a).toEqual(JSON.parse(JSON.stringify(analyzePlan(parsed.plan, { spread: 2 }))));
    }
  });

  it("refuses a --spread that is not a whole number from 1, and exits 2", async () => {
    for (const value of ["0", "1.5", "x", undefined]) {
      const args = value === undefined ? [file, "--spread"] : ["--spread", value, file];
      const r = await run(args);
      expect(r.code).toBe(2);
      expect(r.out).toBe("");
      expect(r.err).toMatch(/^--spread: /);
    }
  });

  it("names spread.rollAlong.overlap when the overlap is not below the channels", async () => {
    const plan = JSON.parse(readFileSync(file, "utf8"));
    plan.spread.rollAlong.overlap = 24;
    const r = await run(["bad.json"], { "bad.json": JSON.stringify(plan) });
    expect(r.code).toBe(2);
    expect(r.err).toContain(
      "spread.rollAlong.overlap: roll-along overlap must be below the 24 channels of a spread",
    );
  });
});
