/**
 * Modeller benchmarks (npm run bench). Reports the median latency of:
 *  1. the full analysis of one 6-layer model with 96 channels and 5 shots (verdicts per
 *     branch, interpretation, uncertainty, minimum thicknesses and recommendation);
 *  2. a 200 × 200 design sweep (spacing × a layer's thickness), run on one thread, as the
 *     modeller's sweep worker runs it.
 * Also, for information: the analysis without the minimum thicknesses, the arrivals of 5
 * shots at 96 geophones (with and without reflections), and the 200 × 200 sweep on a
 * dipping model. Aims (issue 3): under 0.5 ms and under 2 s.
 * Then bench/engine.ts (issue 11): the analysis against the engine's first-arrival core on
 * the same case (aim ≤ 10×) and its growth with the layer count (aim: exponent ≤ 2).
 * Then bench/db.ts (issue 13): plan GET and save p50/p99 on SQLite and PostgreSQL.
 */
import { Bench } from "tinybench";
import {
  analyzePlan,
  computeArrivals,
  parsePlan,
  runSweep,
  type Plan,
  type SweepSpec,
} from "../workers/engine";
import { runDbBench } from "./db";
import { runEngineBench } from "./engine";
import { runSectionBench } from "./section";

function plan(input: unknown): Plan {
  const r = parsePlan(input);
  if (!r.ok) throw new Error(r.issues.join("\n"));
  return r.plan;
}

const layers = [
  { name: "topsoil", velocity: 350, thickness: 1.5 },
  { name: "dry sand", velocity: 600, thickness: 3 },
  { name: "saturated sand", velocity: 1600, thickness: 4 },
  { name: "till", velocity: 2000, thickness: 6 },
  { name: "weathered sandstone", velocity: 2800, thickness: 8 },
  { name: "sandstone", velocity: 4200 },
];
const spread = {
  spacing: 2,
  channels: 96,
  firstGeophone: 0,
  shots: [-10, -1, 95, 191, 200].map((position) => ({ position })),
};
const flat = plan({ name: "bench, flat", models: [{ name: "six layers", layers }], spread });
const dipping = plan({
  name: "bench, dipping",
  models: [
    {
      name: "six layers, dipping",
      layers: layers.map((l, i) => (i < 5 ? { ...l, dip: [0.2, 0.3, 0.5, 0.8, 1.2][i] } : l)),
    },
  ],
  spread,
});
const sweep: SweepSpec = {
  modelIndex: 0,
  axis: "spacing",
  min: 0.5,
  max: 10,
  steps: 200,
  parameter: { layer: 3, kind: "thickness", min: 0.2, max: 20, steps: 200 },
};

const fast = new Bench({ time: 2000, warmupTime: 300 });
fast
  .add("analyzePlan: 6 layers × 96 channels × 5 shots", () => {
    analyzePlan(flat);
  })
  .add("analyzePlan without minimum thicknesses", () => {
    analyzePlan(flat, { minimumThickness: false });
  })
  .add("analyzePlan: dipping 6 layers × 96 channels × 5 shots", () => {
    analyzePlan(dipping);
  })
  .add("computeArrivals: 5 shots × 96 geophones (with reflections)", () => {
    for (let s = 0; s < 5; s++)
      computeArrivals(flat.models[0], flat.spread, s, { reflections: true });
  })
  .add("computeArrivals: 5 shots × 96 geophones (no reflections, the default)", () => {
    for (let s = 0; s < 5; s++) computeArrivals(flat.models[0], flat.spread, s);
  });

const slow = new Bench({ time: 0, iterations: 7, warmup: true, warmupIterations: 1 });
slow
  .add("runSweep: 200 × 200 (spacing × thickness), one thread", () => {
    runSweep(flat, sweep);
  })
  .add("runSweep: 200 × 200 on the dipping model, one thread", () => {
    runSweep(dipping, sweep);
  });

function median(task: { name: string; result: unknown }): number {
  const r = task.result as { latency?: { p50: number } };
  if (!r.latency) throw new Error(`${task.name} did not run`);
  return r.latency.p50;
}

await fast.run();
await slow.run();
const rows = [...fast.tasks, ...slow.tasks].map((t) => {
  const ms = median(t);
  return { case: t.name, median: ms < 1 ? `${(ms * 1000).toFixed(1)} µs` : `${ms.toFixed(1)} ms` };
});
console.log(`Node ${process.version}, ${process.arch}`);
console.table(rows);
const analysis = median(fast.tasks[0]);
const grid = median(slow.tasks[0]);
console.log(
  `aims: analysis ${analysis.toFixed(3)} ms (< 0.5 ms: ${analysis < 0.5 ? "met" : "NOT met"}), ` +
    `200 × 200 sweep ${grid.toFixed(0)} ms (< 2000 ms: ${grid < 2000 ? "met" : "NOT met"})`,
);
await runEngineBench((p) => analyzePlan(p));
await runSectionBench();
await runDbBench();
