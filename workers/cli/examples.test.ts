// The worked examples the README and docs/plan-format.md name exist and run through the CLI;
// the thin-layer example is checked against closed forms (Telford, Geldart & Sheriff 1990,
// §4.3: intercept times and crossover distances of flat layers), computed here, not by the engine.
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { runAnalyzeCli, type CliIo } from "./analyze";

const root = fileURLToPath(new URL("../../", import.meta.url));

function run(file: string) {
  const out: string[] = [];
  const err: string[] = [];
  const io: CliIo = {
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    readFile: (p) => readFileSync(p, "utf8"),
    readStdin: async () => "",
  };
  return runAnalyzeCli([`${root}${file}`], io).then((code) => ({ code, out, err }));
}

/** Every `docs/examples/*.json` path a document names. */
function namedExamples(doc: string): string[] {
  const text = readFileSync(`${root}${doc}`, "utf8");
  const paths = [...text.matchAll(/docs\/examples\/([\w.-]+\.json)/g)].map((m) => m[1]);
  const table = [...text.matchAll(/^\| `([\w.-]+\.json)` \|/gm)].map((m) => m[1]);
  return [...new Set([...paths, ...table])];
}

describe("worked examples", () => {
  it("the README's command names an example that exists and analyses (exit 0)", async () => {
    const named = namedExamples("README.md");
    expect(named).toContain("thin-layer.json");
    for (const name of named) {
      const { code, err } = await run(`docs/examples/${name}`);
      expect({ name, code, err }).toEqual({ name, code: 0, err: [] });
    }
  });

  it("every example the plan format's table names exists and analyses (exit 0)", async () => {
    const named = namedExamples("docs/plan-format.md");
    expect(named).toContain("roll-along.json");
    for (const name of named) {
      const { code, err } = await run(`docs/examples/${name}`);
      expect({ name, code, err }).toEqual({ name, code: 0, err: [] });
    }
  }, 60_000);

  it("the thin layer is under-sampled at 4 m spacing, as the closed forms say", async () => {
    const plan = JSON.parse(readFileSync(`${root}docs/examples/thin-layer.json`, "utf8"));
    const [l1, l2, l3] = plan.models[0].layers as Array<{ velocity: number; thickness?: number }>;
    const [v1, v2, v3] = [l1.velocity, l2.velocity, l3.velocity];
    const [h1, h2] = [l1.thickness!, l2.thickness!];
    const cos = (a: number, b: number) => Math.sqrt(1 - (a / b) ** 2);
    // Intercept times t_i,n = Σ 2 h_i cos θ_in / v_i (Telford et al. 1990, §4.3).
    const ti2 = (2 * h1 * cos(v1, v2)) / v1;
    const ti3 = (2 * h1 * cos(v1, v3)) / v1 + (2 * h2 * cos(v2, v3)) / v2;
    // Crossovers: direct → layer 2 head wave, and layer 2 → layer 3.
    const x12 = ti2 / (1 / v1 - 1 / v2);
    const x23 = (ti3 - ti2) / (1 / v2 - 1 / v3);
    expect(x23).toBeGreaterThan(x12);
    // Brute force: the forward branch's geophone offsets from the first shot.
    const { spacing, channels, firstGeophone, shots } = plan.spread;
    const offsets = Array.from(
      { length: channels },
      (_, k) => firstGeophone + k * spacing - shots[0].position,
    );
    const onSegment = offsets.filter((x) => x >= x12 && x <= x23).length;
    expect(onSegment).toBeLessThan(plan.criteria.minGeophones);

    const { code, out } = await run("docs/examples/thin-layer.json");
    expect(code).toBe(0);
    const analysis = JSON.parse(out.join(""));
    const refractors = analysis.models[0].refractors as Array<{
      layer: number;
      status: string;
      segment: { from: number; to: number } | null;
    }>;
    expect(refractors.map((r) => [r.layer, r.status])).toEqual([
      [2, "under-sampled"],
      [3, "resolved"],
    ]);
    expect(refractors[0].segment?.from).toBeCloseTo(x12, 6);
    expect(refractors[0].segment?.to).toBeCloseTo(x23, 6);
  });
});
