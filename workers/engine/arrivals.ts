/**
 * Travel times of every arrival at every geophone of a shot, and dense curves for charts.
 * Times in seconds, positions and offsets in metres. Layers are numbered from 1 (top) in
 * every output; "head wave of layer L" travels along the top of layer L.
 */
import { geophonePosition, layoutExtent, type Side } from "./branches";
import { checkedEarth, type Earth } from "./geometry";
import { linesFor, prepareEarth, type PreparedEarth } from "./head-waves";
import { createLineSet, type LineSet } from "./lines";
import { finiteOrNull } from "./numbers";
import type { GroundModel, Shot, Spread } from "./plan-schema";
import { reflectionSolver } from "./reflections";
import { createPieces, firstArrivalPieces, pieceAt, type Pieces } from "./segments";

/** Which arrival a first break is: the direct wave or the head wave along the top of a layer. */
export type ArrivalKind = { kind: "direct" } | { kind: "head"; layer: number };

/** Arrival times at one geophone. */
export interface GeophoneArrivals {
  /** Geophone index along the spread, 0-based. */
  channel: number;
  /** Geophone position, m. */
  position: number;
  /** |position − shot|, m. */
  offset: number;
  /** Branch of the shot the geophone lies on; null when it stands at the shot. */
  side: Side | null;
  /** Direct-wave time, s. */
  direct: number;
  /** Head-wave time per refractor (layers 2..n); null where it does not exist or offset < critical distance. */
  head: { layer: number; time: number | null }[];
  /**
   * Reflection time from the top of each layer 2..n, s; null where no reflected ray emerges.
   * Empty unless computeArrivals was asked for reflections.
   */
  reflections: { layer: number; time: number | null }[];
  /** The first arrival: its time (s) and which arrival it is. */
  first: ArrivalKind & { time: number };
}

/** Arrivals of one shot at every geophone of the spread. */
export interface ShotArrivals {
  shot: number;
  shotPosition: number;
  geophones: GeophoneArrivals[];
}

interface SideState {
  lines: LineSet;
  pieces: Pieces;
}

function sideState(prep: PreparedEarth, shot: number, sign: 1 | -1): SideState {
  const n = prep.earth.layerCount;
  const lines = linesFor(prep, shot, sign, createLineSet(n));
  const pieces = firstArrivalPieces(lines, n, createPieces(n));
  return { lines, pieces };
}

/** Options of computeArrivals. */
export interface ArrivalOptions {
  /** Also solve the reflection from every interface at every geophone. Default false. */
  reflections?: boolean;
}

/**
 * Arrivals of shot `shotIndex` (0-based into spread.shots) at every geophone: direct wave,
 * every head wave (null where absent or before its critical distance), the first arrival
 * with its kind, and, only when `options.reflections` is true, reflections from every
 * interface (otherwise `reflections` is empty at every geophone and none is solved). Times
 * in s, positions and offsets in m. Throws RangeError for a bad shot index or a model whose
 * interfaces cross within the spread.
 */
export function computeArrivals(
  model: Pick<GroundModel, "layers">,
  spread: Spread,
  shotIndex: number,
  options: ArrivalOptions = {},
): ShotArrivals {
  const shot = spread.shots[shotIndex];
  if (!Number.isInteger(shotIndex) || !shot) throw new RangeError(`no shot ${shotIndex}`);
  const layout = { ...spread, shots: spread.shots.map((s) => s.position) };
  const extent = layoutExtent(layout);
  const earth = checkedEarth(model, extent.from, extent.to);
  const prep = prepareEarth(earth);
  const n = earth.layerCount;
  const xs = shot.position;
  const forward = sideState(prep, xs, 1);
  const reverse = sideState(prep, xs, -1);
  const solvers =
    options.reflections === true
      ? Array.from({ length: n - 1 }, (_, i) => reflectionSolver(earth, i + 1, xs))
      : [];
  const geophones: GeophoneArrivals[] = [];
  for (let channel = 0; channel < spread.channels; channel++) {
    const position = geophonePosition(layout, channel);
    const side: Side | null = position > xs ? "forward" : position < xs ? "reverse" : null;
    const offset = side === "forward" ? position - xs : side === "reverse" ? xs - position : 0;
    const state = side === "reverse" ? reverse : forward;
    const { lines, pieces } = state;
    const head: GeophoneArrivals["head"] = [];
    for (let m = 1; m < n; m++) {
      const valid = side !== null && lines.exists[m] === 1 && offset >= lines.start[m];
      head.push({
        layer: m + 1,
        time: valid ? finiteOrNull(lines.intercept[m] + lines.slowness[m] * offset) : null,
      });
    }
    const reflections = solvers.map((solve, i) => ({
      layer: i + 2,
      time: finiteOrNull(solve(position)),
    }));
    const piece = side === null ? -1 : pieceAt(pieces, offset);
    const arrival = piece < 0 ? 0 : pieces.arrival[piece];
    const direct = offset / earth.velocity[0];
    const time = arrival === 0 ? direct : (head[arrival - 1].time as number);
    geophones.push({
      channel,
      position,
      offset,
      side,
      direct,
      head,
      reflections,
      first: arrival === 0 ? { kind: "direct", time } : { kind: "head", layer: arrival + 1, time },
    });
  }
  return { shot: shotIndex, shotPosition: xs, geophones };
}

/** Dense time curves of every arrival of one shot, for charts. NaN marks "no arrival". */
export interface ArrivalCurves {
  /** Signed offsets of the samples (geophone position − shot position), m. */
  offsets: Float64Array;
  /** Positions of the samples along the line, m. */
  positions: Float64Array;
  /** Direct-wave times, s, and whether it is the first arrival at each sample (1/0). */
  direct: { times: Float64Array; first: Uint8Array };
  /** Head-wave times per refractor (layers 2..n), s; NaN before the critical distance or without a head wave. */
  head: { layer: number; times: Float64Array; first: Uint8Array }[];
  /** Reflection times from the top of layers 2..n, s (NaN where no ray emerges). */
  reflections: { layer: number; times: Float64Array }[];
  /** First-arrival time per sample, s, and which arrival: 1 = direct wave, L ≥ 2 = head wave of layer L. */
  first: { times: Float64Array; layer: Int16Array };
}

/**
 * Sample every arrival of a shot at `samples` evenly spaced signed offsets from
 * `fromOffset` to `toOffset` (m; negative offsets lie on the reverse branch). Set
 * `reflections: false` to skip reflections. Throws RangeError for bad arguments or a model
 * whose interfaces cross within the sampled extent.
 */
export function sampleCurves(
  model: Pick<GroundModel, "layers">,
  shot: number | Shot,
  fromOffset: number,
  toOffset: number,
  samples: number,
  options: { reflections?: boolean } = {},
): ArrivalCurves {
  const xs = typeof shot === "number" ? shot : shot.position;
  if (![xs, fromOffset, toOffset].every(Number.isFinite)) {
    throw new RangeError("shot position and offsets must be finite numbers");
  }
  if (!Number.isInteger(samples) || samples < 1 || samples > 100000) {
    throw new RangeError("samples must be a whole number from 1 to 100000");
  }
  const from = Math.min(xs, xs + fromOffset, xs + toOffset);
  const to = Math.max(xs, xs + fromOffset, xs + toOffset);
  const earth: Earth = checkedEarth(model, from, to);
  const prep = prepareEarth(earth);
  const n = earth.layerCount;
  const forward = sideState(prep, xs, 1);
  const reverse = sideState(prep, xs, -1);
  const offsets = new Float64Array(samples);
  const positions = new Float64Array(samples);
  const direct = { times: new Float64Array(samples), first: new Uint8Array(samples) };
  const head = Array.from({ length: n - 1 }, (_, i) => ({
    layer: i + 2,
    times: new Float64Array(samples),
    first: new Uint8Array(samples),
  }));
  const withReflections = options.reflections !== false;
  const solvers = withReflections
    ? Array.from({ length: n - 1 }, (_, i) => reflectionSolver(earth, i + 1, xs))
    : [];
  const reflections = solvers.map((_, i) => ({ layer: i + 2, times: new Float64Array(samples) }));
  const first = { times: new Float64Array(samples), layer: new Int16Array(samples) };
  for (let s = 0; s < samples; s++) {
    const signed =
      samples === 1 ? fromOffset : fromOffset + ((toOffset - fromOffset) * s) / (samples - 1);
    const offset = Math.abs(signed);
    offsets[s] = signed;
    positions[s] = xs + signed;
    const { lines, pieces } = signed < 0 ? reverse : forward;
    direct.times[s] = offset / earth.velocity[0];
    for (let m = 1; m < n; m++) {
      const valid = lines.exists[m] === 1 && offset >= lines.start[m];
      head[m - 1].times[s] = valid ? lines.intercept[m] + lines.slowness[m] * offset : NaN;
    }
    const piece = pieceAt(pieces, offset);
    const arrival = piece < 0 ? 0 : pieces.arrival[piece];
    first.layer[s] = arrival + 1;
    first.times[s] = arrival === 0 ? direct.times[s] : head[arrival - 1].times[s];
    if (arrival === 0) direct.first[s] = 1;
    else head[arrival - 1].first[s] = 1;
    solvers.forEach((solve, i) => {
      reflections[i].times[s] = solve(positions[s]);
    });
  }
  return { offsets, positions, direct, head, reflections, first };
}
