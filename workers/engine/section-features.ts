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
 * Steepest dip, degrees, that still reads as a slope rather than a step when the features
 * either side are gentler. Our choice (from memory: rockhead steps and scarps a crew would
 * draw as such are usually steeper than about 15°).
 */
export const STEP_DIP_DEG = 15;

/**
 * Whether the interface bends upwards (concave up, like the bottom of a trough) going from
 * feature `a` into the next feature `b`: the dip (positive deepening with position) drops by
 * more than `margin` degrees.
 */
const bendsUp = (a: InterfaceFeature, b: InterfaceFeature, margin: number) =>
  a.dip - b.dip > margin;

/**
 * A trough: the interface comes down into feature `index` and goes up out of it, bending
 * upwards at both ends (a slope that merely flattens out is not one).
 */
function isTrough(features: readonly InterfaceFeature[], index: number, margin: number): boolean {
  const f = features[index];
  const left = features[index - 1];
  const right = features[index + 1];
  if (!left || !right) return false;
  return left.dip > 0 && right.dip < 0 && bendsUp(left, f, margin) && bendsUp(f, right, margin);
}

/**
 * A top: the interface rises into feature `index` and falls away after it, bending downwards
 * at both ends (a slope that merely steepens is not one).
 */
function isTop(features: readonly InterfaceFeature[], index: number, margin: number): boolean {
  const f = features[index];
  const left = features[index - 1];
  const right = features[index + 1];
  if (!left || !right) return false;
  return left.dip < 0 && right.dip > 0 && bendsUp(f, left, margin) && bendsUp(right, f, margin);
}

/**
 * A plain name for a feature from its shape and its neighbours' (dips and where the
 * interface bends, not mean elevations, which a long neighbour's own slope would skew):
 * - "channel floor": the interface comes down into it and goes up out of it (a trough);
 * - "channel wall (descending)" / "channel wall (rising)": a slope (|dip| ≥ tolerance)
 *   whose lower end leads into a channel floor, or straight into the opposite wall (a V);
 *   descending and rising are along the line, with increasing position;
 * - "crest": the interface rises into it and falls away after it (a ridge top);
 * - "ridge flank (rising)" / "ridge flank (descending)": a slope whose upper end leads into
 *   a crest or straight into the opposite flank (a Λ);
 * - "step dipping N°": a slope of at least STEP_DIP_DEG between gentler features (a scarp);
 * - "level stretch" or "slope dipping N°" otherwise (also for the ends of the line).
 */
export function featureName(
  features: readonly InterfaceFeature[],
  index: number,
  toleranceDeg: number = FEATURE_DIP_TOLERANCE_DEG,
): string {
  const f = features[index];
  const left = features[index - 1];
  const right = features[index + 1];
  // adjacent features differ by at least the tolerance segment to segment; their mean dips
  // may differ less on a curved feature, so a bend needs half of it
  const margin = toleranceDeg / 2;
  const slope = Math.abs(f.dip) >= toleranceDeg;
  if (isTrough(features, index, margin)) return "channel floor";
  if (isTop(features, index, margin)) return "crest";
  if (slope && f.dip > 0 && right) {
    // descending: the lower end is on the right
    if (isTrough(features, index + 1, margin) || right.dip <= -toleranceDeg)
      return "channel wall (descending)";
    if (left && (isTop(features, index - 1, margin) || left.dip <= -toleranceDeg))
      return "ridge flank (descending)";
  }
  if (slope && f.dip < 0 && left) {
    // rising: the lower end is on the left
    if (isTrough(features, index - 1, margin) || left.dip >= toleranceDeg)
      return "channel wall (rising)";
    if (right && (isTop(features, index + 1, margin) || right.dip >= toleranceDeg))
      return "ridge flank (rising)";
  }
  const deg = Math.round(Math.abs(f.dip));
  if (!slope) return "level stretch";
  if (
    left &&
    right &&
    Math.abs(f.dip) >= STEP_DIP_DEG &&
    Math.abs(left.dip) < Math.abs(f.dip) - margin &&
    Math.abs(right.dip) < Math.abs(f.dip) - margin
  )
    return `step dipping ${deg}°`;
  return `slope dipping ${deg}°`;
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
