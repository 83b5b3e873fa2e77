/**
 * From a time-depth (delay time) under a station to the thickness of the layer just above the
 * refractor, layer by layer (Palmer 1980; Telford, Geldart & Sheriff 1990 §4.3 for the flat
 * recursion): with velocities v_1 … v_n (v_n the refractor's) and the thicknesses h_1 … h_{n−2}
 * of the layers above under the same station,
 *   t_G = Σ_{j<n} h_j cos θ_jn / v_j,  sin θ_jn = v_j / v_n,
 * so h_{n−1} = (t_G − Σ_{j<n−1} h_j cos θ_jn / v_j) · v_{n−1} / cos θ_{n−1,n}.
 * For two layers h = t_G v_1 v_2 / √(v_2² − v_1²). Thickness in m, times s, velocities m/s.
 */

/**
 * Thickness of the layer just above the refractor, m; NaN when a layer above is not slower
 * than the refractor.
 * @param timeDepth t_G, s
 * @param velocities v_1 … v_n (the last is the refractor's), m/s
 * @param upper thicknesses h_1 … h_{n−2}, m
 */
export function thicknessAbove(
  timeDepth: number,
  velocities: readonly number[],
  upper: readonly number[],
): number {
  const n = velocities.length;
  const vn = velocities[n - 1];
  let t = timeDepth;
  for (let j = 0; j < n - 2; j++) {
    const s = velocities[j] / vn;
    if (!(s < 1)) return NaN;
    t -= (upper[j] * Math.sqrt(1 - s * s)) / velocities[j];
  }
  const s = velocities[n - 2] / vn;
  if (!(s < 1)) return NaN;
  return (t * velocities[n - 2]) / Math.sqrt(1 - s * s);
}
