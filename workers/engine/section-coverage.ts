/**
 * Coverage of a section's interfaces by head waves: for every shot branch and interface,
 * the stretches along which first-arrival rays travelled critically refracted, with the
 * geophones whose first arrival came that way, and the layered verdicts per stretch
 * (verdicts.ts, docs/plan-format.md):
 *  - resolved: the stretch holds at least minGeophones geophones;
 *  - under-sampled: fewer; counted only when the branch spans it (its geophones include
 *    neither the first nor the last geophone of the branch, beyond which the arrival may
 *    go on) — the layered rule for segments;
 *  - blind: the layer is faster than every layer above, yet no first arrival travels
 *    along it anywhere (the layered "head wave never first"). Gaps — parts of the
 *    interface under the spread, where the layer exists and could send a head wave, that no
 *    first-arrival ray travelled along — are listed as blind stretches too, but do not
 *    count towards the interface's verdict (judged false), as a layered refractor with a
 *    short segment is not blind;
 *  - inverted: the layer is not faster than a layer above there (no head wave).
 * The interface's verdict is the worst over the stretches that count; under-sampled when
 * none counts.
 *
 * Features (section-features.ts): a geophone images the refractor where its ray leaves it
 * (the exit point; delay-time concept, Barry 1967), so each interface is split into
 * features (runs of segments whose dip changes by less than FEATURE_DIP_TOLERANCE_DEG) and
 * every feature lying strictly inside the span of a branch run's exit points with fewer
 * than minGeophones exit points on it adds an under-sampled stretch (`feature` set) after
 * that run's stretch. A feature is resolved when ANY branch puts minGeophones exit points
 * on it (reversed shots image the same refractor): the weaker branches' feature stretches
 * are then not judged. A planar interface is one feature and never adds a stretch.
 */
import type { Side } from "./branches";
import { branchOf, type Branch, type Layout } from "./branches";
import type { SolvedSection } from "./section-arrivals";
import {
  exitPoint,
  featureName,
  interfaceFeatures,
  practicalSpacing,
  type InterfaceFeature,
} from "./section-features";
import { topAt, velocityAt, type SectionGeometry } from "./section-geometry";
import type { CoverageStretch, InterfaceCoverage, StretchRecommendation } from "./section-types";
import { worstStatus, type Status } from "./statuses";

/** One shot branch with its geophone indexes in offset order. */
export interface SectionBranch {
  readonly shot: number;
  readonly side: Side;
  readonly branch: Branch;
  /** Geophone indexes, nearest first. */
  readonly geophones: number[];
}

/** Every non-empty branch of every shot, forward before reverse. */
export function sectionBranches(layout: Layout): SectionBranch[] {
  const out: SectionBranch[] = [];
  for (let s = 0; s < layout.shots.length; s++) {
    for (const side of ["forward", "reverse"] as const) {
      const branch = branchOf(layout, layout.shots[s], side);
      if (branch.count === 0) continue;
      const geophones: number[] = [];
      for (let k = 0; k < branch.count; k++) geophones.push(branch.start + branch.sign * k);
      out.push({ shot: s, side, branch, geophones });
    }
  }
  return out;
}

/** A run of consecutive geophones of a branch whose first arrival came along one interface. */
export interface Run {
  /** Positions in the branch (0 = nearest geophone). */
  readonly first: number;
  readonly last: number;
  /** Geophone indexes, nearest first. */
  readonly geophones: number[];
}

/** Runs of arrival `via` (0 = direct wave) on one branch of one solved shot. */
export function runsOf(via: Int32Array, b: SectionBranch, layer: number): Run[] {
  const runs: Run[] = [];
  let start = -1;
  for (let k = 0; k <= b.geophones.length; k++) {
    const on = k < b.geophones.length && via[b.geophones[k]] === layer;
    if (on && start < 0) start = k;
    if (!on && start >= 0) {
      runs.push({ first: start, last: k - 1, geophones: b.geophones.slice(start, k) });
      start = -1;
    }
  }
  return runs;
}

const fmt = (x: number, digits = 1): string => {
  const r = Number(x.toFixed(digits));
  return String(Object.is(r, -0) ? 0 : r);
};

/** Intervals of [from, to] where `test(x)` holds, sampled every `step` m. */
function intervalsWhere(
  from: number,
  to: number,
  step: number,
  test: (x: number) => boolean,
): [number, number][] {
  const out: [number, number][] = [];
  const n = Math.max(1, Math.ceil((to - from) / step));
  let start: number | null = null;
  for (let i = 0; i <= n; i++) {
    const x = from + ((to - from) * i) / n;
    const on = test(x);
    if (on && start === null) start = x;
    if (!on && start !== null) {
      out.push([start, from + ((to - from) * (i - 1)) / n]);
      start = null;
    }
  }
  if (start !== null) out.push([start, to]);
  return out;
}

/** Whether layer m (0-based, ≥ 1) is faster at x than every layer above that is present there. */
function headWaveAt(g: SectionGeometry, m: number, x: number): boolean {
  const v = velocityAt(g, m, x);
  for (let k = 0; k < m; k++) {
    if (topAt(g, k, x) - topAt(g, k + 1, x) <= 1e-9) continue;
    if (velocityAt(g, k, x) >= v) return false;
  }
  return true;
}

/** Whether layer m exists (positive thickness, or the half-space) at x. */
function presentAt(g: SectionGeometry, m: number, x: number): boolean {
  return m === g.layerCount - 1 || topAt(g, m, x) - topAt(g, m + 1, x) > 1e-9;
}

/** The most exit points one branch puts on a feature (count of geophones), and which branch. */
export interface FeatureBest {
  count: number;
  shot: number;
  side: Side | null;
}

/**
 * Under-sampled features of one branch run: each feature lying strictly inside the span of
 * the run's exit points (the branch spans it, as the layered rule for segments) with fewer
 * than minGeophones exit points on it gives a stretch (judged for now; the caller clears
 * `judged` when another branch resolves the feature). Updates `best` for every feature.
 */
export function featureStretches(
  features: readonly InterfaceFeature[],
  geophones: readonly number[],
  shot: { readonly shot: number; readonly from: Float64Array; readonly to: Float64Array },
  gx: Float64Array,
  b: SectionBranch,
  minGeophones: number,
  best: FeatureBest[],
): [CoverageStretch, number][] {
  const out: [CoverageStretch, number][] = [];
  if (features.length < 2) {
    // a planar interface is one feature, never strictly inside a run: count only
    if (features.length === 1) {
      const f = features[0];
      let count = 0;
      for (const k of geophones) {
        const e = exitPoint(shot.from[k], shot.to[k], gx[k]);
        if (e >= f.from && e <= f.to) count++;
      }
      if (count > best[0].count) best[0] = { count, shot: b.shot, side: b.side };
    }
    return out;
  }
  const exits = geophones.map((k) => exitPoint(shot.from[k], shot.to[k], gx[k]));
  let lo = Infinity;
  let hi = -Infinity;
  for (const e of exits) {
    if (e < lo) lo = e;
    if (e > hi) hi = e;
  }
  features.forEach((f, index) => {
    const on: number[] = [];
    exits.forEach((e, i) => {
      if (e >= f.from && e <= f.to) on.push(geophones[i]);
    });
    if (on.length > best[index].count)
      best[index] = { count: on.length, shot: b.shot, side: b.side };
    if (!(f.to > f.from) || !(f.from > lo && f.to < hi) || on.length >= minGeophones) return;
    on.sort((p, q) => gx[p] - gx[q]);
    out.push([
      {
        from: f.from,
        to: f.to,
        geophones: on.length,
        status: "under-sampled",
        shot: b.shot,
        side: b.side,
        judged: true,
        geophonePositions: on.map((k) => gx[k]),
        feature: featureName(features, index),
      },
      index,
    ]);
  });
  return out;
}

/** Coverage of every interface (layers 2..n) and a recommendation per weak stretch. */
export function sectionCoverage(
  solved: SolvedSection,
  branches: readonly SectionBranch[],
  layout: Layout,
  minGeophones: number,
  names: readonly (string | null)[],
): { coverage: InterfaceCoverage[]; recommendations: StretchRecommendation[] } {
  const g = solved.geometry;
  const n = g.layerCount;
  const byShot = new Map(solved.shots.map((s) => [s.shot, s]));
  const coverage: InterfaceCoverage[] = [];
  const recommendations: StretchRecommendation[] = [];
  const gx = solved.geophoneX;
  const spreadFrom = Math.min(gx[0], gx[gx.length - 1]);
  const spreadTo = Math.max(gx[0], gx[gx.length - 1]);
  const step = Math.max(solved.grid.h, (g.to - g.from) / 2000);
  for (let m = 1; m < n; m++) {
    const stretches: CoverageStretch[] = [];
    const criticalOffsets: number[] = [];
    const features = interfaceFeatures(g.bases[m - 1]);
    // per feature, the most exit points any branch puts on it, and that branch
    const best: FeatureBest[] = features.map(() => ({ count: 0, shot: -1, side: null }));
    const featureOf = new Map<CoverageStretch, number>();
    for (const b of branches) {
      const shot = byShot.get(b.shot);
      if (!shot) continue;
      for (const run of runsOf(shot.via, b, m)) {
        let from = Infinity;
        let to = -Infinity;
        for (const k of run.geophones) {
          if (shot.from[k] < from) from = shot.from[k];
          if (shot.to[k] > to) to = shot.to[k];
        }
        const count = run.geophones.length;
        const status: Status = count >= minGeophones ? "resolved" : "under-sampled";
        const touchesEnd = run.first === 0 || run.last === b.geophones.length - 1;
        stretches.push({
          from,
          to,
          geophones: count,
          status,
          shot: b.shot,
          side: b.side,
          judged: status === "resolved" || !touchesEnd,
          geophonePositions: run.geophones.map((k) => gx[k]),
        });
        criticalOffsets.push(Math.abs(gx[run.geophones[0]] - shot.x));
        const found = featureStretches(features, run.geophones, shot, gx, b, minGeophones, best);
        for (const [stretch, index] of found) {
          stretches.push(stretch);
          featureOf.set(stretch, index);
        }
      }
      // first between two geophones of the branch but on none: a segment holding no
      // geophone, spanned by the branch (the layered under-sampled case with 0 geophones)
      for (const e of shot.between) {
        if (e.via !== m) continue;
        const pos = b.geophones.indexOf(e.after);
        const next = b.geophones.indexOf(e.after + 1);
        if (pos < 0 || next < 0) continue;
        stretches.push({
          from: e.from,
          to: e.to,
          geophones: 0,
          status: minGeophones > 0 ? "under-sampled" : "resolved",
          shot: b.shot,
          side: b.side,
          judged: true,
          geophonePositions: [],
        });
      }
    }
    // a feature is resolved when ANY branch puts minGeophones exit points on it (reversed
    // shots image the same refractor): then a weaker branch's feature stretch is not judged
    for (const [s, index] of featureOf) s.judged = best[index].count < minGeophones;
    const sampled = stretches.filter((s) => !featureOf.has(s));
    const inverted = intervalsWhere(
      g.from,
      g.to,
      step,
      (x) => presentAt(g, m, x) && !headWaveAt(g, m, x),
    );
    for (const [from, to] of inverted) {
      stretches.push({
        from,
        to,
        geophones: 0,
        status: "inverted",
        shot: null,
        side: null,
        judged: true,
        geophonePositions: [],
      });
    }
    const capable = (x: number) => presentAt(g, m, x) && headWaveAt(g, m, x);
    const covered = (x: number) => sampled.some((s) => x >= s.from - step && x <= s.to + step);
    let blind: [number, number][] = [];
    const gaps = sampled.length > 0;
    if (gaps) {
      blind = intervalsWhere(spreadFrom, spreadTo, step, (x) => capable(x) && !covered(x)).filter(
        ([a, b]) => b - a >= 2 * step,
      );
    } else {
      blind = intervalsWhere(spreadFrom, spreadTo, step, capable);
    }
    for (const [from, to] of blind) {
      stretches.push({
        from,
        to,
        geophones: 0,
        status: "blind",
        shot: null,
        side: null,
        judged: !gaps,
        geophonePositions: [],
      });
    }
    const judged = stretches.filter((s) => s.judged).map((s) => s.status);
    const status: Status =
      judged.length > 0 ? worstStatus(judged) : gaps ? "under-sampled" : "blind";
    const label = names[m] ? `${names[m]} (top of layer ${m + 1})` : `top of layer ${m + 1}`;
    const parts: string[] = [];
    if (sampled.length > 0) {
      const lo = Math.min(...sampled.map((s) => s.from));
      const hi = Math.max(...sampled.map((s) => s.to));
      parts.push(`${label} sampled from ${fmt(lo)} to ${fmt(hi)} m`);
    } else parts.push(`${label} is never sampled by a first arrival`);
    const median = criticalOffsets.length
      ? criticalOffsets.slice().sort((a, b) => a - b)[criticalOffsets.length >> 1]
      : 2 * Math.max(0, topAt(g, 0, spreadFrom) - topAt(g, m, spreadFrom));
    const recommended = new Set<number>();
    for (const s of stretches) {
      if (s.status === "resolved") continue;
      const where = `from ${fmt(s.from)} to ${fmt(s.to)} m`;
      const index = featureOf.get(s);
      if (index !== undefined) {
        // an under-sampled feature: named, with the exit points on it
        const other = best[index];
        const by = `by shot ${(s.shot ?? 0) + 1} ${s.side}`;
        parts.push(
          `the ${s.feature} ${where} is seen on ${s.geophones} geophone${s.geophones === 1 ? "" : "s"} ${by}: ` +
            (s.judged
              ? "under-sampled"
              : `under-sampled on this branch (resolved by shot ${other.shot + 1} ${other.side})`),
        );
        if (!s.judged || recommended.has(index)) continue;
        recommended.add(index);
        const spacing = practicalSpacing(s.to - s.from, minGeophones);
        const shots = [Math.max(g.from, s.from - median), Math.min(g.to, s.to + median)].map(
          (x) => Math.round(x * 10) / 10,
        );
        const text =
          `Layer ${m + 1} top, the ${s.feature} ${where}: use geophone spacing at most ` +
          `${fmt(spacing, 2)} m over ${fmt(s.from)}–${fmt(s.to)} m and a few geophones beyond each end ` +
          `(so that ${minGeophones} head-wave rays leave the interface on it), and shots near ` +
          `${fmt(shots[0])} m (shooting forward) and ${fmt(shots[1])} m (shooting back).`;
        recommendations.push({ layer: m + 1, from: s.from, to: s.to, spacing, shots, text });
        continue;
      }
      if (s.status === "under-sampled") {
        parts.push(
          `${where} is seen on ${s.geophones} geophone${s.geophones === 1 ? "" : "s"} by shot ${(s.shot ?? 0) + 1} ${s.side}: under-sampled${s.judged ? "" : " (at the end of the branch)"}`,
        );
      } else if (s.status === "blind") {
        parts.push(
          s.judged
            ? `${where} no first arrival travels along it: blind`
            : `${where} no first arrival travels along it (a gap in the coverage)`,
        );
      } else {
        parts.push(`${where} it is not faster than a layer above: inverted (no head wave)`);
      }
      if (s.status === "inverted") continue;
      const spacing =
        s.status === "under-sampled"
          ? Math.floor(((Math.max(1, s.geophones) * layout.spacing) / minGeophones) * 100) / 100
          : null;
      const shots = [Math.max(g.from, s.from - median), Math.min(g.to, s.to + median)].map(
        (x) => Math.round(x * 10) / 10,
      );
      const text =
        `Layer ${m + 1} top ${where}: ` +
        (spacing !== null
          ? `use geophone spacing at most ${fmt(spacing, 2)} m over ${fmt(s.from)}–${fmt(s.to)} m and `
          : `no first arrival comes from it with this spread; try `) +
        `shots near ${fmt(shots[0])} m (shooting forward) and ${fmt(shots[1])} m (shooting back)` +
        (spacing === null
          ? `; if it stays blind, seek other evidence (boreholes, cone penetration tests).`
          : ".");
      recommendations.push({ layer: m + 1, from: s.from, to: s.to, spacing, shots, text });
    }
    coverage.push({
      layer: m + 1,
      name: names[m] ?? null,
      stretches,
      status,
      summary: parts.join("; ") + ".",
    });
  }
  return { coverage, recommendations };
}
