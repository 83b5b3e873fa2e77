/**
 * The analysis of a section model: first arrivals of every shot at every geophone from the
 * 2-D eikonal solver, the stretches of each interface sampled by head waves with the layered
 * verdicts per stretch, a recommendation for weak stretches, and the intercept-time
 * interpretation a crew would make under each shot. The layered summary fields of
 * ModelAnalysis are filled from the same numbers so lists, reports and revisions keep
 * working. Units: m, s, m/s.
 */
import type { BranchVerdict, DirectWaveAnalysis, RefractorAnalysis, Segment } from "./analysis";
import { layoutOf } from "./validate";
import { spreadOfLine } from "./roll-along";
import type { Criteria, Plan, SectionModel, Spread } from "./plan-schema";
import { solveSection, type SolvedSection, type SolvedShot } from "./section-arrivals";
import { runsOf, sectionBranches, sectionCoverage, type SectionBranch } from "./section-coverage";
import { surfaceAt, topAt } from "./section-geometry";
import { fitLine, interpretSection } from "./section-interpretation";
import type {
  InterfaceCoverage,
  SectionModelAnalysis,
  SectionShotArrivals,
  SectionShotField,
} from "./section-types";
import { worstStatus, type Status } from "./statuses";
import { finiteOrNull } from "./numbers";

/** True when a model analysis comes from a section model (section-kind.ts). */
export { isSectionAnalysis } from "./section-kind";

function arrivalsOf(solved: SolvedSection, spread: Spread): SectionShotArrivals[] {
  return solved.shots.map((s) => ({
    shot: s.shot,
    position: spread.shots[s.shot].position,
    elevation: s.z,
    geophones: Array.from(solved.geophoneX, (x, k) => ({
      position: x,
      elevation: solved.geophoneZ[k],
      time: s.geophoneTimes[k],
      via: s.via[k] + 1,
    })),
  }));
}

function branchVerdict(
  solved: SolvedSection,
  shot: SolvedShot,
  b: SectionBranch,
  layer: number,
  coverage: InterfaceCoverage | null,
  minGeophones: number,
): BranchVerdict {
  const offset = (k: number) => Math.abs(solved.geophoneX[k] - shot.x);
  const runs = runsOf(shot.via, b, layer);
  const ks = runs.flatMap((r) => r.geophones);
  const segment: Segment | null = ks.length
    ? { from: Math.min(...ks.map(offset)), to: Math.max(...ks.map(offset)) }
    : null;
  const longest = runs.reduce<(typeof runs)[number] | null>(
    (a, r) => (!a || r.geophones.length > a.geophones.length ? r : a),
    null,
  );
  const line =
    layer > 0 && longest
      ? fitLine(
          longest.geophones.map(offset),
          longest.geophones.map((k) => shot.geophoneTimes[k]),
        )
      : null;
  let status: Status;
  let judged = true;
  if (layer > 0 && coverage && coverage.stretches.every((s) => s.status === "inverted")) {
    status = "inverted";
  } else if (
    ks.length === 0 &&
    shot.between.some((e) => e.via === layer && b.geophones.includes(e.after))
  ) {
    status = "under-sampled"; // first between two geophones of the branch, on none
  } else if (ks.length === 0) {
    status = layer === 0 ? "under-sampled" : "blind";
    judged = layer > 0;
  } else if (ks.length >= minGeophones) {
    status = "resolved";
  } else {
    status = "under-sampled";
    judged = !runs.some((r) => r.first === 0 || r.last === b.geophones.length - 1);
  }
  return {
    shot: b.shot,
    shotPosition: shot.x,
    side: b.side,
    branchGeophones: b.geophones.length,
    maxOffset: offset(b.geophones[b.geophones.length - 1]),
    headWave: layer === 0 || ks.length > 0,
    interceptTime: layer === 0 ? 0 : line ? finiteOrNull(line.intercept) : null,
    apparentVelocity: layer === 0 ? null : line ? finiteOrNull(1 / line.slowness) : null,
    criticalDistance: layer === 0 ? 0 : segment ? segment.from : null,
    segment,
    geophones: ks.length,
    status,
    judged,
    crossovers: [],
  };
}

/**
 * Analyse one section model of a validated plan (see parsePlan): `index` is its place in
 * `plan.models`. Throws RangeError for geometry the schema refuses.
 */
export function analyzeSection(
  model: SectionModel,
  index: number,
  spread: Spread,
  criteria: Criteria,
): SectionModelAnalysis {
  const solved = solveSection(model, spread);
  const layout = layoutOf(spread);
  const branches = sectionBranches(layout);
  const names = model.layers.map((l) => l.name ?? null);
  const min = criteria.minGeophones;
  const { coverage, recommendations } = sectionCoverage(solved, branches, layout, min, names);
  const interpretation = interpretSection(solved, branches, min);
  const g = solved.geometry;
  const byShot = new Map(solved.shots.map((s) => [s.shot, s]));
  const verdicts = (layer: number) =>
    branches.map((b) =>
      branchVerdict(
        solved,
        byShot.get(b.shot) as SolvedShot,
        b,
        layer,
        layer > 0 ? coverage[layer - 1] : null,
        min,
      ),
    );
  const primaryOf = (list: BranchVerdict[]) =>
    list
      .filter((v) => v.shot === 0)
      .reduce<BranchVerdict | null>(
        (a, v) => (!a || v.branchGeophones > a.branchGeophones ? v : a),
        null,
      );
  const directBranches = verdicts(0);
  const directJudged = directBranches.filter((v) => v.judged).map((v) => v.status);
  const primaryDirect = primaryOf(directBranches);
  const direct: DirectWaveAnalysis = {
    layer: 1,
    velocity: model.layers[0].velocity,
    segment: primaryDirect?.segment ?? null,
    geophones: primaryDirect?.geophones ?? 0,
    status: directJudged.length ? worstStatus(directJudged) : "under-sampled",
    branches: directBranches,
  };
  const x0 = spread.shots[0].position;
  const refractors: RefractorAnalysis[] = coverage.map((c) => {
    const m = c.layer - 1;
    const list = verdicts(m);
    const primary = primaryOf(list);
    return {
      layer: c.layer,
      name: c.name,
      velocity: model.layers[m].velocity,
      depth: surfaceAt(g, x0) - topAt(g, m, x0),
      headWave: c.status !== "inverted",
      interceptTime: primary?.interceptTime ?? null,
      criticalDistance: primary?.criticalDistance ?? null,
      apparentVelocity: primary?.apparentVelocity ?? null,
      segment: primary?.segment ?? null,
      geophones: primary?.geophones ?? 0,
      status: c.status,
      blindEverywhere: c.status === "blind" && c.stretches.every((s) => s.status === "blind"),
      minimumThickness: null,
      branches: list,
    };
  });
  const maxOffset = Math.max(
    0,
    ...branches.map((b) =>
      Math.abs(
        solved.geophoneX[b.geophones[b.geophones.length - 1]] - spread.shots[b.shot].position,
      ),
    ),
  );
  const spacings = recommendations.map((r) => r.spacing).filter((s): s is number => s !== null);
  const maxSpacing = spacings.length ? Math.min(...spacings) : null;
  const hidden = coverage
    .filter(
      (c) =>
        c.status === "inverted" ||
        (c.status === "blind" && c.stretches.every((s) => s.status === "blind")),
    )
    .map((c) => ({
      layer: c.layer,
      status: c.status as "blind" | "inverted",
      statement: c.summary,
    }));
  const text =
    recommendations.length === 0
      ? `Every interface is resolved wherever the spread samples it (cells ${solved.grid.h.toFixed(2)} m).`
      : recommendations.map((r) => r.text).join(" ");
  const statuses: Status[] = [direct.status, ...refractors.map((r) => r.status)];
  return {
    model: index,
    name: model.name,
    worstStatus: worstStatus(statuses),
    direct,
    refractors,
    interpretation: null,
    uncertainty: null,
    recommendation: {
      maxSpacing,
      spreadLength: maxOffset,
      channels: spread.channels,
      lastCrossover: 0,
      spacingOk: maxSpacing === null || spread.spacing <= maxSpacing,
      lengthOk: true,
      text,
      hidden,
    },
    kind: "section",
    arrivals: arrivalsOf(solved, spread),
    coverage,
    section: {
      grid: solved.grid.info,
      warnings: solved.grid.warnings,
      interpretation,
      recommendations,
    },
  };
}

/**
 * The time field and first-arrival ray paths of one shot over a section model (for the
 * section chart). `modelIndex` must point at a section model; `shot` is 0-based. On a
 * roll-along plan, `spread` (1-based, default 1) picks the spread of the line, and `shot`
 * indexes that spread's shots (as the analysis's `rollAlong.spreads[spread − 1].shots`); it is
 * ignored without roll-along. Throws RangeError otherwise.
 */
export function sectionShotField(
  plan: Plan,
  modelIndex: number,
  shot: number,
  spread = 1,
): SectionShotField {
  const model = plan.models[modelIndex];
  if (!model || model.kind !== "section") {
    throw new RangeError(`model ${modelIndex} is not a section model`);
  }
  const on = plan.spread.rollAlong ? spreadOfLine(plan.spread, spread) : plan.spread;
  if (!Number.isInteger(shot) || shot < 0 || shot >= on.shots.length) {
    throw new RangeError(`no shot ${shot}`);
  }
  const solved = solveSection(model, on, { shots: [shot], withRays: true });
  const s = solved.shots[0];
  return {
    shot,
    grid: solved.grid.info,
    times: s.times,
    rays: s.rays.map((points, k) => ({
      geophone: k,
      points,
      via: s.via[k] + 1,
      from: finiteOrNull(s.from[k]),
      to: finiteOrNull(s.to[k]),
    })),
  };
}
