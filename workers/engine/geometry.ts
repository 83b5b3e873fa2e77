/**
 * The ground model in numeric form ("earth") and the geometry of its planar interfaces.
 *
 * Convention (see plan-schema.ts): layers are numbered 0..n−1 internally (layer number
 * 1..n in every output). Interface k (k = 1..n−1) is the base of layer k−1 and the top of
 * layer k. Its depth below the flat surface at position x (m along the line) is
 * `depthAtZero[k] + x · slope[k]`, where `depthAtZero[k]` is the sum of the vertical
 * thicknesses of layers 0..k−1 at position 0 and `slope[k] = tan(dip of the base of layer k−1)`
 * (positive when the interface deepens towards increasing position). Index 0 stands for the
 * surface itself (depth 0, slope 0).
 */
import type { GroundModel } from "./plan-schema";
import { radians } from "./numbers";

/** Numeric ground model used by every computation. Never mutated after creation. */
export interface Earth {
  /** Number of layers n (the last is a half-space). */
  readonly layerCount: number;
  /** P-wave velocity per layer, m/s. */
  readonly velocity: Float64Array;
  /** Depth of interface k at position 0, m (index 0 = surface = 0). */
  readonly depthAtZero: Float64Array;
  /** tan(dip) of interface k (index 0 = surface = 0). */
  readonly slope: Float64Array;
  /** True when any interface dips. */
  readonly dipping: boolean;
}

/**
 * Build the numeric earth from a ground model. Throws RangeError for values the schema
 * forbids (non-finite or non-positive velocity or thickness, missing thickness above the
 * half-space, |dip| ≥ 90°), so that unvalidated input never yields NaN.
 */
export function earthFromModel(model: Pick<GroundModel, "layers">): Earth {
  const n = model.layers.length;
  if (n < 1) throw new RangeError("a ground model needs at least one layer");
  const velocity = new Float64Array(n);
  const depthAtZero = new Float64Array(n);
  const slope = new Float64Array(n);
  let depth = 0;
  let dipping = false;
  model.layers.forEach((layer, i) => {
    const v = layer.velocity;
    if (!(Number.isFinite(v) && v > 0)) {
      throw new RangeError(`layer ${i + 1}: velocity must be a finite number > 0`);
    }
    velocity[i] = v;
    if (i < n - 1) {
      const h = layer.thickness;
      if (typeof h !== "number" || !(Number.isFinite(h) && h > 0)) {
        throw new RangeError(`layer ${i + 1}: thickness must be a finite number > 0`);
      }
      const dip = layer.dip ?? 0;
      if (!(Number.isFinite(dip) && Math.abs(dip) < 90)) {
        throw new RangeError(`layer ${i + 1}: dip must be a finite angle below 90 degrees`);
      }
      depth += h;
      depthAtZero[i + 1] = depth;
      slope[i + 1] = dip === 0 ? 0 : Math.tan(radians(dip));
      if (dip !== 0) dipping = true;
    }
  });
  return { layerCount: n, velocity, depthAtZero, slope, dipping };
}

/** Depth of interface k (1..n−1; 0 = surface) at position x, m. */
export function interfaceDepth(earth: Earth, k: number, x: number): number {
  return earth.depthAtZero[k] + x * earth.slope[k];
}

/**
 * A copy of the earth with layer `layer` (0-based) given a new vertical thickness at
 * position 0 (m); every interface below it moves by the same amount.
 */
export function withThickness(earth: Earth, layer: number, thickness: number): Earth {
  if (layer < 0 || layer >= earth.layerCount - 1) {
    throw new RangeError(`layer ${layer + 1} has no thickness (the last layer is a half-space)`);
  }
  if (!(Number.isFinite(thickness) && thickness > 0)) {
    throw new RangeError("thickness must be a finite number > 0");
  }
  const depthAtZero = Float64Array.from(earth.depthAtZero);
  const shift = thickness - (earth.depthAtZero[layer + 1] - earth.depthAtZero[layer]);
  for (let k = layer + 1; k < earth.layerCount; k++) depthAtZero[k] += shift;
  return { ...earth, depthAtZero };
}

/** A copy of the earth with layer `layer` (0-based) given a new velocity, m/s. */
export function withVelocity(earth: Earth, layer: number, velocity: number): Earth {
  if (layer < 0 || layer >= earth.layerCount) throw new RangeError(`no layer ${layer + 1}`);
  if (!(Number.isFinite(velocity) && velocity > 0)) {
    throw new RangeError("velocity must be a finite number > 0");
  }
  const v = Float64Array.from(earth.velocity);
  v[layer] = velocity;
  return { ...earth, velocity: v };
}

/** Where two interfaces (or an interface and the surface) meet inside an extent. */
export interface InterfaceProblem {
  /** 0-based index of the layer whose base is at fault. */
  layer: number;
  /** "surface": the base reaches the surface; "crosses": it meets the base of the layer above. */
  problem: "surface" | "crosses";
}

/**
 * Check that every interface stays strictly below the one above it (and below the surface)
 * over the positions [from, to] m. Interfaces are planar, so checking both ends suffices.
 * Returns the first problem found, or null when the geometry is sound.
 */
export function findInterfaceProblem(
  earth: Earth,
  from: number,
  to: number,
): InterfaceProblem | null {
  for (let k = 1; k < earth.layerCount; k++) {
    for (const x of [from, to]) {
      const below = interfaceDepth(earth, k, x);
      const above = k === 1 ? 0 : interfaceDepth(earth, k - 1, x);
      if (!(below > above)) return { layer: k - 1, problem: k === 1 ? "surface" : "crosses" };
    }
  }
  return null;
}

/** Human-readable message for an interface problem (layer numbers 1-based). */
export function describeInterfaceProblem(p: InterfaceProblem, from: number, to: number): string {
  const where = `within the spread and shots (${from} m to ${to} m)`;
  return p.problem === "surface"
    ? `the base of layer ${p.layer + 1} reaches the surface ${where}`
    : `the base of layer ${p.layer + 1} meets or crosses the base of layer ${p.layer} ${where}`;
}

/**
 * Build the earth and check its interfaces over [from, to] m; throws RangeError naming the
 * layer when an interface reaches the surface or crosses the one above.
 */
export function checkedEarth(model: Pick<GroundModel, "layers">, from: number, to: number): Earth {
  const earth = earthFromModel(model);
  const problem = findInterfaceProblem(earth, from, to);
  if (problem) throw new RangeError(describeInterfaceProblem(problem, from, to));
  return earth;
}
