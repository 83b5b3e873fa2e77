/**
 * Features of an interface and the points a head wave images on it.
 *
 * A feature is a maximal run of consecutive segments of an interface polyline whose dip
 * changes by less than FEATURE_DIP_TOLERANCE_DEG from one segment to the next: a planar
 * interface is one feature, a gently curved channel floor drawn with several points is one
 * feature, and a channel's walls and floor are separate features.
 *
 * What a geophone's head-wave arrival images of a refractor is the point where its ray
 * LEAVES the refractor (the emergence or exit point): the delay time at the geophone is the
 * refractor's depth there (delay-time concept, Barry 1967; common practice). On a flat
 * refractor under a flat surface the exit point lies h·tan θc from the geophone towards the
 * shot (Telford et al. 1990 §4.3), h the depth and θc the critical angle.
 */
import type { Polyline } from "./section-geometry";

/**
 * Largest change of dip between two consecutive segments of one feature, degrees. Our
 * choice (common practice: a break of slope of a few degrees is what a crew would draw as a
 * separate feature of rockhead).
 */
export const FEATURE_DIP_TOLERANCE_DEG = 5;

/** One feature of an interface: positions m along the line, and how it sits. */
export interface InterfaceFeature {
  /** Start and end along the line, m (from < to). */
  readonly from: number;
  readonly to: number;
  /** Mean dip, degrees (positive: the interface deepens with increasing position). */
  readonly dip: number;
  /** Mean elevation, m. */
  readonly elevation: number;
}

/**
 * Split an interface polyline (positions non-decreasing, m; elevations m) into features.
 * Zero-length segments (a vertical step drawn as two points at one position) are steps of
 * 90°. A polyline with a single point gives one level feature of zero length.
 */
export function interfaceFeatures(
  line: Polyline,
  toleranceDeg: number = FEATURE_DIP_TOLERANCE_DEG,
): InterfaceFeature[] {
  const { xs, ys } = line;
  const n = xs.length;
  if (n < 2) return [{ from: xs[0], to: xs[0], dip: 0, elevation: ys[0] }];
  const dips: number[] = [];
  for (let i = 0; i + 1 < n; i++) {
    // dip positive downwards with increasing position
    dips.push((Math.atan2(ys[i] - ys[i + 1], xs[i + 1] - xs[i]) * 180) / Math.PI);
  }
  const out: InterfaceFeature[] = [];
  let start = 0;
  for (let i = 1; i <= dips.length; i++) {
    if (i < dips.length && Math.abs(dips[i] - dips[i - 1]) < toleranceDeg) continue;
    out.push(featureOf(xs, ys, start, i));
    start = i;
  }
  return out;
}

/** The feature made of segments start..end−1 (points start..end). */
function featureOf(
  xs: Float64Array,
  ys: Float64Array,
  start: number,
  end: number,
): InterfaceFeature {
  const from = xs[start];
  const to = xs[end];
  let area = 0;
  for (let i = start; i < end; i++) area += ((ys[i] + ys[i + 1]) / 2) * (xs[i + 1] - xs[i]);
  const elevation = to > from ? area / (to - from) : (ys[start] + ys[end]) / 2;
  const dip = (Math.atan2(ys[start] - ys[end], Math.max(to - from, 0)) * 180) / Math.PI;
  return { from, to, dip, elevation };
}

/**
 * The exit point of a head-wave ray that travelled along a refractor between `from` and
 * `to` (m): the end of that stretch nearer the geophone at `geophone` (m) — the far end
 * for a geophone beyond the shot on either side. NaN when the stretch is unknown.
 */
export function exitPoint(from: number, to: number, geophone: number): number {
  if (!(Number.isFinite(from) && Number.isFinite(to))) return NaN;
  return Math.abs(geophone - to) <= Math.abs(geophone - from) ? to : from;
}

/**
 * A plain name for a feature from its neighbours: "channel floor" (both neighbours higher),
 * "crest" (both lower), "level stretch" or "slope dipping N°" otherwise.
 */
export function featureName(
  features: readonly InterfaceFeature[],
  index: number,
  toleranceDeg: number = FEATURE_DIP_TOLERANCE_DEG,
): string {
  const f = features[index];
  const left = features[index - 1];
  const right = features[index + 1];
  if (left && right) {
    if (left.elevation > f.elevation && right.elevation > f.elevation) return "channel floor";
    if (left.elevation < f.elevation && right.elevation < f.elevation) return "crest";
  }
  if (Math.abs(f.dip) < toleranceDeg) return "level stretch";
  return `slope dipping ${Math.round(Math.abs(f.dip))}°`;
}

/** Practical geophone spacings, m (common practice: the marks of usual cables and tapes). */
const PRACTICAL_SPACINGS = [0.5, 1, 1.5, 2, 2.5, 3, 4, 5, 6, 8, 10, 12, 15, 20, 25, 30];

/**
 * The largest practical spacing (m) not above `length / count`: the spacing that puts at
 * least `count` exit points on a feature `length` m long. Below 0.5 m, rounded down to 0.1 m
 * (at least 0.1 m).
 */
export function practicalSpacing(length: number, count: number): number {
  const ideal = length / Math.max(1, count);
  let best = 0;
  for (const s of PRACTICAL_SPACINGS) if (s <= ideal + 1e-9) best = s;
  if (best > 0) return best;
  return Math.max(0.1, Math.floor(ideal * 10 + 1e-9) / 10);
}
