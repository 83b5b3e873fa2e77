/**
 * The plus-minus method (Hagedoorn 1959, Geophysical Prospecting 7): with the forward branch
 * t_f(x) of a shot at A, the reverse branch t_r(x) of a shot at B (both along the same
 * refractor) and their reciprocal time T = t_f(B) = t_r(A),
 *   plus time  t⁺(x) = t_f(x) + t_r(x) − T = 2·(delay time under x),
 *   minus time t⁻(x) = t_f(x) − t_r(x), whose slope against x is 2/v (refractor velocity).
 * For a planar refractor t⁺ = 2 h⊥ cos θ_c / v_1 exactly (h⊥ the depth normal to the
 * refractor under x). Positions m, times s.
 */
import { branchTimeAt, type Branch } from "./branch-times";

/** Plus and minus times at one geophone. */
export interface PlusMinusPoint {
  /** m */
  position: number;
  /** s */
  plus: number;
  /** s */
  minus: number;
  /** True when either time is phantomed from another shot. */
  phantom: boolean;
}

/**
 * Plus and minus times at the stations between the two shots where both branches have a time
 * (a pick or an interpolation between picks, never an extrapolation).
 */
export function plusMinusTimes(
  forward: Branch,
  reverse: Branch,
  reciprocal: number,
  stations: readonly number[],
): PlusMinusPoint[] {
  const out: PlusMinusPoint[] = [];
  for (const x of stations) {
    const f = branchTimeAt(forward, x);
    const r = branchTimeAt(reverse, x);
    if (!f || !r) continue;
    out.push({
      position: x,
      plus: f.time + r.time - reciprocal,
      minus: f.time - r.time,
      phantom: f.phantom || r.phantom,
    });
  }
  return out;
}
