/**
 * Verdicts per refractor for a spread (design.md):
 *  - inverted: no head wave (not faster than every layer above);
 *  - blind: the head wave exists but is never a first arrival on the branch;
 *  - under-sampled: its first-arrival segment holds fewer geophones than the minimum;
 *  - resolved: otherwise.
 * Each shot branch holding at least one geophone is judged on its own; the overall verdict
 * is the worst over branches. The direct wave (arrival 0) is judged too: resolved or
 * under-sampled.
 */
import { branchOf, type Branch, type Layout, type Side } from "./branches";
import { linesFor, type PreparedEarth } from "./head-waves";
import { createLineSet, type LineSet } from "./lines";
import { countOnSegments, createPieces, firstArrivalPieces, type Pieces } from "./segments";
import { STATUS_CODE } from "./statuses";

/** Reusable buffers for judging one model. */
export interface JudgeScratch {
  readonly lines: LineSet;
  readonly pieces: Pieces;
  readonly counts: Int32Array;
  readonly codes: Uint8Array;
}

/** Allocate judging buffers for a model of `layerCount` layers. */
export function createJudgeScratch(layerCount: number): JudgeScratch {
  return {
    lines: createLineSet(layerCount),
    pieces: createPieces(layerCount),
    counts: new Int32Array(layerCount),
    codes: new Uint8Array(layerCount),
  };
}

/**
 * Status code per arrival on one branch, from its lines, pieces and geophone counts.
 * Writes into `codes` (0 resolved, 1 under-sampled, 2 blind, 3 inverted).
 */
export function branchCodes(
  prep: PreparedEarth,
  lines: LineSet,
  pieces: Pieces,
  counts: Int32Array,
  minGeophones: number,
  codes: Uint8Array,
): Uint8Array {
  const n = prep.earth.layerCount;
  codes[0] = counts[0] >= minGeophones ? STATUS_CODE.resolved : STATUS_CODE["under-sampled"];
  for (let m = 1; m < n; m++) {
    if (prep.rule[m] !== 1) codes[m] = STATUS_CODE.inverted;
    else if (lines.exists[m] !== 1) codes[m] = STATUS_CODE.blind;
    else {
      let onCurve = false;
      for (let i = 0; i < pieces.count; i++) if (pieces.arrival[i] === m) onCurve = true;
      if (!onCurve) codes[m] = STATUS_CODE.blind;
      else if (counts[m] >= minGeophones) codes[m] = STATUS_CODE.resolved;
      else codes[m] = STATUS_CODE["under-sampled"];
    }
  }
  return codes;
}

/** A branch to judge: shot index and its branch geometry. */
export interface JudgedBranch {
  readonly shot: number;
  readonly branch: Branch;
}

const SIDES: readonly Side[] = ["forward", "reverse"];

/**
 * The branches that are judged: every shot side holding at least one geophone, in shot
 * order, forward before reverse. When no branch holds a geophone, the (empty) forward branch
 * of the first shot is returned so that every arrival still gets a verdict.
 */
export function judgedBranches(layout: Layout): JudgedBranch[] {
  const list: JudgedBranch[] = [];
  for (let s = 0; s < layout.shots.length; s++) {
    for (const side of SIDES) {
      const branch = branchOf(layout, layout.shots[s], side);
      if (branch.count > 0) list.push({ shot: s, branch });
    }
  }
  if (list.length === 0)
    list.push({ shot: 0, branch: branchOf(layout, layout.shots[0], "forward") });
  return list;
}

/** The first shot's longest branch (ties: forward), used for the interpretation. */
export function primaryBranch(layout: Layout): Branch {
  const f = branchOf(layout, layout.shots[0], "forward");
  const r = branchOf(layout, layout.shots[0], "reverse");
  return r.count > f.count ? r : f;
}

/**
 * Worst status code per arrival over every judged branch, written into `worst`
 * (length = layer count). Allocation-free apart from the branch list; used by sweeps and
 * by the design-figure bisection.
 */
export function worstCodes(
  prep: PreparedEarth,
  layout: Layout,
  minGeophones: number,
  scratch: JudgeScratch,
  worst: Uint8Array,
  branches: JudgedBranch[] = judgedBranches(layout),
): Uint8Array {
  const n = prep.earth.layerCount;
  worst.fill(0, 0, n);
  let flatDone = false;
  for (const { branch } of branches) {
    const lines = linesFor(prep, branch.shot, branch.sign, scratch.lines);
    if (!prep.flat || !flatDone) {
      firstArrivalPieces(lines, n, scratch.pieces);
      flatDone = true;
    }
    countOnSegments(scratch.pieces, layout, branch, scratch.counts);
    branchCodes(prep, lines, scratch.pieces, scratch.counts, minGeophones, scratch.codes);
    for (let m = 0; m < n; m++) if (scratch.codes[m] > worst[m]) worst[m] = scratch.codes[m];
  }
  return worst;
}
