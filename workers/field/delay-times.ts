/**
 * Delay times (Gardner 1939; Barry 1967, Geophysical Prospecting 15): every head-wave time is
 * the sum of a delay at the shot, a delay at the geophone and the distance over the refractor
 * velocity, t_SX = δ_S + δ_X + |x − s| / v. With the refractor velocity assumed (here: from the
 * minus times) and each shot's delay known, every shot gives the geophone's delay
 * δ_X = t_SX − |x − s|/v − δ_S, and the delays of all shots covering the geophone are averaged;
 * unlike the plus-minus method a geophone covered by one shot only still gets a delay.
 * A shot's delay comes from its reversed pair: δ_A + δ_B = T − |B − A|/v, split as the
 * two-shot station delays extended to the shots suggest (else equally). Positions m, times s.
 */
import { branchTimeAt, type Branch } from "./branch-times";

/** A geophone's delay time. */
export interface DelayPoint {
  /** m */
  position: number;
  /** Delay time, s. */
  delay: number;
  /** Shots that gave it. */
  shots: number;
  phantom: boolean;
}

/**
 * Shot delays of a reversed pair, s: δ_A + δ_B = T − |B − A|/v, shared in the ratio of the
 * two-shot station delays (t_f + t_r − T)/2 extended linearly to each shot (a straight line
 * through the overlap's stations; exact for a planar refractor), else equally.
 */
export function shotDelays(
  forward: Branch,
  reverse: Branch,
  reciprocal: number,
  velocity: number,
): [number, number] {
  const total = reciprocal - Math.abs(reverse.shot - forward.shot) / velocity;
  const xs: number[] = [];
  const ds: number[] = [];
  for (const p of forward.points) {
    if (!(p.position > forward.shot && p.position < reverse.shot)) continue;
    const r = branchTimeAt(reverse, p.position);
    if (!r) continue;
    xs.push(p.position);
    ds.push((p.time + r.time - reciprocal) / 2);
  }
  if (xs.length >= 2) {
    const n = xs.length;
    const mx = xs.reduce((a, b) => a + b, 0) / n;
    const md = ds.reduce((a, b) => a + b, 0) / n;
    let sxx = 0;
    let sxd = 0;
    xs.forEach((x, i) => {
      sxx += (x - mx) ** 2;
      sxd += (x - mx) * (ds[i] - md);
    });
    const slope = sxx > 0 ? sxd / sxx : 0;
    const da = md + slope * (forward.shot - mx);
    const db = md + slope * (reverse.shot - mx);
    if (da > 0 && db > 0) return [(total * da) / (da + db), (total * db) / (da + db)];
  }
  // No overlap: each branch's straight-line intercept at its own shot is twice its delay there
  // (a planar refractor; Telford et al. 1990 §4.3.3).
  const atShot = (b: Branch) => {
    if (b.points.length < 2) return null;
    const n = b.points.length;
    const mx = b.points.reduce((a, p) => a + p.position, 0) / n;
    const mt = b.points.reduce((a, p) => a + p.time, 0) / n;
    let sxx = 0;
    let sxt = 0;
    for (const p of b.points) {
      sxx += (p.position - mx) ** 2;
      sxt += (p.position - mx) * (p.time - mt);
    }
    return sxx > 0 ? (mt + (sxt / sxx) * (b.shot - mx)) / 2 : null;
  };
  const ia = atShot(forward);
  const ib = atShot(reverse);
  if (ia !== null && ib !== null && ia > 0 && ib > 0) {
    return [(total * ia) / (ia + ib), (total * ib) / (ia + ib)];
  }
  return [total / 2, total / 2];
}

/** Delay times at the stations covered by either branch (picks or interpolations). */
export function delayTimes(
  forward: Branch,
  reverse: Branch,
  reciprocal: number,
  velocity: number,
  stations: readonly number[],
): DelayPoint[] {
  const [da, db] = shotDelays(forward, reverse, reciprocal, velocity);
  const out: DelayPoint[] = [];
  for (const x of stations) {
    const values: number[] = [];
    let phantom = false;
    const f = branchTimeAt(forward, x);
    if (f) {
      values.push(f.time - Math.abs(x - forward.shot) / velocity - da);
      phantom ||= f.phantom;
    }
    const r = branchTimeAt(reverse, x);
    if (r) {
      values.push(r.time - Math.abs(x - reverse.shot) / velocity - db);
      phantom ||= r.phantom;
    }
    if (values.length === 0) continue;
    out.push({
      position: x,
      delay: values.reduce((a, b) => a + b, 0) / values.length,
      shots: values.length,
      phantom,
    });
  }
  return out;
}
