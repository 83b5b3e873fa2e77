import { spawnSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { modellerApi, parsePlan } from "../engine";
import { runAnalyzeCli, type CliIo } from "./analyze";

const root = fileURLToPath(new URL("../../", import.meta.url));
const example = (name: string) => `${root}docs/examples/${name}`;

async function analyse(file: string) {
  const out: string[] = [];
  const err: string[] = [];
  const io: CliIo = {
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    readFile: (p) => readFileSync(p, "utf8"),
    readStdin: async () => "",
  };
  const code = await runAnalyzeCli([file], io);
  return { code, out: out.join(""), err: err.join("") };
}

describe("analyze command on section plans (docs/examples)", () => {
  it.each(["section-buried-channel.json", "section-pinching-lens.json"])(
    "%s: per model arrivals and coverage with the contract's names, the worker's numbers",
    async (name) => {
      const r = await analyse(example(name));
      expect(r.err).toBe("");
      expect(r.code).toBe(0);
      const a = JSON.parse(r.out);
      const input = JSON.parse(readFileSync(example(name), "utf8"));
      const m = a.models[0];
      expect(m.arrivals).toHaveLength(input.spread.shots.length);
      for (const shot of m.arrivals) {
        expect(Object.keys(shot)).toEqual(
          expect.arrayContaining(["shot", "position", "elevation", "geophones"]),
        );
        expect(shot.geophones).toHaveLength(input.spread.channels);
        for (const g of shot.geophones) {
          expect(Object.keys(g)).toEqual(expect.arrayContaining(["position", "elevation", "time"]));
          expect(typeof g.time).toBe("number");
        }
      }
      expect(m.coverage.map((c: { layer: number }) => c.layer)).toEqual(
        input.models[0].layers.slice(1).map((_: unknown, i: number) => i + 2),
      );
      for (const c of m.coverage) {
        for (const s of c.stretches) {
          expect(Object.keys(s)).toEqual(
            expect.arrayContaining(["from", "to", "geophones", "status"]),
          );
          expect(s.from).toBeLessThanOrEqual(s.to);
        }
      }
      // the worker runs modellerApi.analyzePlan on the same parsed plan
      const parsed = parsePlan(input);
      if (!parsed.ok) throw new Error(parsed.issues.join("\n"));
      expect(a).toEqual(JSON.parse(JSON.stringify(modellerApi.analyzePlan(parsed.plan))));
    },
  );

  it("gives the straight-line direct-wave time at the geophones next to a surface shot", async () => {
    // Straight ray in the top layer (Fermat's principle; common practice for the first
    // geophones of a spread): t = distance / v1.
    const a = JSON.parse((await analyse(example("section-buried-channel.json"))).out);
    const shot = a.models[0].arrivals[0];
    const near = shot.geophones[0];
    const d = Math.hypot(near.position - shot.position, near.elevation - shot.elevation);
    expect(near.time).toBeCloseTo(d / 550, 6);
  });

  it("names the point of a bad section on stderr and exits 2 (nothing on stdout)", async () => {
    const input = JSON.parse(readFileSync(example("section-pinching-lens.json"), "utf8"));
    input.models[0].layers[1].base[2] = [50, 99.5];
    const proc = spawnSync("npm", ["run", "--silent", "analyze", "--", "-"], {
      cwd: root,
      input: JSON.stringify(input),
      encoding: "utf8",
    });
    expect(proc.status).toBe(2);
    expect(proc.stdout).toBe("");
    expect(proc.stderr).toContain(
      "models[0].layers[1].base[2]: base rises above the surface at 50 m",
    );
  });
});
