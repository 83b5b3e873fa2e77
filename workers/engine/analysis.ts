/**
 * The full analysis of a plan: for every candidate ground model the verdict per refractor
 * and per shot branch, what a practitioner would interpret, pick uncertainty, and design
 * figures with a recommendation; the plan is judged on its worst model.
 *
 * Units: m, s, m/s, degrees. Layers are numbered from 1 (top); a refractor's `layer` is the
 * layer whose top it is. Shots are 0-based indexes into `spread.shots`. The output is plain
 * JSON: no NaN or Infinity (null instead), so the command line and the worker agree.
 */
import { layoutExtent, type Branch, type Layout, type Side } from "./branches";
import { checkedEarth, interfaceDepth, type Earth } from "./geometry";
import { linesFor, prepareEarth, type PreparedEarth } from "./head-waves";
import { createLineSet, type LineSet } from "./lines";
import {
  crossoverMethod,
  interceptTimeMethod,
  type DipRecovery,
  type ObservedLine,
} from "./interpretation";
import { recoverDipLayered } from "./dip-recovery";
import { degrees, finiteOrNull } from "./numbers";
import type { Criteria, GroundModel, Plan } from "./plan-schema";
import { analyzeSection } from "./section-analysis";
import { isSectionAnalysis } from "./section-kind";
import { rollAlongLayout, spreadOfLine } from "./roll-along";
import {
  countOnSegments,
  createPieces,
  firstArrivalPieces,
  segmentHull,
  type Pieces,
} from "./segments";
import { STATUS_CODE, statusFromCode, worstStatus, type Status } from "./statuses";
import {
  directWaveCovariance,
  lineCovariance,
  pickStats,
  propagateUncertainty,
} from "./uncertainty";
import {
  lastCrossover,
  maxSpacingFor,
  minimumThicknesses,
  OTHER_EVIDENCE,
  spreadLengthFor,
} from "./design";
import {
  accumulateWorst,
  branchCodes,
  coverageOf,
  finishWorst,
  judgedBranches,
  primaryBranch,
} from "./verdicts";
import { resolveShotPositions, type ShotAnchor } from "./shot-anchors";
import { layoutOf } from "./validate";

/** An offset interval, m; `to` is null when unbounded. */
export interface Segment {
  from: number;
  to: number | null;
}

/** One arrival (direct wave or a refractor's head wave) on one shot branch. */
export interface BranchVerdict {
  /** Shot index (0-based into spread.shots). */
  shot: number;
  /** Shot position, m. */
  shotPosition: number;
  /** "forward": geophones at larger positions than the shot; "reverse": smaller. */
  side: Side;
  /** Geophones on the whole branch. */
  branchGeophones: number;
  /** Largest offset on the branch, m. */
  maxOffset: number;
  /** The arrival reaches the surface on this branch (always true for the direct wave). */
  headWave: boolean;
  /** Intercept time of the arrival's line, s (0 for the direct wave; null without a head wave). */
  interceptTime: number | null;
  /** Apparent velocity along this branch, m/s (null without a head wave). */
  apparentVelocity: number | null;
  /** Critical distance (offset), m (0 for the direct wave; null without a head wave). */
  criticalDistance: number | null;
  /** Offsets where it is the first arrival; null when it never is. */
  segment: Segment | null;
  /** Geophones of the branch on the segment. */
  geophones: number;
  status: Status;
  /**
   * Whether this branch judges the arrival: false when it holds fewer than the minimum
   * count on the segment without spanning it (its geophones lie before, beyond or only
   * partly over the segment); such a branch does not count towards the overall verdict.
   */
  judged: boolean;
  /** Crossover distance of this line with each shallower arrival's line (layer 1 = direct wave), m. */
  crossovers: { with: number; distance: number | null }[];
}

/** The direct wave (travelling in layer 1) over every judged branch. */
export interface DirectWaveAnalysis {
  layer: 1;
  velocity: number;
  /** Segment and count on the first shot's longest branch. */
  segment: Segment | null;
  geophones: number;
  /** Worst over the branches that judge it: "resolved" or "under-sampled". */
  status: Status;
  branches: BranchVerdict[];
}

/** The refractor at the top of one layer (below the first). */
export interface RefractorAnalysis {
  /** 1-based number of the layer whose top this refractor is. */
  layer: number;
  name: string | null;
  /** True velocity of the layer, m/s. */
  velocity: number;
  /** True vertical depth to its top under the first shot, m. */
  depth: number;
  /** Head-wave existence rule: faster than every layer above. */
  headWave: boolean;
  /** On the first shot's longest branch: intercept time s, critical distance m, apparent velocity m/s. */
  interceptTime: number | null;
  criticalDistance: number | null;
  apparentVelocity: number | null;
  /** First-arrival segment and its geophone count on the first shot's longest branch. */
  segment: Segment | null;
  geophones: number;
  /** Worst verdict over the shot branches that judge it (see BranchVerdict.judged). */
  status: Status;
  /** True when it is blind on every judged branch (no spread can reveal it). */
  blindEverywhere: boolean;
  /** Minimum thickness of this layer (m) for its refractor to be resolved with this spread; null when none up to 1000 m or for the half-space. */
  minimumThickness: number | null;
  branches: BranchVerdict[];
}

/** A refractor as a practitioner would interpret it with the intercept-time method. */
export interface InterpretedRefractor {
  layer: number;
  /** Interpreted (apparent) velocity below the refractor, m/s. */
  velocity: number;
  trueVelocity: number;
  /** True vertical depth under the shot, m. */
  trueDepth: number;
  /** Interpreted depth, m (null when the velocities do not increase and it cannot be computed). */
  interpretedDepth: number | null;
  /** interpretedDepth − trueDepth, m (positive: interpreted too deep). */
  error: number | null;
  /** Error as a percentage of the true depth. */
  errorPercent: number | null;
  /** |error| exceeds the plan's depth tolerance. */
  exceedsTolerance: boolean;
}

/** Dip and true velocity recovered from a reversed pair of shots. */
export interface DipCheck {
  layer: number;
  /** Shot shooting towards increasing position (its forward branch) and the one shooting back. */
  forwardShot: number;
  reverseShot: number;
  forwardApparentVelocity: number;
  reverseApparentVelocity: number;
  /** Recovered true velocity (m/s) and dip (degrees, positive deepening towards +position). */
  velocity: number | null;
  dip: number | null;
  trueVelocity: number;
  trueDip: number;
  /** Two-layer formula only (refractor directly under the direct-wave layer): vertical depth under each shot, m. */
  depthUnderForwardShot: number | null;
  depthUnderReverseShot: number | null;
  trueDepthUnderForwardShot: number;
  trueDepthUnderReverseShot: number;
  /** Reciprocal times of the refractor's head wave between the two shots, s. */
  reciprocalTime: { forward: number; reverse: number; difference: number; observable: boolean };
}

/** What a practitioner would conclude from the resolved segments of the first shot's longest branch. */
export interface Interpretation {
  shot: number;
  side: Side;
  /** Interpreted layers from the top: velocity m/s, thickness m (null for the last). */
  layers: { velocity: number; thickness: number | null }[];
  refractors: InterpretedRefractor[];
  /** Crossover method for the first layer (Kearey et al. 2002 ch. 5), null without a resolved refractor. */
  crossover: { distance: number; thickness: number; trueThickness: number } | null;
  dips: DipCheck[];
}

/** Pick error propagated to the interpretation. */
export interface Uncertainty {
  /** σ of a pick, s. */
  pickError: number;
  direct: { picks: number; velocity: number; velocitySigma: number | null };
  refractors: {
    layer: number;
    picks: number;
    velocity: number;
    velocitySigma: number | null;
    depth: number | null;
    depthSigma: number | null;
    /** depthSigma exceeds the plan's depth tolerance. */
    exceedsTolerance: boolean;
  }[];
}

/** A layer no spread can reveal from first arrivals, with a plain statement. */
export interface HiddenLayer {
  layer: number;
  status: "blind" | "inverted";
  statement: string;
}

/** Design figures and the recommendation for one model. */
export interface Recommendation {
  /** Largest spacing guaranteeing the minimum count on every bounded segment, m (null: any). */
  maxSpacing: number | null;
  /** Largest offset every shot branch must reach, m, at spacing maxSpacing (or the plan's). */
  spreadLength: number;
  /** Channels for a branch from offset 0 to spreadLength at that spacing. */
  channels: number;
  /** Start offset of the deepest visible refractor's unbounded segment, m. */
  lastCrossover: number;
  /** The plan's spacing is at most maxSpacing. */
  spacingOk: boolean;
  /** The longest shot branch reaches spreadLength. */
  lengthOk: boolean;
  text: string;
  hidden: HiddenLayer[];
}

/** Analysis of one ground model. */
export interface ModelAnalysis {
  model: number;
  name: string;
  worstStatus: Status;
  direct: DirectWaveAnalysis;
  refractors: RefractorAnalysis[];
  /** Null when the direct wave is itself under-sampled on the first shot's longest branch. */
  interpretation: Interpretation | null;
  uncertainty: Uncertainty | null;
  recommendation: Recommendation;
}

/** Analysis of a plan (the command line prints exactly this). */
export interface PlanAnalysis {
  format: "spreadsight-analysis/1";
  plan: string;
  criteria: Criteria;
  /** Worst verdict over every model. */
  worstStatus: Status;
  models: ModelAnalysis[];
  /** Combined over models: smallest maxSpacing, largest spreadLength. */
  recommendation: {
    maxSpacing: number | null;
    spreadLength: number;
    channels: number;
    text: string;
  };
  /**
   * Every shot where it stands on this spread (m, resolved through shot-anchors.ts), with its
   * label and anchor (absent = fixed), in the plan's order.
   */
  shots: Array<{ position: number; label?: string; anchor?: ShotAnchor }>;
  /**
   * Only for a roll-along plan (`spread.rollAlong`): the line's spreads with their stations,
   * geophone positions (m), shots (positions on that spread, m) and verdicts. `worstStatus`
   * above is the worst over every spread; `models` and `shots` above are those of spread
   * `shown`, and their shot indexes point into `spreads[shown − 1].shots`.
   */
  rollAlong?: {
    stations: number;
    step: number;
    overlap: number;
    spreads: Array<{
      index: number;
      firstStation: number;
      lastStation: number;
      firstGeophone: number;
      lastGeophone: number;
      shots: { planShot: number; label: string; position: number }[];
      worstStatus: Status;
      models: { name: string; worstStatus: Status }[];
    }>;
    /** 1-based spread whose detailed analysis the top-level `models` show. */
    shown: number;
  };
}

/** Options of analyzePlan. */
export interface AnalyzeOptions {
  /** Compute minimum thicknesses (closed form per layer, see design.ts). Default true. */
  minimumThickness?: boolean;
  /**
   * Roll-along plans only: the 1-based spread whose detailed analysis `models` show. Default
   * (or when that spread does not exist or records no shot): the first spread holding the
   * line's worst verdict. Ignored without roll-along. Throws RangeError unless a whole number ≥ 1.
   */
  spread?: number;
}

interface BranchState {
  shot: number;
  branch: Branch;
  lines: LineSet;
  pieces: Pieces;
  counts: Int32Array;
  codes: Uint8Array;
  judged: Uint8Array;
}

/**
 * Lines, first-arrival pieces, counts and codes of one branch. Flat models share one line set
 * and one set of pieces (`flatPieces`, filled on first use) between every branch: in offset
 * they do not depend on the shot.
 */
function evaluateBranch(
  prep: PreparedEarth,
  layout: Layout,
  shot: number,
  branch: Branch,
  minGeophones: number,
  flatPieces: Pieces | null = null,
): BranchState {
  const n = prep.earth.layerCount;
  const lines = prep.flat ?? linesFor(prep, branch.shot, branch.sign, createLineSet(n));
  let pieces: Pieces;
  if (prep.flat && flatPieces) {
    if (flatPieces.count === 0) firstArrivalPieces(lines, n, flatPieces);
    pieces = flatPieces;
  } else pieces = firstArrivalPieces(lines, n, createPieces(n));
  const counts = countOnSegments(pieces, layout, branch, new Int32Array(n));
  const codes = new Uint8Array(n);
  const judged = new Uint8Array(n);
  branchCodes(prep, lines, pieces, counts, minGeophones, coverageOf(layout, branch), codes, judged);
  return { shot, branch, lines, pieces, counts, codes, judged };
}

function segmentOf(pieces: Pieces, arrival: number): Segment | null {
  const hull = segmentHull(pieces, arrival);
  return hull ? { from: hull.from, to: finiteOrNull(hull.to) } : null;
}

function maxOffsetOf(layout: Layout, b: Branch): number {
  if (b.count === 0) return 0;
  return (
    b.sign * (layout.firstGeophone + (b.start + b.sign * (b.count - 1)) * layout.spacing - b.shot)
  );
}

function branchVerdict(layout: Layout, state: BranchState, m: number): BranchVerdict {
  const { lines, pieces, branch } = state;
  const exists = lines.exists[m] === 1;
  const crossovers: BranchVerdict["crossovers"] = [];
  for (let j = 0; j < m; j++) {
    if (lines.exists[j] !== 1) continue;
    const dp = lines.slowness[j] - lines.slowness[m];
    const x = exists && dp > 0 ? (lines.intercept[m] - lines.intercept[j]) / dp : NaN;
    crossovers.push({ with: j + 1, distance: finiteOrNull(x) });
  }
  return {
    shot: state.shot,
    shotPosition: branch.shot,
    side: branch.side,
    branchGeophones: branch.count,
    maxOffset: maxOffsetOf(layout, branch),
    headWave: exists,
    interceptTime: exists ? finiteOrNull(lines.intercept[m]) : null,
    apparentVelocity: exists ? finiteOrNull(1 / lines.slowness[m]) : null,
    criticalDistance: exists ? finiteOrNull(lines.start[m]) : null,
    segment: segmentOf(pieces, m),
    geophones: state.counts[m],
    status: statusFromCode(state.codes[m]),
    judged: state.judged[m] === 1,
    crossovers,
  };
}

function interpret(
  earth: Earth,
  layout: Layout,
  criteria: Criteria,
  primary: BranchState,
  states: BranchState[],
): { interpretation: Interpretation; uncertainty: Uncertainty } | null {
  const n = earth.layerCount;
  const { lines, codes } = primary;
  if (codes[0] !== STATUS_CODE.resolved) return null;
  const shotX = primary.branch.shot;
  const layersSeen: number[] = [];
  for (let m = 1; m < n; m++) if (codes[m] === STATUS_CODE.resolved) layersSeen.push(m);
  const observed: ObservedLine[] = layersSeen.map((m) => ({
    intercept: lines.intercept[m],
    slowness: lines.slowness[m],
  }));
  const p0 = lines.slowness[0];
  const result = interceptTimeMethod(p0, observed);
  const refractors: InterpretedRefractor[] = layersSeen.map((m, j) => {
    const trueDepth = interfaceDepth(earth, m, shotX);
    const depth = finiteOrNull(result.depths[j]);
    const error = depth === null ? null : depth - trueDepth;
    return {
      layer: m + 1,
      velocity: result.velocities[j + 1],
      trueVelocity: earth.velocity[m],
      trueDepth,
      interpretedDepth: depth,
      error,
      errorPercent: error === null ? null : finiteOrNull((100 * error) / trueDepth),
      exceedsTolerance: error !== null && Math.abs(error) > criteria.depthTolerance,
    };
  });
  let crossover: Interpretation["crossover"] = null;
  if (observed.length > 0) {
    const c = crossoverMethod(p0, observed[0]);
    if (Number.isFinite(c.distance) && Number.isFinite(c.thickness)) {
      crossover = {
        distance: c.distance,
        thickness: c.thickness,
        trueThickness: interfaceDepth(earth, layersSeen[0], shotX),
      };
    }
  }
  const interpretation: Interpretation = {
    shot: primary.shot,
    side: primary.branch.side,
    layers: result.velocities.map((velocity, j) => ({
      velocity,
      thickness: j < result.thicknesses.length ? finiteOrNull(result.thicknesses[j]) : null,
    })),
    refractors,
    crossover,
    dips: dipChecks(earth, states, 1 / p0),
  };
  // least-squares pick uncertainty on the same segments
  const sigma = criteria.pickError;
  const directStats = pickStats(layout, primary.branch, primary.pieces, 0);
  const directCov = directWaveCovariance(directStats, sigma);
  const covs = layersSeen.map((m) =>
    lineCovariance(pickStats(layout, primary.branch, primary.pieces, m), sigma),
  );
  const prop = propagateUncertainty(p0, directCov.varSlowness, observed, covs);
  const uncertainty: Uncertainty = {
    pickError: sigma,
    direct: {
      picks: directStats.n,
      velocity: 1 / p0,
      velocitySigma: finiteOrNull(prop.velocitySigma[0]),
    },
    refractors: layersSeen.map((m, j) => {
      const depthSigma = finiteOrNull(prop.depthSigma[j]);
      return {
        layer: m + 1,
        picks: pickStats(layout, primary.branch, primary.pieces, m).n,
        velocity: result.velocities[j + 1],
        velocitySigma: finiteOrNull(prop.velocitySigma[j + 1]),
        depth: finiteOrNull(result.depths[j]),
        depthSigma,
        exceedsTolerance: depthSigma !== null && depthSigma > criteria.depthTolerance,
      };
    }),
  };
  return { interpretation, uncertainty };
}

/**
 * Reversed pairs: a forward branch of shot A and a reverse branch of shot B with B beyond A,
 * both resolving the refractor; the widest pair is used. Velocity and dip are recovered
 * layer by layer through the recovered interfaces above (Adachi 1954; Johnson 1976; see
 * dip-recovery.ts), starting from the direct-wave velocity `v0`; they are null for a refractor
 * under one whose own velocity and dip could not be recovered.
 */
function dipChecks(earth: Earth, states: BranchState[], v0: number): DipCheck[] {
  const n = earth.layerCount;
  const checks: DipCheck[] = [];
  const forward = states.filter((s) => s.branch.side === "forward");
  const reverse = states.filter((s) => s.branch.side === "reverse");
  let vAbove = v0;
  let twoLayer = true;
  // Recovered layers above the current refractor (Adachi 1954; Johnson 1976): velocities top
  // first and the dips of the interfaces between them; null once a refractor above has no pair.
  let upper: { velocities: number[]; dips: number[] } | null = { velocities: [v0], dips: [] };
  for (let m = 1; m < n; m++) {
    let best: [BranchState, BranchState] | null = null;
    for (const a of forward) {
      for (const b of reverse) {
        if (!(b.branch.shot > a.branch.shot)) continue;
        if (a.codes[m] !== STATUS_CODE.resolved || b.codes[m] !== STATUS_CODE.resolved) continue;
        const width = b.branch.shot - a.branch.shot;
        if (!best || width > best[1].branch.shot - best[0].branch.shot) best = [a, b];
      }
    }
    if (!best) {
      upper = null;
      continue;
    }
    const [a, b] = best;
    const recovered: DipRecovery | null = upper
      ? recoverDipLayered(upper.velocities, upper.dips, a.lines.slowness[m], b.lines.slowness[m])
      : null;
    const xa = a.branch.shot;
    const xb = b.branch.shot;
    const span = xb - xa;
    const tf = a.lines.intercept[m] + a.lines.slowness[m] * span;
    const tr = b.lines.intercept[m] + b.lines.slowness[m] * span;
    let depthA: number | null = null;
    let depthB: number | null = null;
    if (recovered && twoLayer) {
      // two-layer formula: perpendicular depth h = τ v1 / (2 cos θc), vertical = h / cos φ
      const theta = (recovered.criticalAngle * Math.PI) / 180;
      const phi = (recovered.dip * Math.PI) / 180;
      const vertical = (tau: number) => (tau * vAbove) / (2 * Math.cos(theta)) / Math.cos(phi);
      depthA = finiteOrNull(vertical(a.lines.intercept[m]));
      depthB = finiteOrNull(vertical(b.lines.intercept[m]));
    }
    checks.push({
      layer: m + 1,
      forwardShot: a.shot,
      reverseShot: b.shot,
      forwardApparentVelocity: 1 / a.lines.slowness[m],
      reverseApparentVelocity: 1 / b.lines.slowness[m],
      velocity: recovered ? finiteOrNull(recovered.velocity) : null,
      dip: recovered ? finiteOrNull(recovered.dip) : null,
      trueVelocity: earth.velocity[m],
      trueDip: degrees(Math.atan(earth.slope[m])),
      depthUnderForwardShot: depthA,
      depthUnderReverseShot: depthB,
      trueDepthUnderForwardShot: interfaceDepth(earth, m, xa),
      trueDepthUnderReverseShot: interfaceDepth(earth, m, xb),
      reciprocalTime: {
        forward: tf,
        reverse: tr,
        difference: tf - tr,
        observable: span >= a.lines.start[m] && span >= b.lines.start[m],
      },
    });
    if (recovered && upper) {
      vAbove = recovered.velocity;
      twoLayer = false;
      upper = {
        velocities: [...upper.velocities, recovered.velocity],
        dips: [...upper.dips, recovered.dip],
      };
    } else upper = null;
  }
  return checks;
}

const fmt = (x: number, digits = 1): string => {
  const r = Number(x.toFixed(digits));
  return String(Object.is(r, -0) ? 0 : r);
};

function hiddenStatement(
  model: Pick<GroundModel, "layers">,
  earth: Earth,
  r: RefractorAnalysis,
): HiddenLayer | null {
  const label = model.layers[r.layer - 1]?.name ? ` (${model.layers[r.layer - 1].name})` : "";
  const last = r.layer === earth.layerCount;
  const v = `${fmt(earth.velocity[r.layer - 1], 0)} m/s`;
  if (r.status === "inverted") {
    return {
      layer: r.layer,
      status: "inverted",
      statement:
        `Layer ${r.layer}${label}, ${v}, is a velocity inversion: it is not faster than every layer above, ` +
        `sends no head wave, and no spread can reveal it from first arrivals` +
        (last ? ". " : "; the refractor below it will be interpreted too deep. ") +
        `Seek other evidence: ${OTHER_EVIDENCE}.`,
    };
  }
  if (r.status === "blind" && r.blindEverywhere) {
    const thick =
      r.minimumThickness === null
        ? ""
        : ` It would need to be at least ${fmt(r.minimumThickness, 2)} m thick to be resolved with this spread.`;
    return {
      layer: r.layer,
      status: "blind",
      statement:
        `Layer ${r.layer}${label}, ${v}, is a blind layer: its head wave is never a first arrival, so no spread ` +
        `can reveal it from first arrivals` +
        (last ? "." : "; the refractor below it will be interpreted too shallow.") +
        `${thick} ` +
        `Seek other evidence: ${OTHER_EVIDENCE}.`,
    };
  }
  return null;
}

function recommendationText(
  maxSpacing: number | null,
  spreadLength: number,
  channels: number,
  spacing: number,
  hidden: HiddenLayer[],
  refractors: RefractorAnalysis[],
): string {
  const spacingPart =
    maxSpacing === null
      ? `any spacing (now ${fmt(spacing, 2)} m)`
      : `spacing at most ${fmt(maxSpacing, 2)} m`;
  const recSpacing = maxSpacing ?? spacing;
  let text =
    `Use ${spacingPart} and shot branches reaching ${fmt(spreadLength)} m offset ` +
    `(${channels} channels at ${fmt(recSpacing, 2)} m).`;
  const partly = refractors
    .filter((r) => r.status === "blind" && !r.blindEverywhere)
    .map((r) => r.layer);
  if (partly.length > 0) {
    text += ` Layer ${partly.join(", ")} is blind on some shot directions only: shoot both ends.`;
  }
  if (hidden.length > 0) {
    const list = hidden.map((h) => `layer ${h.layer} (${h.status})`).join(", ");
    text += ` No spread can reveal ${list} from first arrivals.`;
  }
  return text;
}

function analyzeModel(
  model: GroundModel,
  index: number,
  layout: Layout,
  criteria: Criteria,
  options: AnalyzeOptions,
  summary = false,
): ModelAnalysis {
  const extent = layoutExtent(layout);
  const earth = checkedEarth(model, extent.from, extent.to);
  const prep = prepareEarth(earth);
  const n = earth.layerCount;
  const min = criteria.minGeophones;
  const judged = judgedBranches(layout);
  const shared = prep.flat ? createPieces(n) : null;
  const states = judged.map(({ shot, branch }) =>
    evaluateBranch(prep, layout, shot, branch, min, shared),
  );
  const primaryGeom = primaryBranch(layout);
  const primary =
    states.find((s) => s.shot === 0 && s.branch.side === primaryGeom.side) ??
    evaluateBranch(prep, layout, 0, primaryGeom, min, shared);
  const worst = new Uint8Array(n);
  const anyJudged = new Uint8Array(n);
  for (const s of states) accumulateWorst(s.codes, s.judged, n, worst, anyJudged);
  finishWorst(n, worst, anyJudged);
  const worstCode = (m: number) => worst[m];

  const direct: DirectWaveAnalysis = {
    layer: 1,
    velocity: earth.velocity[0],
    segment: segmentOf(primary.pieces, 0),
    geophones: primary.counts[0],
    status: statusFromCode(worstCode(0)),
    branches: summary ? [] : states.map((s) => branchVerdict(layout, s, 0)),
  };
  const thicknesses =
    options.minimumThickness !== false
      ? minimumThicknesses(prep, layout, min, extent, judged)
      : null;
  const refractors: RefractorAnalysis[] = [];
  for (let m = 1; m < n; m++) {
    const pv = primary.lines;
    const exists = pv.exists[m] === 1;
    refractors.push({
      layer: m + 1,
      name: model.layers[m].name ?? null,
      velocity: earth.velocity[m],
      depth: interfaceDepth(earth, m, layout.shots[0]),
      headWave: prep.rule[m] === 1,
      interceptTime: exists ? finiteOrNull(pv.intercept[m]) : null,
      criticalDistance: exists ? finiteOrNull(pv.start[m]) : null,
      apparentVelocity: exists ? finiteOrNull(1 / pv.slowness[m]) : null,
      segment: segmentOf(primary.pieces, m),
      geophones: primary.counts[m],
      status: statusFromCode(worstCode(m)),
      blindEverywhere: prep.rule[m] === 1 && states.every((s) => s.codes[m] === STATUS_CODE.blind),
      minimumThickness: thicknesses ? thicknesses[m] : null,
      branches: summary ? [] : states.map((s) => branchVerdict(layout, s, m)),
    });
  }
  const interp = summary ? null : interpret(earth, layout, criteria, primary, states);

  const piecesList = states.map((s) => s.pieces);
  const maxSpacing = maxSpacingFor(piecesList, n, min);
  const crossover = lastCrossover(piecesList);
  const recSpacing = maxSpacing ?? layout.spacing;
  const { spreadLength, channels } = spreadLengthFor(crossover, recSpacing, min);
  const hidden = refractors
    .map((r) => hiddenStatement(model, earth, r))
    .filter((h): h is HiddenLayer => h !== null);
  const recommendation: Recommendation = {
    maxSpacing,
    spreadLength,
    channels,
    lastCrossover: crossover,
    spacingOk: maxSpacing === null || layout.spacing <= maxSpacing,
    lengthOk: states.some((s) => maxOffsetOf(layout, s.branch) >= spreadLength),
    text: recommendationText(
      maxSpacing,
      spreadLength,
      channels,
      layout.spacing,
      hidden,
      refractors,
    ),
    hidden,
  };
  const statuses: Status[] = [direct.status, ...refractors.map((r) => r.status)];
  return {
    model: index,
    name: model.name,
    worstStatus: worstStatus(statuses),
    direct,
    refractors,
    interpretation: interp?.interpretation ?? null,
    uncertainty: interp?.uncertainty ?? null,
    recommendation,
  };
}

/**
 * Analyse a validated plan (see parsePlan): every model in order, then the plan's worst
 * verdict and combined recommendation. A roll-along plan (`spread.rollAlong`) is analysed
 * spread by spread (see analyzeRollAlong). Throws RangeError when a model's interfaces cross
 * within the spread or the spread is malformed (unvalidated input).
 */
export function analyzePlan(plan: Plan, options: AnalyzeOptions = {}): PlanAnalysis {
  const { spread } = plan;
  if (!(spread.spacing > 0) || !(spread.channels >= 1) || spread.shots.length === 0) {
    throw new RangeError("spread needs spacing > 0, at least 1 channel and at least 1 shot");
  }
  if (spread.rollAlong) return analyzeRollAlong(plan, options);
  const models = analyzeModels(plan, spread, options);
  const combined = combineModels(models, spread.spacing, plan.criteria);
  return {
    format: "spreadsight-analysis/1",
    plan: plan.name,
    criteria: plan.criteria,
    worstStatus: worstStatus(models.map((m) => m.worstStatus)),
    models,
    recommendation: {
      maxSpacing: combined.maxSpacing,
      spreadLength: combined.spreadLength,
      channels: combined.channels,
      text: combined.text(models.length, combined.hidden),
    },
    shots: resolvedShots(spread),
  };
}

/**
 * Every model of the plan analysed on one spread (without roll-along). `summary`: a layered
 * model's verdicts and recommendation only (no branch lists, interpretation or uncertainty),
 * for the spreads of a roll-along line that are not shown in detail.
 */
function analyzeModels(
  plan: Plan,
  spread: Omit<Plan["spread"], "rollAlong">,
  options: AnalyzeOptions,
  reuse: (ModelAnalysis | null)[] = [],
  summary = false,
): ModelAnalysis[] {
  const layout = layoutOf(spread);
  return plan.models.map(
    (m, i) =>
      reuse[i] ??
      (m.kind === "section"
        ? analyzeSection(m, i, spread, plan.criteria)
        : analyzeModel(m, i, layout, plan.criteria, options, summary)),
  );
}

/** The plan-level recommendation figures over a list of model analyses. */
function combineModels(models: ModelAnalysis[], spacing: number, criteria: Criteria) {
  let maxSpacing: number | null = null;
  let crossover = 0;
  for (const m of models) {
    const s = m.recommendation.maxSpacing;
    if (s !== null) maxSpacing = maxSpacing === null ? s : Math.min(maxSpacing, s);
    crossover = Math.max(crossover, m.recommendation.lastCrossover);
  }
  const { spreadLength, channels } = spreadLengthFor(
    crossover,
    maxSpacing ?? spacing,
    criteria.minGeophones,
  );
  const hidden = models.flatMap((m) =>
    m.recommendation.hidden.map((h) => `${m.name}: layer ${h.layer} (${h.status})`),
  );
  const text = (modelCount: number, hiddenList: string[], lead = "") => {
    const spacingPart =
      maxSpacing === null ? "any spacing" : `spacing at most ${fmt(maxSpacing, 2)} m`;
    let out =
      `Across ${modelCount} ground model${modelCount === 1 ? "" : "s"}${lead}: use ${spacingPart} and shot ` +
      `branches reaching ${fmt(spreadLength)} m offset (${channels} channels at ` +
      `${fmt(maxSpacing ?? spacing, 2)} m span ` +
      `${fmt((channels - 1) * (maxSpacing ?? spacing))} m).`;
    if (hiddenList.length > 0) out += ` Not revealed by any spread: ${hiddenList.join("; ")}.`;
    return out;
  };
  return { maxSpacing, spreadLength, channels, hidden, text };
}

/** "2", "2 and 5", "2, 3 and 5". */
function listNumbers(numbers: number[]): string {
  if (numbers.length <= 1) return numbers.join("");
  return `${numbers.slice(0, -1).join(", ")} and ${numbers[numbers.length - 1]}`;
}

/**
 * A roll-along plan: each spread of the line (roll-along.ts) is analysed as a spread of its own,
 * with its geometry and only the shots it records. `worstStatus` is the worst over every spread;
 * the detailed `models` are those of the spread `options.spread` (1-based) when it exists and
 * records a shot, else of the first spread holding the line's worst verdict, so the detail
 * never hides a worse verdict elsewhere; `rollAlong.shown` says which. Shot indexes inside
 * `models` and the top-level `shots` refer to that spread's shots (rollAlong.spreads[shown −
 * 1].shots, each naming its plan shot). A spread that records no shot samples nothing:
 * it is "under-sampled" and the recommendation says so. The recommendation figures combine
 * every spread and model.
 */
function analyzeRollAlong(plan: Plan, options: AnalyzeOptions): PlanAnalysis {
  const { spread, criteria } = plan;
  const roll = spread.rollAlong as NonNullable<Plan["spread"]["rollAlong"]>;
  if (options.spread !== undefined && !(Number.isInteger(options.spread) && options.spread >= 1)) {
    throw new RangeError("spread: the spread to show is a whole number from 1");
  }
  const line = rollAlongLayout(spread);
  // Verdicts and recommendation figures only (no minimum thicknesses, branch lists or
  // interpretation) for every spread; the spread shown is analysed in full below.
  const quick: AnalyzeOptions = { ...options, minimumThickness: false };
  const perSpread = line.spreads.map((part) => {
    if (part.shots.length === 0) return null;
    try {
      return analyzeModels(plan, spreadOfLine(spread, part.index, line), quick, [], true);
    } catch (error) {
      if (error instanceof RangeError)
        throw new RangeError(`spread ${part.index}: ${error.message}`);
      throw error;
    }
  });
  const spreadWorst = perSpread.map((models) =>
    models ? worstStatus(models.map((m) => m.worstStatus)) : ("under-sampled" as Status),
  );
  const lineWorst = worstStatus(spreadWorst);
  const shotWorst = worstStatus(spreadWorst.filter((_, k) => perSpread[k] !== null));
  const chosen = options.spread;
  let shownIndex =
    chosen !== undefined && perSpread[chosen - 1]
      ? chosen - 1
      : spreadWorst.findIndex((w, k) => perSpread[k] !== null && w === shotWorst);
  if (shownIndex < 0) shownIndex = 0; // unreachable: the plan has a shot, so some spread records it
  const shownPart = line.spreads[shownIndex];
  const shownSpread = spreadOfLine(spread, shownPart.index, line);
  const quickModels = perSpread[shownIndex] as ModelAnalysis[];
  // Section models are reused (solved once per spread); layered ones are analysed in full.
  const models = analyzeModels(
    plan,
    shownSpread,
    options,
    quickModels.map((m) => (isSectionAnalysis(m) ? m : null)),
  );

  const analysed = perSpread.flatMap((m, k) => (m ? [{ k, models: m }] : []));
  const combined = combineModels(
    analysed.flatMap((a) => a.models),
    spread.spacing,
    criteria,
  );
  // Hidden layers once per model and layer, with the spreads they are hidden on when not all.
  const hiddenOn = new Map<string, number[]>();
  for (const { k, models: list } of analysed) {
    for (const m of list) {
      for (const h of m.recommendation.hidden) {
        const key = `${m.name}: layer ${h.layer} (${h.status})`;
        const on = hiddenOn.get(key) ?? [];
        if (!on.includes(k + 1)) on.push(k + 1);
        hiddenOn.set(key, on);
      }
    }
  }
  const hidden = [...hiddenOn].map(([key, on]) =>
    on.length === line.spreads.length
      ? key
      : `${key} on spread${on.length === 1 ? "" : "s"} ${listNumbers(on)}`,
  );
  const n = line.spreads.length;
  const lead =
    ` and ${n} roll-along spreads (${spread.channels} channels each, ${roll.overlap} shared, ` +
    `stations 1–${line.stations} from ${fmt(line.firstGeophone, 2)} m to ${fmt(line.lastGeophone, 2)} m)`;
  let text = combined.text(plan.models.length, hidden, lead);
  const worstOn = spreadWorst.flatMap((w, k) => (w === lineWorst ? [k + 1] : []));
  if (worstOn.length < n) {
    text += ` The line's worst verdict (${lineWorst}) is on spread${worstOn.length === 1 ? "" : "s"} ${listNumbers(worstOn)}.`;
  }
  const shotless = perSpread.flatMap((m, k) => (m ? [] : [k + 1]));
  if (shotless.length > 0) {
    text +=
      ` Spread${shotless.length === 1 ? "" : "s"} ${listNumbers(shotless)} record${shotless.length === 1 ? "s" : ""} no shot: ` +
      "anchor shots to the spread's ends so that every spread is shot.";
  }
  text += ` The detailed results are for spread ${shownPart.index}.`;

  return {
    format: "spreadsight-analysis/1",
    plan: plan.name,
    criteria,
    worstStatus: lineWorst,
    models,
    recommendation: {
      maxSpacing: combined.maxSpacing,
      spreadLength: combined.spreadLength,
      channels: combined.channels,
      text,
    },
    shots: shownPart.shots.map((s) => {
      const anchor = spread.shots[s.planShot].anchor;
      return {
        position: s.position,
        label: s.label,
        ...(anchor ? { anchor: { to: anchor.to, offset: anchor.offset } } : {}),
      };
    }),
    rollAlong: {
      stations: line.stations,
      step: line.step,
      overlap: roll.overlap,
      spreads: line.spreads.map((part, k) => ({
        index: part.index,
        firstStation: part.firstStation,
        lastStation: part.lastStation,
        firstGeophone: part.firstGeophone,
        lastGeophone: part.lastGeophone,
        shots: part.shots.map((s) => ({
          planShot: s.planShot,
          label: s.label,
          position: s.position,
        })),
        worstStatus: spreadWorst[k],
        models: plan.models.map((m, i) => ({
          name: m.name,
          worstStatus: perSpread[k]?.[i].worstStatus ?? "under-sampled",
        })),
      })),
      shown: shownPart.index,
    },
  };
}

function resolvedShots(spread: Plan["spread"]): PlanAnalysis["shots"] {
  const positions = resolveShotPositions(spread.shots, spread);
  return spread.shots.map((s, i) => ({
    position: positions[i],
    ...(s.label ? { label: s.label } : {}),
    ...(s.anchor ? { anchor: { to: s.anchor.to, offset: s.anchor.offset } } : {}),
  }));
}
