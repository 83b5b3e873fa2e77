/** Small numeric helpers shared by the engine modules. */

/** The value itself when finite, otherwise null (output JSON never holds NaN or Infinity). */
export function finiteOrNull(value: number): number | null {
  return Number.isFinite(value) ? value : null;
}

/** √(1 − r²) computed as √((1 − r)(1 + r)), accurate when r is close to 1. */
export function cosFromSin(r: number): number {
  return Math.sqrt(Math.max(0, (1 - r) * (1 + r)));
}

/** Degrees to radians. */
export function radians(degrees: number): number {
  return (degrees * Math.PI) / 180;
}

/** Radians to degrees. */
export function degrees(rad: number): number {
  return (rad * 180) / Math.PI;
}
