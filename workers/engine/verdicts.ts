/**
 * Verdicts per refractor for a spread (design.md):
 *  - inverted: no head wave (not faster than every layer above);
 *  - blind: the head wave exists but is never a first arrival on the branch;
 *  - under-sampled: its first-arrival segment holds fewer geophones than the minimum;
 *  - resolved: otherwise.
 * Each shot branch is judged on its own, and the overall verdict is the worst over the
 * branches that can judge the arrival. A branch always judges inverted and blind arrivals and
 * any segment on which it holds the minimum count (resolved). It judges a segment
 * under-sampled only when its geophones span the whole segment (nearest offset ≤ from +
 * spacing and farthest offset ≥ to − spacing): a branch whose geophones lie before, beyond
 * or only partly over a segment (the direct wave seen from an off-end shot, a deep refractor
 * on the short side of a centre shot) says nothing about it. When no branch judges an
 * arrival it is under-sampled. The direct wave (arrival 0) is judged the same way.
 */
import { branchOf, branchOffset, type Branch, type Layout, type Side } from "./branches";
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
  readonly judged: Uint8Array;
  readonly anyJudged: Uint8Array;
}

/** Allocate judging buffers for a model of `layerCount` layers. */
export function createJudgeScratch(layerCount: number): JudgeScratch {
  return {
    lines: createLineSet(layerCount),
    pieces: createPieces(layerCount),
    counts: new Int32Array(layerCount),
    codes: new Uint8Array(layerCount),
    judged: new Uint8Array(layerCount),
    anyJudged: new Uint8Array(layerCount),
  };
}

/** Offset coverage of a branch, m: nearest and farthest geophone offsets and the spacing. */
export interface Coverage {
  readonly near: number;
  readonly far: number;
  readonly spacing: number;
}

/** Coverage of a branch (an empty branch covers nothing). */
export function coverageOf(layout: Layout, branch: Branch): Coverage {
  if (branch.count === 0) return { near: Infinity, far: -Infinity, spacing: layout.spacing };
  return {
    near: branchOffset(layout, branch, 0),
    far: branchOffset(layout, branch, branch.count - 1),
    spacing: layout.spacing,
  };
}

/**
 * Status code per arrival on one branch, from its lines, pieces and geophone counts.
 * Writes into `codes` (0 resolved, 1 under-sampled, 2 blind, 3 inverted) and into `judged`
 * whether this branch can judge the arrival (see the module comment).
 */
export function branchCodes(
  prep: PreparedEarth,
  lines: LineSet,
  pieces: Pieces,
  counts: Int32Array,
  minGeophones: number,
  coverage: Coverage,
  codes: Uint8Array,
  judged: Uint8Array,
): Uint8Array {
  const n = prep.earth.layerCount;
  for (let m = 0; m < n; m++) {
    if (m > 0 && prep.rule[m] !== 1) {
      codes[m] = STATUS_CODE.inverted;
      judged[m] = 1;
      continue;
    }
    let from = Infinity;
    let to = -Infinity;
    for (let i = 0; i < pieces.count; i++) {
      if (pieces.arrival[i] !== m) continue;
      if (pieces.from[i] < from) from = pieces.from[i];
      if (pieces.to[i] > to) to = pieces.to[i];
    }
    if (lines.exists[m] !== 1 || from === Infinity) {
      codes[m] = STATUS_CODE.blind;
      judged[m] = 1;
    } else if (counts[m] >= minGeophones) {
      codes[m] = STATUS_CODE.resolved;
      judged[m] = 1;
    } else {
      codes[m] = STATUS_CODE["under-sampled"];
      const spans =
        coverage.near <= from + coverage.spacing && coverage.far >= to - coverage.spacing;
      judged[m] = spans ? 1 : 0;
    }
  }
  return codes;
}

/**
 * Combine one branch's codes into the running worst (`worst`, over judged branches) and
 * `anyJudged` flags.
 */
export function accumulateWorst(
  codes: Uint8Array,
  judged: Uint8Array,
  n: number,
  worst: Uint8Array,
  anyJudged: Uint8Array,
): void {
  for (let m = 0; m < n; m++) {
    if (judged[m] !== 1) continue;
    anyJudged[m] = 1;
    if (codes[m] > worst[m]) worst[m] = codes[m];
  }
}

/** Arrivals no branch judged are under-sampled. */
export function finishWorst(n: number, worst: Uint8Array, anyJudged: Uint8Array): void {
  for (let m = 0; m < n; m++) if (anyJudged[m] !== 1) worst[m] = STATUS_CODE["under-sampled"];
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
 * Worst status code per arrival over the branches that judge it, written into `worst`
 * (length = layer count). Allocation-free apart from the branch list; used by sweeps and
 * by the minimum-thickness bisection for dipping cases outside the closed form (design.ts).
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
  scratch.anyJudged.fill(0);
  let flatDone = false;
  for (const { branch } of branches) {
    const lines = linesFor(prep, branch.shot, branch.sign, scratch.lines);
    if (!prep.flat || !flatDone) {
      firstArrivalPieces(lines, n, scratch.pieces);
      flatDone = true;
    }
    countOnSegments(scratch.pieces, layout, branch, scratch.counts);
    branchCodes(
      prep,
      lines,
      scratch.pieces,
      scratch.counts,
      minGeophones,
      coverageOf(layout, branch),
      scratch.codes,
      scratch.judged,
    );
    accumulateWorst(scratch.codes, scratch.judged, n, worst, scratch.anyJudged);
  }
  finishWorst(n, worst, scratch.anyJudged);
  return worst;
}
