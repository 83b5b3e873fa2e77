/**
 * Section-model benchmarks (part of npm run bench), issue 9:
 *  1. a section 200 m long and 40 m deep, 96 geophones, 5 shots: all first arrivals and the
 *     coverage (analyzeSection: eikonal solve per shot, geophone times, ray paths, stretches,
 *     verdicts, interpretation) — aim under 150 ms in one worker on an idle machine;
 *  2. for information: the first arrivals alone, and one shot's time field with its rays
 *     (what the section chart asks for after an edit);
 *  3. how the cost grows with the number of grid cells: medians at several cell sizes and
 *     the exponent k of a least-squares fit median ∝ cells^k.
 */
import { Bench } from "tinybench";
import {
  analyzeSection,
  parsePlan,
  sectionShotField,
  type Plan,
  type SectionModel,
} from "../workers/engine";
import { solveSection } from "../workers/engine/section-arrivals";

function plan(input: unknown): Plan {
  const r = parsePlan(input);
  if (!r.ok) throw new Error(r.issues.join("\n"));
  return r.plan;
}

/** A sloping site 200 m long, rockhead 40 m below the highest surface point, a channel. */
export const benchSection: SectionModel = {
  kind: "section",
  name: "bench section",
  surface: [
    [-4, 140],
    [60, 137],
    [130, 133],
    [204, 130],
  ],
  layers: [
    {
      name: "topsoil and clay",
      velocity: 450,
      base: [
        [-4, 136],
        [80, 131],
        [204, 127],
      ],
    },
    {
      name: "glacial till",
      velocity: 1700,
      base: [
        [-4, 126],
        [70, 120],
        [90, 112],
        [110, 111],
        [130, 119],
        [204, 118],
      ],
    },
    {
      name: "weathered sandstone",
      velocity: 2600,
      base: [
        [-4, 108],
        [100, 100],
        [204, 104],
      ],
    },
    { name: "sandstone", velocity: 3800 },
  ],
};

const spacing = 200 / 95;
export const benchPlan = plan({
  name: "bench section plan",
  models: [benchSection],
  spread: {
    spacing,
    channels: 96,
    firstGeophone: 0,
    shots: [-2, 0.5 * spacing, 100, 200 - 0.5 * spacing, 202].map((position) => ({ position })),
  },
});

function median(task: { name: string; result: unknown }): number {
  const r = task.result as { latency?: { p50: number } };
  if (!r.latency) throw new Error(`${task.name} did not run`);
  return r.latency.p50;
}

/** Run the section benchmarks and print a table, the aim and the growth exponent. */
export async function runSectionBench(): Promise<void> {
  const { spread, criteria } = benchPlan;
  const model = benchPlan.models[0] as SectionModel;
  const bench = new Bench({ time: 3000, warmupTime: 500 });
  bench
    .add("section 200 m × 40 m, 96 geophones, 5 shots: first arrivals + coverage", () => {
      analyzeSection(model, 0, spread, criteria);
    })
    .add("same section: first arrivals only (5 eikonal solves, geophone times, rays)", () => {
      solveSection(model, spread);
    })
    .add("same section: one shot's time field and rays (section chart)", () => {
      sectionShotField(benchPlan, 0, 0);
    });
  await bench.run();
  const cells: number[] = [];
  const growth = new Bench({ time: 1500, warmupTime: 300 });
  for (const cellSize of [1.0, 0.7, 0.5, 0.35, 0.25]) {
    const m = { ...model, cellSize };
    const solved = solveSection(m, spread);
    cells.push((solved.grid.nx - 1) * (solved.grid.nz - 1));
    growth.add(`first arrivals, cells ${cellSize} m (${cells[cells.length - 1]} cells)`, () => {
      solveSection(m, spread);
    });
  }
  await growth.run();
  const rows = [...bench.tasks, ...growth.tasks].map((t) => ({
    case: t.name,
    median: `${median(t).toFixed(1)} ms`,
  }));
  console.table(rows);
  const xs = cells.map(Math.log);
  const ys = growth.tasks.map((t) => Math.log(median(t)));
  const mx = xs.reduce((a, b) => a + b, 0) / xs.length;
  const my = ys.reduce((a, b) => a + b, 0) / ys.length;
  let sxy = 0;
  let sxx = 0;
  xs.forEach((x, i) => {
    sxy += (x - mx) * (ys[i] - my);
    sxx += (x - mx) ** 2;
  });
  const k = sxy / sxx;
  // CPU time of this process per run (user + system): on a busy shared machine it is
  // close to what an idle machine's wall time would be
  const cpu: number[] = [];
  for (let r = 0; r < 15; r++) {
    const before = process.cpuUsage();
    analyzeSection(model, 0, spread, criteria);
    const used = process.cpuUsage(before);
    cpu.push((used.user + used.system) / 1000);
  }
  cpu.sort((a, b) => a - b);
  console.log(
    `section headline case, CPU time per run (median of 15): ${cpu[7].toFixed(1)} ms ` +
      `(< 150 ms: ${cpu[7] < 150 ? "met" : "NOT met"})`,
  );
  const headline = median(bench.tasks[0]);
  const solved = solveSection(model, spread);
  console.log(
    `section aim, wall time: ${headline.toFixed(1)} ms at the default ${solved.grid.h.toFixed(3)} m cells ` +
      `(${(solved.grid.nx - 1) * (solved.grid.nz - 1)} cells; < 150 ms: ${headline < 150 ? "met" : "NOT met"}); ` +
      `cost ∝ cells^${k.toFixed(2)}`,
  );
}
