/**
 * The generalized reciprocal method (Palmer 1980, "The generalized reciprocal method of seismic
 * refraction interpretation", SEG; Palmer 1981, Geophysics 46). For a station G midway between
 * geophones X and Y (XY apart), with the forward branch t_f from a shot at A and the reverse
 * branch t_r from a shot at B and their reciprocal time T:
 *   velocity analysis function t_V(G) = [t_f(Y) − t_r(X) + T] / 2, slope 1/v_n;
 *   time-depth               t_G(G) = [t_f(Y) + t_r(X) − (T + XY/v_n)] / 2.
 * XY = 0 reduces to the plus-minus method (t_G = t⁺/2). At the optimum XY the forward and
 * reverse rays leave the refractor at about the same point, so the velocity analysis function
 * is the simplest (least rough); the two-layer estimate is XY = 2 h tan θ_c (Palmer 1980).
 * Positions m, times s, velocities m/s.
 */
import { branchTimeAt, type Branch } from "./branch-times";

/** GRM functions at one station. */
export interface GrmPoint {
  /** m */
  position: number;
  /** Velocity analysis function, s. */
  velocityFunction: number;
  /** Time-depth, s. */
  timeDepth: number;
  phantom: boolean;
}

/** The velocity analysis function and time-depth at the stations where X and Y have times. */
export function grmFunctions(
  forward: Branch,
  reverse: Branch,
  reciprocal: number,
  refractorVelocity: number,
  stations: readonly number[],
  xy: number,
): GrmPoint[] {
  const out: GrmPoint[] = [];
  for (const g of stations) {
    const f = branchTimeAt(forward, g + xy / 2);
    const r = branchTimeAt(reverse, g - xy / 2);
    if (!f || !r) continue;
    out.push({
      position: g,
      velocityFunction: (f.time - r.time + reciprocal) / 2,
      timeDepth: (f.time + r.time - (reciprocal + xy / refractorVelocity)) / 2,
      phantom: f.phantom || r.phantom,
    });
  }
  return out;
}

/** Roughness of a function along the line: RMS of each value's departure from the straight
 * line through its two neighbours, s. Null with fewer than 3 values. */
export function roughness(points: readonly { position: number; value: number }[]): number | null {
  if (points.length < 3) return null;
  let sum = 0;
  for (let i = 1; i < points.length - 1; i++) {
    const a = points[i - 1];
    const b = points[i];
    const c = points[i + 1];
    const between =
      a.value + ((c.value - a.value) * (b.position - a.position)) / (c.position - a.position);
    sum += (b.value - between) ** 2;
  }
  return Math.sqrt(sum / (points.length - 2));
}

/** One XY tried by the search. */
export interface XyCandidate {
  /** m */
  xy: number;
  /** Roughness of the velocity analysis function, s (null when too few stations). */
  roughness: number | null;
  /** Stations where the functions exist. */
  stations: number;
}

/**
 * Tries XY = 0, Δ, 2Δ, … up to `maxXy` (Δ the station spacing) and returns every candidate and
 * the optimum: the least rough velocity analysis function among those keeping at least half
 * the stations of XY = 0; among candidates within 5 % of that roughness (or within one
 * microsecond, on noise-free data) the one nearest `expected` (the two-layer estimate) wins.
 */
export function optimumXy(
  forward: Branch,
  reverse: Branch,
  reciprocal: number,
  refractorVelocity: number,
  stations: readonly number[],
  spacing: number,
  maxXy: number,
  expected: number,
): { optimum: number; candidates: XyCandidate[] } {
  const candidates: XyCandidate[] = [];
  const steps = Math.max(0, Math.floor(maxXy / spacing + 1e-9));
  for (let k = 0; k <= steps; k++) {
    const xy = k * spacing;
    const pts = grmFunctions(forward, reverse, reciprocal, refractorVelocity, stations, xy);
    candidates.push({
      xy,
      roughness: roughness(pts.map((p) => ({ position: p.position, value: p.velocityFunction }))),
      stations: pts.length,
    });
  }
  const base = candidates[0]?.stations ?? 0;
  const usable = candidates.filter((c) => c.roughness !== null && c.stations >= base / 2);
  if (usable.length === 0) return { optimum: 0, candidates };
  const least = Math.min(...usable.map((c) => c.roughness as number));
  const near = usable.filter(
    (c) => (c.roughness as number) <= Math.max(least * 1.05, least + 1e-6),
  );
  near.sort((a, b) => Math.abs(a.xy - expected) - Math.abs(b.xy - expected));
  return { optimum: near[0].xy, candidates };
}
