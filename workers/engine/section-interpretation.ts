/**
 * The interpretation a crew would make of a section's modelled first arrivals: on every
 * shot branch, straight lines fitted (least squares) to the direct-wave picks and to each
 * refractor's picks, then the intercept-time method (Telford, Geldart & Sheriff 1990 §4.3;
 * Kearey, Brooks & Hill 2002 ch. 5) for the depths below the shot, as if the ground were
 * flat-layered under it. Segments are assigned to refractors by the ray paths (a crew reads
 * them off slope breaks). The shot's own depth is ignored (surface-shot formulas).
 */
import { interceptTimeMethod, type ObservedLine } from "./interpretation";
import type { SolvedSection } from "./section-arrivals";
import { runsOf, type SectionBranch } from "./section-coverage";
import { surfaceAt, topAt } from "./section-geometry";
import type {
  InterpretedInterface,
  InterpretedPoint,
  SectionInterpretation,
} from "./section-types";

/** Least-squares line t = a + b·x; null with fewer than two distinct x. */
export function fitLine(xs: readonly number[], ts: readonly number[]): ObservedLine | null {
  const n = xs.length;
  if (n < 2) return null;
  let sx = 0;
  let st = 0;
  for (let i = 0; i < n; i++) {
    sx += xs[i];
    st += ts[i];
  }
  const mx = sx / n;
  const mt = st / n;
  let sxx = 0;
  let sxt = 0;
  for (let i = 0; i < n; i++) {
    sxx += (xs[i] - mx) ** 2;
    sxt += (xs[i] - mx) * (ts[i] - mt);
  }
  if (!(sxx > 0)) return null;
  const slowness = sxt / sxx;
  return { intercept: mt - slowness * mx, slowness };
}

/** Direct-wave slowness through the origin (s/m) from offsets and times; NaN with none. */
function directSlowness(xs: readonly number[], ts: readonly number[]): number {
  let sxt = 0;
  let sxx = 0;
  for (let i = 0; i < xs.length; i++) {
    sxt += xs[i] * ts[i];
    sxx += xs[i] * xs[i];
  }
  return sxx > 0 ? sxt / sxx : NaN;
}

/** Intercept-time interpretation under every shot branch of a solved section. */
export function interpretSection(
  solved: SolvedSection,
  branches: readonly SectionBranch[],
  minGeophones: number,
): SectionInterpretation {
  const g = solved.geometry;
  const n = g.layerCount;
  const byShot = new Map(solved.shots.map((s) => [s.shot, s]));
  const points: InterpretedPoint[][] = Array.from({ length: n }, () => []);
  const velocities: number[][] = Array.from({ length: n }, () => []);
  // pooled direct-wave slowness for branches that record no direct wave (off-end shots)
  const pooledX: number[] = [];
  const pooledT: number[] = [];
  const perBranch = branches.map((b) => {
    const shot = byShot.get(b.shot);
    if (!shot) return null;
    const offsets = (ks: readonly number[]) =>
      ks.map((k) => Math.abs(solved.geophoneX[k] - shot.x));
    const times = (ks: readonly number[]) => ks.map((k) => shot.geophoneTimes[k]);
    const direct = runsOf(shot.via, b, 0)[0];
    let p0 = NaN;
    if (direct && direct.first === 0 && direct.geophones.length >= minGeophones) {
      p0 = directSlowness(offsets(direct.geophones), times(direct.geophones));
      pooledX.push(...offsets(direct.geophones));
      pooledT.push(...times(direct.geophones));
    }
    return { b, shot, offsets, times, p0 };
  });
  const pooled = directSlowness(pooledX, pooledT);
  for (const entry of perBranch) {
    if (!entry) continue;
    const { b, shot, offsets, times } = entry;
    const p0 = Number.isFinite(entry.p0) ? entry.p0 : pooled;
    if (!Number.isFinite(p0)) continue;
    const layers: number[] = [];
    const lines: ObservedLine[] = [];
    for (let m = 1; m < n; m++) {
      const runs = runsOf(shot.via, b, m).filter((r) => r.geophones.length >= minGeophones);
      if (runs.length === 0) continue;
      const longest = runs.reduce((a, r) => (r.geophones.length > a.geophones.length ? r : a));
      const line = fitLine(offsets(longest.geophones), times(longest.geophones));
      if (!line || !(line.slowness > 0)) continue;
      layers.push(m);
      lines.push(line);
    }
    if (lines.length === 0) continue;
    const result = interceptTimeMethod(p0, lines);
    const surface = surfaceAt(g, shot.x);
    layers.forEach((m, j) => {
      const depth = result.depths[j];
      if (!Number.isFinite(depth)) return;
      const trueDepth = surface - topAt(g, m, shot.x);
      points[m].push({
        shot: b.shot,
        side: b.side,
        position: shot.x,
        depth,
        elevation: surface - depth,
        trueDepth,
        error: depth - trueDepth,
      });
      velocities[m].push(result.velocities[j + 1]);
    });
  }
  const interfaces: InterpretedInterface[] = [];
  let worst: SectionInterpretation["worst"] = null;
  for (let m = 1; m < n; m++) {
    if (points[m].length === 0) continue;
    const v = velocities[m].reduce((a, b) => a + b, 0) / velocities[m].length;
    interfaces.push({ layer: m + 1, velocity: v, points: points[m] });
    for (const p of points[m]) {
      if (!worst || Math.abs(p.error) > Math.abs(worst.error)) {
        worst = { layer: m + 1, position: p.position, error: p.error };
      }
    }
  }
  return { method: "intercept-time", interfaces, worst };
}
