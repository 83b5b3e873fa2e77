/**
 * Engine benchmarks for the analysis itself (issue 11), imported by bench/run.ts:
 *  1. the headline case, one 6-layer flat model × 96 channels × 5 shots: analyzePlan's
 *     median against the engine's own first-arrival core on the same case, and their ratio
 *     (aim: at most 10×);
 *  2. analyzePlan on 2..8 flat layers (same spread) and the exponent k of a least-squares
 *     fit median ∝ layers^k (aim: at most 2, quadratic growth).
 *
 * The first-arrival core is what any implementation of the method must compute: for every
 * shot, the arrival lines (direct wave and head waves), the first-arrival curve, the
 * first-arrival time at every geophone, and the geophone count on every segment with its
 * verdict over the judged shot branches. Everything else in analyzePlan (interpretation,
 * uncertainty, dip checks, minimum thicknesses, recommendation, the JSON output) is extra.
 */
import { Bench } from "tinybench";
import { branchOffset, layoutExtent } from "../workers/engine/branches";
import { checkedEarth } from "../workers/engine/geometry";
import { linesFor, prepareEarth } from "../workers/engine/head-waves";
import { createLineSet } from "../workers/engine/lines";
import { createPieces, firstArrivalPieces } from "../workers/engine/segments";
import { layoutOf, parsePlan } from "../workers/engine/validate";
import { createJudgeScratch, judgedBranches, worstCodes } from "../workers/engine/verdicts";
import type { GroundModel, Plan } from "../workers/engine/plan-schema";

/** Parse a plan document or throw with its issues. */
export function benchPlan(input: unknown): Plan {
  const r = parsePlan(input);
  if (!r.ok) throw new Error(r.issues.join("\n"));
  return r.plan;
}

/** Layers of the headline model and two more for the growth series (velocity m/s, thickness m). */
const SERIES = [
  { name: "topsoil", velocity: 350, thickness: 1.5 },
  { name: "dry sand", velocity: 600, thickness: 3 },
  { name: "saturated sand", velocity: 1600, thickness: 4 },
  { name: "till", velocity: 2000, thickness: 6 },
  { name: "weathered sandstone", velocity: 2800, thickness: 8 },
  { name: "sandstone", velocity: 4200, thickness: 10 },
  { name: "fresh sandstone", velocity: 4800, thickness: 12 },
  { name: "basement", velocity: 5600, thickness: 0 },
];

/** The headline spread: 96 channels at 2 m, shots off both ends, near both ends and at the centre. */
export const HEADLINE_SPREAD = {
  spacing: 2,
  channels: 96,
  firstGeophone: 0,
  shots: [-10, -1, 95, 191, 200].map((position) => ({ position })),
};

/**
 * A flat model of `layers` layers (2..8) on the headline spread. Six layers give the headline
 * case: the first five layers of the series over a 4200 m/s half-space.
 */
export function layeredPlan(layers: number): Plan {
  if (!(layers >= 2 && layers <= SERIES.length)) throw new RangeError("layers must be 2..8");
  const list = SERIES.slice(0, layers).map((l, i) =>
    i === layers - 1 ? { name: l.name, velocity: l.velocity } : l,
  );
  return benchPlan({
    name: `bench, ${layers} flat layers`,
    models: [{ name: `${layers} layers`, layers: list }],
    spread: HEADLINE_SPREAD,
  });
}

/**
 * The engine's first-arrival core on a plan's first model: per shot the lines, the
 * first-arrival curve and the first-arrival time at every geophone (returned, s, shot-major),
 * plus the verdict codes over the judged branches (the worst written into `worst`).
 */
export function firstArrivalCore(plan: Plan, worst: Uint8Array): Float64Array {
  const layout = layoutOf(plan.spread);
  const extent = layoutExtent(layout);
  const earth = checkedEarth(plan.models[0] as GroundModel, extent.from, extent.to);
  const prep = prepareEarth(earth);
  const n = earth.layerCount;
  const times = new Float64Array(layout.shots.length * layout.channels);
  const lines = createLineSet(n);
  const pieces = createPieces(n);
  const branches = judgedBranches(layout);
  for (const { shot, branch } of branches) {
    const l = linesFor(prep, branch.shot, branch.sign, lines);
    firstArrivalPieces(l, n, pieces);
    // geophones in order of offset, walking the pieces alongside
    let i = 0;
    for (let k = 0; k < branch.count; k++) {
      const offset = branchOffset(layout, branch, k);
      while (i < pieces.count - 1 && offset >= pieces.to[i]) i++;
      const a = pieces.arrival[i];
      times[shot * layout.channels + branch.start + branch.sign * k] =
        l.intercept[a] + l.slowness[a] * offset;
    }
  }
  worstCodes(prep, layout, plan.criteria.minGeophones, createJudgeScratch(n), worst, branches);
  return times;
}

/** Least-squares slope of log(y) against log(x): the exponent k of y ∝ x^k. */
export function fitExponent(xs: readonly number[], ys: readonly number[]): number {
  const lx = xs.map(Math.log);
  const ly = ys.map(Math.log);
  const mx = lx.reduce((a, b) => a + b, 0) / lx.length;
  const my = ly.reduce((a, b) => a + b, 0) / ly.length;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < lx.length; i++) {
    sxy += (lx[i] - mx) * (ly[i] - my);
    sxx += (lx[i] - mx) ** 2;
  }
  return sxy / sxx;
}

/** Median latency of a finished tinybench task, ms. */
export function medianOf(task: { name: string; result: unknown }): number {
  const r = task.result as { latency?: { p50: number } };
  if (!r.latency) throw new Error(`${task.name} did not run`);
  return r.latency.p50;
}

/** Format a latency in ms as µs or ms. */
export function formatMs(ms: number): string {
  return ms < 1 ? `${(ms * 1000).toFixed(1)} µs` : `${ms.toFixed(2)} ms`;
}

/** Layer counts of the growth series. */
export const GROWTH_LAYERS = [2, 3, 4, 5, 6, 7, 8];

/**
 * Run the analysis-versus-core and growth benchmarks with the given analyzePlan (the current
 * engine's by default; a before/after comparison passes another) and print the results.
 */
export async function runEngineBench(analyze: (plan: Plan) => unknown): Promise<void> {
  const headline = layeredPlan(6);
  const worst = new Uint8Array(6);
  const bench = new Bench({ time: 1000, warmupTime: 200 });
  bench
    .add("analyzePlan, headline (6 layers × 96 channels × 5 shots)", () => {
      analyze(headline);
    })
    .add("first-arrival core, same case", () => {
      firstArrivalCore(headline, worst);
    });
  const series = GROWTH_LAYERS.map((n) => layeredPlan(n));
  series.forEach((plan, i) =>
    bench.add(`analyzePlan, ${GROWTH_LAYERS[i]} layers`, () => {
      analyze(plan);
    }),
  );
  await bench.run();
  const medians = bench.tasks.map(medianOf);
  const [full, core, ...growth] = medians;
  const exponent = fitExponent(GROWTH_LAYERS, growth);
  console.table(bench.tasks.map((t, i) => ({ case: t.name, median: formatMs(medians[i]) })));
  const ratio = full / core;
  console.log(
    `analyzePlan / first-arrival core: ${ratio.toFixed(1)}× (aim ≤ 10×: ${ratio <= 10 ? "met" : "NOT met"}); ` +
      `growth with layers (2..8): exponent ${exponent.toFixed(2)} (aim ≤ 2: ${exponent <= 2 ? "met" : "NOT met"})`,
  );
}
