/**
 * Interpretation of reversed first-break picks under the line: for every refractor the user
 * assigned picks to, the depth and elevation under every geophone (with its standard error)
 * and the refractor velocity along the line, by the plus-minus method (Hagedoorn 1959), delay
 * times (Barry 1967) or the generalized reciprocal method (Palmer 1980), with reciprocal-time
 * checks between every pair of shots. Times are first reduced to a datum the user chooses.
 *
 * Steps for refractor n (layer n, the head wave along its top):
 * 1. its forward branch from the shot at A and reverse branch from the shot at B (the pair
 *    covering most stations), each completed by phantoming from farther shots on the same side;
 * 2. its velocity from the minus times t_f − t_r (slope 2/v), locally over `velocityWindow`
 *    stations and over the whole overlap;
 * 3. datum: every pick loses (e_shot − D + e_geophone − D)·cos θ_1n / v_1 (the time through
 *    layer 1 between the ground and the datum D, along the critical ray; common practice);
 * 4. the reciprocal time T: the forward branch at B and the reverse branch at A, averaged
 *    (straight-line extension over the last three picks where a shot lies beyond them);
 * 5. time-depths by the chosen method, converted layer by layer to thicknesses (time-depth.ts)
 *    with v_1 from the direct wave (a free-intercept fit) and each upper refractor's velocity;
 * 6. standard errors from the pick error σ_t through the same formulas (first order).
 * Depths are measured from the datum down and reported below the ground and as elevations.
 * Positions and elevations m, times s, velocities m/s.
 */
import { branchTimeAt, makeBranch, phantomBranch, type Branch } from "./branch-times";
import { delayTimes } from "./delay-times";
import { checkPicks, type ObservedPick } from "./field-picks";
import { grmFunctions, optimumXy, type XyCandidate } from "./grm";
import { fitSlope, localSlopes } from "./local-slope";
import { plusMinusTimes } from "./plus-minus";
import { reciprocalChecks, type ReciprocalCheck } from "./reciprocal-times";
import { assignedLayer, checkAssignments, type LayerAssignment } from "./refractor-assignment";
import type { ElevationProfile } from "./station-elevations";
import { thicknessAbove } from "./time-depth";

/** Interpretation methods offered. */
export type LineMethod = "plus-minus" | "delay-time" | "grm";

/** Method names as shown. */
export const LINE_METHODS: Record<LineMethod, string> = {
  "plus-minus": "Plus-minus (Hagedoorn 1959)",
  "delay-time": "Delay times (Barry 1967)",
  grm: "Generalized reciprocal method (Palmer 1980)",
};

/** What to interpret. */
export interface LineInput {
  /** First breaks, s. */
  picks: readonly ObservedPick[];
  /** Which picks belong to which layer (1 = direct wave). */
  assignments: readonly LayerAssignment[];
  method: LineMethod;
  /** σ of one pick, s. */
  pickError: number;
  /** Ground elevation along the line, m; flat at 0 m when absent. */
  elevation?: ElevationProfile | null;
  /** Datum elevation, m; default the lowest shot or geophone. */
  datum?: number | null;
  /** GRM: a fixed XY, m; default the optimum from the search. */
  xy?: number | null;
  /** Stations in the moving velocity window (default 5). */
  velocityWindow?: number;
}

/** The interpretation under one geophone. */
export interface StationDepth {
  /** m */
  position: number;
  /** Depth of the refractor below the ground, m. */
  depth: number;
  /** Elevation of the refractor, m. */
  elevation: number;
  /** Standard error of the depth, m. */
  sigma: number;
  /** Time-depth (delay) used, s. */
  timeDepth: number;
  /** True where a phantomed time entered. */
  phantom: boolean;
}

/** One refractor's interpretation. */
export interface RefractorSection {
  /** Layer whose top the refractor is (2 = base of the first layer). */
  layer: number;
  method: LineMethod;
  /** The reversed pair used [A, B], m. */
  shots: [number, number];
  /** Reciprocal time of the refractor's head wave between A and B (at the datum), s. */
  reciprocalTime: number;
  /** Velocity over the whole overlap, m/s, and its standard error. */
  meanVelocity: number;
  meanVelocitySigma: number;
  /** Velocity along the line (moving window of minus times or, for the GRM, the velocity
   * analysis function), m/s. */
  velocity: { position: number; value: number; sigma: number | null }[];
  depth: StationDepth[];
  /** Plus and minus times at the stations (datum-reduced), s. */
  plusMinus: { position: number; plus: number; minus: number }[];
  /** GRM only: XY used, m, the candidates tried and the two-layer estimate 2 h tan θ. */
  xy: { used: number; expected: number; candidates: XyCandidate[] } | null;
  notes: string[];
}

/** The whole interpretation. */
export interface LineInterpretation {
  method: LineMethod;
  /** Datum elevation, m. */
  datum: number;
  /** v_1 from the direct wave, m/s, and its standard error. */
  topVelocity: number;
  topVelocitySigma: number;
  refractors: RefractorSection[];
  reciprocal: ReciprocalCheck[];
  notes: string[];
}

const SAME = 0.001;

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** v_1 from the direct-wave picks: one slope, a free intercept per shot side. */
function directVelocity(
  picks: readonly (ObservedPick & { layer: number | null })[],
  pickError: number,
): { velocity: number; sigma: number } {
  const groups = new Map<string, { x: number[]; t: number[] }>();
  for (const p of picks) {
    if (p.layer !== 1) continue;
    const d = p.receiverPosition - p.sourcePosition;
    if (d === 0) continue;
    const key = `${p.sourcePosition}|${Math.sign(d)}`;
    const g = groups.get(key) ?? { x: [], t: [] };
    g.x.push(Math.abs(d));
    g.t.push(p.time);
    groups.set(key, g);
  }
  let sxx = 0;
  let sxt = 0;
  for (const g of groups.values()) {
    const n = g.x.length;
    if (n < 2) continue;
    const mx = g.x.reduce((a, b) => a + b, 0) / n;
    const mt = g.t.reduce((a, b) => a + b, 0) / n;
    g.x.forEach((x, i) => {
      sxx += (x - mx) ** 2;
      sxt += (x - mx) * (g.t[i] - mt);
    });
  }
  if (!(sxx > 0) || !(sxt > 0)) {
    throw new RangeError(
      "the direct wave (layer 1) needs at least two picks on one side of a shot to give the top velocity",
    );
  }
  const slope = sxt / sxx;
  return { velocity: 1 / slope, sigma: pickError / Math.sqrt(sxx) / (slope * slope) };
}

/** Interpolates a profile {position, value} at x (ends held); null when empty. */
function profileAt(
  points: readonly { position: number; value: number }[],
  x: number,
): number | null {
  if (points.length === 0) return null;
  if (x <= points[0].position) return points[0].value;
  const last = points[points.length - 1];
  if (x >= last.position) return last.value;
  let i = 1;
  while (points[i].position < x) i++;
  const a = points[i - 1];
  const b = points[i];
  return a.value + ((b.value - a.value) * (x - a.position)) / (b.position - a.position);
}

/**
 * Interprets the line.
 * @throws RangeError for bad picks or assignments, a pick error ≤ 0, or too few direct-wave picks
 */
export function interpretLine(input: LineInput): LineInterpretation {
  checkPicks(input.picks);
  checkAssignments(input.assignments);
  if (!(input.pickError > 0 && input.pickError < 0.1)) {
    throw new RangeError("pickError must be between 0 and 0.1 s");
  }
  const window = input.velocityWindow ?? 5;
  const elevation = input.elevation ?? (() => 0);
  const sigmaT = input.pickError;
  const notes: string[] = [];
  const picks = input.picks.map((p) => ({ ...p, layer: assignedLayer(input.assignments, p) }));
  const positions = [...new Set(picks.flatMap((p) => [p.sourcePosition, p.receiverPosition]))].sort(
    (a, b) => a - b,
  );
  const datum = input.datum ?? Math.min(...positions.map(elevation));
  if (!Number.isFinite(datum)) throw new RangeError("datum must be a finite elevation in metres");
  const geophones = [...new Set(picks.map((p) => p.receiverPosition))].sort((a, b) => a - b);
  const gaps = geophones.slice(1).map((x, i) => x - geophones[i]);
  const spacing = gaps.length ? median(gaps) : 1;
  const lineLength = geophones.length ? geophones[geophones.length - 1] - geophones[0] : 0;

  const top = directVelocity(picks, sigmaT);
  const v1 = top.velocity;
  const layers = [
    ...new Set(picks.map((p) => p.layer).filter((l): l is number => l !== null && l >= 2)),
  ].sort((a, b) => a - b);
  // Per refractor already interpreted: its mean velocity and thickness-above profile.
  const velocities: number[] = [v1];
  const velocitySigmas: number[] = [top.sigma];
  const thicknessProfiles: { position: number; value: number; sigma: number }[][] = [];
  const refractors: RefractorSection[] = [];

  for (const layer of layers) {
    if (velocities.length !== layer - 1) {
      notes.push(
        `layer ${layer}: not interpreted, because a shallower refractor (layer ${velocities.length + 1}) has no interpretation`,
      );
      break;
    }
    const mine = picks.filter((p) => p.layer === layer);
    const shots = [...new Set(mine.map((p) => p.sourcePosition))].sort((a, b) => a - b);
    const branchesOf = (correct: (p: ObservedPick) => number, direction: 1 | -1) =>
      shots.map((s) =>
        makeBranch(
          s,
          direction,
          mine
            .filter((p) => Math.abs(p.sourcePosition - s) <= SAME)
            .map((p) => ({ position: p.receiverPosition, time: correct(p) })),
        ),
      );
    const pairFor = (correct: (p: ObservedPick) => number) => {
      const fw = branchesOf(correct, 1).filter((b) => b.points.length >= 2);
      const rv = branchesOf(correct, -1).filter((b) => b.points.length >= 2);
      let best: { f: Branch; r: Branch; count: number } | null = null;
      for (const a of fw) {
        for (const b of rv) {
          if (!(b.shot > a.shot)) continue;
          const f = phantomBranch(a, fw);
          const r = phantomBranch(b, rv);
          const count = geophones.filter(
            (x) => x > a.shot && x < b.shot && branchTimeAt(f, x) && branchTimeAt(r, x),
          ).length;
          if (
            !best ||
            count > best.count ||
            (count === best.count && b.shot - a.shot > best.r.shot - best.f.shot)
          ) {
            best = { f, r, count };
          }
        }
      }
      return best;
    };
    // Without an overlap (an intermediate refractor seen only near each end), the branches are
    // used one shot per geophone (delay times) and the velocity is the mean of the two apparent
    // slownesses (Telford et al. 1990 §4.3.3).
    const separatePair = (correct: (p: ObservedPick) => number) => {
      const fw = branchesOf(correct, 1).filter((b) => b.points.length >= 2);
      const rv = branchesOf(correct, -1).filter((b) => b.points.length >= 2);
      let best: { f: Branch; r: Branch; count: number } | null = null;
      for (const a of fw) {
        for (const b of rv) {
          if (!(b.shot > a.shot)) continue;
          const count = a.points.length + b.points.length;
          if (!best || count > best.count)
            best = { f: phantomBranch(a, fw), r: phantomBranch(b, rv), count };
        }
      }
      return best;
    };
    const apparentVelocity = (f: Branch, r: Branch) => {
      const sf = fitSlope(
        f.points.map((p) => p.position),
        f.points.map((p) => p.time),
        sigmaT,
      );
      const sr = fitSlope(
        r.points.map((p) => p.position),
        r.points.map((p) => p.time),
        sigmaT,
      );
      if (!sf || !sr) return { v: NaN, sigma: NaN };
      const sum = sf.slope - sr.slope;
      return {
        v: 2 / sum,
        sigma: (2 / sum ** 2) * Math.hypot(sf.slopeError, sr.slopeError),
      };
    };
    // First pass without the datum reduction, for the velocity in cos θ_1n.
    let raw = pairFor((p) => p.time);
    let separate = false;
    if (!raw || raw.count < 2) {
      raw = separatePair((p) => p.time);
      separate = raw !== null;
    }
    if (!raw) {
      notes.push(
        `layer ${layer}: no reversed pair of shots has two or more picks each on this refractor (assign its picks on a shot from each end)`,
      );
      break;
    }
    let vRaw: number;
    if (separate) vRaw = apparentVelocity(raw.f, raw.r).v;
    else {
      const rawMinus = plusMinusTimes(raw.f, raw.r, 0, geophones);
      const rawFit = fitSlope(
        rawMinus.map((p) => p.position),
        rawMinus.map((p) => p.minus),
        Math.SQRT2 * sigmaT,
      );
      vRaw = rawFit && rawFit.slope > 0 ? 2 / rawFit.slope : NaN;
    }
    if (!(vRaw > v1)) {
      notes.push(
        `layer ${layer}: its minus times give ${Number.isFinite(vRaw) ? `${Math.round(vRaw)} m/s` : "no velocity"}, not faster than the top layer (${Math.round(v1)} m/s); check the assignment`,
      );
      break;
    }
    const cos1 = Math.sqrt(1 - (v1 / vRaw) ** 2);
    const reduce = (p: ObservedPick) =>
      p.time -
      ((elevation(p.sourcePosition) - datum + elevation(p.receiverPosition) - datum) * cos1) / v1;
    const pair = (separate ? separatePair(reduce) : pairFor(reduce))!;
    const { f, r } = pair;
    const A = f.shot;
    const B = r.shot;
    const reach = Math.max(lineLength, B - A);
    const tf = branchTimeAt(f, B, reach);
    const tr = branchTimeAt(r, A, reach);
    const layerNotes: string[] = [];
    if (!tf || !tr) {
      notes.push(`layer ${layer}: the reciprocal time between ${A} m and ${B} m cannot be read`);
      break;
    }
    const T = (tf.time + tr.time) / 2;
    if (Math.abs(tf.time - tr.time) > Math.max(0.002, 3 * Math.SQRT2 * sigmaT)) {
      layerNotes.push(
        `the forward and reverse branches give reciprocal times ${(tf.time * 1000).toFixed(1)} and ${(tr.time * 1000).toFixed(1)} ms; their mean is used`,
      );
    }
    const sigmaT_T = (sigmaT * (tf.how === "beyond" || tr.how === "beyond" ? 2 : 1)) / Math.SQRT2;
    const stations = geophones.filter((x) => x > A - SAME && x < B + SAME);
    if (separate) {
      const { v: vs, sigma: vsSigma } = apparentVelocity(f, r);
      const d = delayTimes(f, r, T, vs, stations).filter((p) => p.position > A && p.position < B);
      const vAbove = velocities.slice();
      const depth: StationDepth[] = [];
      const thickness: { position: number; value: number; sigma: number }[] = [];
      for (const p of d) {
        const upper = thicknessProfiles.map((prof) => profileAt(prof, p.position) ?? NaN);
        const h = thicknessAbove(p.delay, [...vAbove, vs], upper);
        if (!Number.isFinite(h)) continue;
        const sigmaTd = Math.sqrt(sigmaT ** 2 + sigmaT_T ** 2 / 4);
        const dh = (thicknessAbove(p.delay + 1e-6, [...vAbove, vs], upper) - h) / 1e-6;
        const dv = (thicknessAbove(p.delay, [...vAbove, vs * (1 + 1e-6)], upper) - h) / (vs * 1e-6);
        const sigma = Math.hypot(dh * sigmaTd, dv * vsSigma);
        const elevationHere = datum - (upper.reduce((a, b) => a + b, 0) + h);
        depth.push({
          position: p.position,
          depth: elevation(p.position) - elevationHere,
          elevation: elevationHere,
          sigma,
          timeDepth: p.delay,
          phantom: p.phantom,
        });
        thickness.push({ position: p.position, value: h, sigma });
      }
      refractors.push({
        layer,
        method: "delay-time",
        shots: [A, B],
        reciprocalTime: T,
        meanVelocity: vs,
        meanVelocitySigma: vsSigma,
        velocity: depth.map((p) => ({ position: p.position, value: vs, sigma: vsSigma })),
        depth,
        plusMinus: [],
        xy: null,
        notes: [
          ...layerNotes,
          "the two shots' branches on this refractor do not overlap: delay times from one shot per geophone (Barry 1967) with the mean of the two apparent slownesses as its velocity; deeper refractors use its thickness interpolated between the ends",
        ],
      });
      velocities.push(vs);
      velocitySigmas.push(vsSigma);
      thicknessProfiles.push(thickness);
      continue;
    }
    const pm = plusMinusTimes(f, r, T, stations).filter((p) => p.position > A && p.position < B);
    if (pm.length < 2) {
      notes.push(
        `layer ${layer}: fewer than two geophones between ${A} m and ${B} m have both times`,
      );
      break;
    }
    const xs = pm.map((p) => p.position);
    const minusFit = fitSlope(
      xs,
      pm.map((p) => p.minus),
      Math.SQRT2 * sigmaT,
    )!;
    const vn = 2 / minusFit.slope;
    const vnSigma = (2 / minusFit.slope ** 2) * minusFit.slopeError;
    let velocity = localSlopes(
      xs,
      pm.map((p) => p.minus),
      window,
      Math.SQRT2 * sigmaT,
    ).map((s) => ({
      position: s.position,
      value: 2 / s.slope,
      sigma: s.slopeError === null ? null : (2 / s.slope ** 2) * s.slopeError,
    }));

    // Time-depths by the chosen method.
    let timeDepths: { position: number; timeDepth: number; sigma: number; phantom: boolean }[] = [];
    let xyInfo: RefractorSection["xy"] = null;
    const vAbove = velocities.slice();
    const upperAt = (x: number) => thicknessProfiles.map((prof) => profileAt(prof, x) ?? NaN);
    const depthOf = (tG: number, vLocal: number, upper: number[]) =>
      thicknessAbove(tG, [...vAbove, vLocal], upper);
    if (input.method === "plus-minus") {
      timeDepths = pm.map((p) => ({
        position: p.position,
        timeDepth: p.plus / 2,
        sigma: 0.5 * Math.sqrt((p.phantom ? 4 : 2) * sigmaT ** 2 + sigmaT_T ** 2),
        phantom: p.phantom,
      }));
    } else if (input.method === "grm") {
      // two-layer estimate of XY from the plus-minus depths: 2 h tan θ (Palmer 1980)
      const sin = vAbove[vAbove.length - 1] / vn;
      const hMean =
        pm.reduce((a, p) => a + depthOf(p.plus / 2, vn, upperAt(p.position)), 0) / pm.length;
      const tanSum =
        vAbove.reduce((a, v, j) => {
          const s = v / vn;
          const h = j === vAbove.length - 1 ? hMean : (upperAt(A + (B - A) / 2)[j] ?? 0);
          return a + (s < 1 ? 2 * h * (s / Math.sqrt(1 - s * s)) : NaN);
        }, 0) || 0;
      const expected = Number.isFinite(tanSum) && sin < 1 ? tanSum : 0;
      const search = optimumXy(
        f,
        r,
        T,
        vn,
        stations,
        spacing,
        Math.max(2 * expected, 4 * spacing),
        expected,
      );
      const used = input.xy ?? search.optimum;
      xyInfo = { used, expected, candidates: search.candidates };
      const g = grmFunctions(f, r, T, vn, stations, used).filter(
        (p) => p.position > A && p.position < B,
      );
      timeDepths = g.map((p) => ({
        position: p.position,
        timeDepth: p.timeDepth,
        sigma: 0.5 * Math.sqrt((p.phantom ? 4 : 2) * sigmaT ** 2 + sigmaT_T ** 2),
        phantom: p.phantom,
      }));
      if (g.length >= 2) {
        velocity = localSlopes(
          g.map((p) => p.position),
          g.map((p) => p.velocityFunction),
          window,
          sigmaT / Math.SQRT2,
        ).map((s) => ({
          position: s.position,
          value: 1 / s.slope,
          sigma: s.slopeError === null ? null : s.slopeError / s.slope ** 2,
        }));
      }
    } else {
      const d = delayTimes(f, r, T, vn, stations);
      timeDepths = d.map((p) => ({
        position: p.position,
        timeDepth: p.delay,
        sigma: Math.sqrt(((p.phantom ? 2 : 1) * sigmaT ** 2) / p.shots + sigmaT_T ** 2 / 4),
        phantom: p.phantom,
      }));
    }

    const depth: StationDepth[] = [];
    const thickness: { position: number; value: number; sigma: number }[] = [];
    for (const td of timeDepths) {
      const x = td.position;
      const vLocal = profileAt(velocity, x) ?? vn;
      const upper = upperAt(x);
      const h = depthOf(td.timeDepth, vLocal, upper);
      if (!Number.isFinite(h)) continue;
      // first-order error: time-depth, every velocity, every upper thickness
      const d = (fn: () => number, base: number) => fn() - base;
      let variance = 0;
      const stepT = 1e-6;
      variance +=
        ((d(() => depthOf(td.timeDepth + stepT, vLocal, upper), h) / stepT) * td.sigma) ** 2;
      vAbove.forEach((v, j) => {
        const step = v * 1e-6;
        const moved = vAbove.slice();
        moved[j] = v + step;
        const hv = thicknessAbove(td.timeDepth, [...moved, vLocal], upper);
        variance += (((hv - h) / step) * velocitySigmas[j]) ** 2;
      });
      const localSigma = velocity.find((v) => Math.abs(v.position - x) <= SAME)?.sigma ?? vnSigma;
      const stepV = vLocal * 1e-6;
      variance +=
        ((d(() => depthOf(td.timeDepth, vLocal + stepV, upper), h) / stepV) * localSigma) ** 2;
      upper.forEach((u, j) => {
        const moved = upper.slice();
        moved[j] = u + 1e-6;
        const hu = depthOf(td.timeDepth, vLocal, moved);
        const su = thicknessProfiles[j].find((p) => Math.abs(p.position - x) <= SAME)?.sigma ?? 0;
        // the refractor's depth includes the upper thickness itself
        variance += (((hu - h) / 1e-6 + 1) * su) ** 2;
      });
      const below = upper.reduce((a, b) => a + b, 0) + h;
      const refractorElevation = datum - below;
      depth.push({
        position: x,
        depth: elevation(x) - refractorElevation,
        elevation: refractorElevation,
        sigma: Math.sqrt(variance),
        timeDepth: td.timeDepth,
        phantom: td.phantom,
      });
      thickness.push({ position: x, value: h, sigma: Math.sqrt(variance) });
    }
    if (depth.some((p) => p.phantom)) {
      layerNotes.push(
        "phantomed times (from a farther shot on the same side) were used where marked",
      );
    }
    if (depth.some((p) => p.depth < 0)) {
      layerNotes.push(
        "some depths come out above the ground: check the assignment, the datum or the elevations",
      );
    }
    refractors.push({
      layer,
      method: input.method,
      shots: [A, B],
      reciprocalTime: T,
      meanVelocity: vn,
      meanVelocitySigma: vnSigma,
      velocity,
      depth,
      plusMinus: pm.map((p) => ({ position: p.position, plus: p.plus, minus: p.minus })),
      xy: xyInfo,
      notes: layerNotes,
    });
    velocities.push(vn);
    velocitySigmas.push(vnSigma);
    thicknessProfiles.push(thickness);
  }
  if (layers.length === 0) notes.push("no picks are assigned to a refractor (layer 2 or deeper)");
  return {
    method: input.method,
    datum,
    topVelocity: v1,
    topVelocitySigma: top.sigma,
    refractors,
    reciprocal: reciprocalChecks(input.picks, sigmaT, Math.max(2 * spacing, 0.2 * lineLength)),
    notes,
  };
}

/**
 * The interpretation as the command line prints it (and the CSV export carries): refractors
 * with layer, method, velocity along the line and depth under every geophone; reciprocal-time
 * checks. Units: m, m/s, s.
 */
export function interpretationJson(result: LineInterpretation) {
  return {
    refractors: result.refractors.map((r) => ({
      layer: r.layer,
      method: r.method,
      velocity: r.velocity.map((v) => ({ position: v.position, value: v.value })),
      depth: r.depth.map((d) => ({
        position: d.position,
        depth: d.depth,
        elevation: d.elevation,
        sigma: d.sigma,
      })),
    })),
    reciprocal: result.reciprocal.map((c) => ({
      shots: c.shots,
      forward: c.forward,
      reverse: c.reverse,
      difference: c.difference,
    })),
  };
}
