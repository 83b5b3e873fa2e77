/**
 * Ticks of a velocity colour bar (the Section's legend). The bar is shaded on a log scale from
 * the slowest to the fastest velocity drawn (every layer, the half-space included), so its
 * ticks are placed on the same log scale. Pure.
 */
import { scaleLog } from "d3-scale";
import { toDisplay, type UnitSystem } from "@/lib/units";

export interface VelocityTick {
  /** Place along the bar, 0 (slowest) to 1 (fastest). */
  at: number;
  /** The velocity in the user's unit, as written under the bar. */
  label: string;
}

const grouped = new Intl.NumberFormat("en-GB", { maximumFractionDigits: 0 });

/** 0 for 1·10ⁿ, 1 for 2·10ⁿ and 5·10ⁿ, 2 for other round values: rounder values win a place. */
function roundness(v: number): number {
  const mantissa = Math.round(v / 10 ** Math.floor(Math.log10(v) + 1e-9));
  return mantissa === 1 ? 0 : mantissa === 2 || mantissa === 5 ? 1 : 2;
}

/**
 * Ticks for a colour bar shaded on a log scale from `vLo` to `vHi` (m/s): both ends always
 * labelled with the velocities drawn (rounded to a whole m/s or ft/s), up to three round
 * values between them (the roundest first), none closer than `gap` (fraction of the bar) to another.
 * One tick in the middle when the velocities are equal.
 */
export function velocityLegendTicks(
  vLo: number,
  vHi: number,
  units: UnitSystem,
  gap = 0.16,
): VelocityTick[] {
  if (!(vLo > 0 && vHi > 0 && Number.isFinite(vLo) && Number.isFinite(vHi)))
    throw new RangeError("velocity legend: velocities must be positive and finite");
  const lo = toDisplay("velocity", Math.min(vLo, vHi), units);
  const hi = toDisplay("velocity", Math.max(vLo, vHi), units);
  // Written as the layers' labels write velocities ("3,300 m/s"): whole, with thousands grouped.
  const end = (v: number) => grouped.format(Math.round(v));
  if (end(lo) === end(hi)) return [{ at: 0.5, label: end(lo) }];
  const at = (v: number) => Math.log(v / lo) / Math.log(hi / lo);
  const kept: VelocityTick[] = [
    { at: 0, label: end(lo) },
    { at: 1, label: end(hi) },
  ];
  const inner = scaleLog()
    .domain([lo, hi])
    .ticks(8)
    .filter((v) => v > lo && v < hi)
    .sort((a, b) => roundness(a) - roundness(b) || a - b);
  for (const v of inner) {
    if (kept.length >= 5) break; // three values between the ends at most: a bar, not a ruler
    const t = at(v);
    if (kept.every((k) => Math.abs(k.at - t) >= gap))
      kept.push({ at: t, label: grouped.format(v) });
  }
  return kept.sort((a, b) => a.at - b.at);
}
