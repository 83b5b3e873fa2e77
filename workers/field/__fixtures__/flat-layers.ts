/**
 * Flat-layer first arrivals for the tests, written from the closed forms in Telford, Geldart &
 * Sheriff (1990) §4.3 (direct wave x/v1; head wave along layer n for x ≥ x_crit,n:
 * x/v_n + Σ_{i<n} 2 h_i cos θ_in / v_i, existing only when v_n exceeds every velocity above).
 */
export interface TestLayer {
  velocity: number;
  /** m; omitted for the half-space */
  thickness?: number;
}

export function interceptTime(layers: TestLayer[], n: number): number {
  let t = 0;
  for (let i = 0; i < n; i++) {
    const cos = Math.sqrt(1 - (layers[i].velocity / layers[n].velocity) ** 2);
    t += (2 * (layers[i].thickness ?? 0) * cos) / layers[i].velocity;
  }
  return t;
}

export function firstArrival(layers: TestLayer[]): (source: number, receiver: number) => number {
  return (source, receiver) => {
    const x = Math.abs(receiver - source);
    let best = x / layers[0].velocity;
    for (let n = 1; n < layers.length; n++) {
      if (!layers.slice(0, n).every((l) => l.velocity < layers[n].velocity)) continue;
      let xc = 0;
      for (let i = 0; i < n; i++) {
        const s = layers[i].velocity / layers[n].velocity;
        xc += (2 * (layers[i].thickness ?? 0) * s) / Math.sqrt(1 - s * s);
      }
      if (x >= xc) best = Math.min(best, x / layers[n].velocity + interceptTime(layers, n));
    }
    return best;
  };
}
