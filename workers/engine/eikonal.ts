/**
 * First-arrival times on a 2-D grid: the eikonal equation |∇T| = s(x, z) solved with the
 * local finite-difference stencils of Podvin & Lecomte (1991, "Finite difference computation
 * of traveltimes in very contrasted velocity models: a massively parallel approach and its
 * associated tools", Geophys. J. Int. 105, 271–284), visited in fast-marching order
 * (Sethian 1996, "A fast marching level set method for monotonically advancing fronts",
 * PNAS 93, 1591–1595).
 *
 * Slowness is constant in each cell; times live at the nodes. A node M receives, from each
 * of its four cells: a plane wave transmitted through each of the two cell edges not
 * touching M (Huygens' principle across the edge, valid when the ray hits M from inside
 * the edge), the wave diffracted from the opposite corner, and a head wave along each edge
 * touching M travelling at the smaller slowness of the two cells that share that edge.
 * That last stencil is what carries critically refracted waves along an interface that
 * lies on a row of nodes. Every stencil is causal (the new time is not earlier than the
 * times it uses), so one pass in order of increasing time suffices; a stencil is evaluated
 * when the last of its nodes is accepted.
 */

/** A grid for the solver: nodes nx × nz, spacing h (m), slowness per cell (s/m). */
export interface EikonalGrid {
  readonly nx: number;
  readonly nz: number;
  readonly h: number;
  /** Slowness of cell (i, j) at j·(nx−1) + i, s/m; Infinity where no wave may enter. */
  readonly slowness: Float64Array;
}

const TRIAL = 1;
const DONE = 2;

/** A binary min-heap of node indices keyed by time, with decrease-key. */
class NodeHeap {
  private readonly items: Int32Array;
  private readonly pos: Int32Array;
  private size = 0;
  constructor(
    capacity: number,
    private readonly key: Float64Array,
  ) {
    this.items = new Int32Array(capacity);
    this.pos = new Int32Array(capacity).fill(-1);
  }
  get length(): number {
    return this.size;
  }
  push(node: number): void {
    const p = this.pos[node];
    if (p >= 0) {
      this.up(p);
      return;
    }
    this.items[this.size] = node;
    this.pos[node] = this.size;
    this.up(this.size++);
  }
  pop(): number {
    const top = this.items[0];
    this.pos[top] = -1;
    const last = this.items[--this.size];
    if (this.size > 0) {
      this.items[0] = last;
      this.pos[last] = 0;
      this.down(0);
    }
    return top;
  }
  private up(i: number): void {
    const { items, pos, key } = this;
    const node = items[i];
    const t = key[node];
    while (i > 0) {
      const parent = (i - 1) >> 1;
      const pn = items[parent];
      if (key[pn] <= t) break;
      items[i] = pn;
      pos[pn] = i;
      i = parent;
    }
    items[i] = node;
    pos[node] = i;
  }
  private down(i: number): void {
    const { items, pos, key } = this;
    const n = this.size;
    const node = items[i];
    const t = key[node];
    for (;;) {
      let child = 2 * i + 1;
      if (child >= n) break;
      if (child + 1 < n && key[items[child + 1]] < key[items[child]]) child++;
      const cn = items[child];
      if (key[cn] >= t) break;
      items[i] = cn;
      pos[cn] = i;
      i = child;
    }
    items[i] = node;
    pos[node] = i;
  }
}

/**
 * Solve for first-arrival times (s) at every node, starting from `initial` times (s;
 * Infinity where unknown, e.g. analytic times around the source). Returns a new array;
 * unreachable nodes stay Infinity. Throws RangeError for a malformed grid.
 */
export function solveEikonal(grid: EikonalGrid, initial: Float64Array): Float64Array {
  const { nx, nz, h, slowness } = grid;
  const cx = nx - 1;
  const cz = nz - 1;
  if (!(nx >= 2 && nz >= 2 && h > 0) || slowness.length !== cx * cz) {
    throw new RangeError("eikonal grid needs nx, nz ≥ 2, h > 0 and one slowness per cell");
  }
  if (initial.length !== nx * nz) throw new RangeError("one initial time per node");
  const T = Float64Array.from(initial);
  const state = new Uint8Array(nx * nz);
  const heap = new NodeHeap(nx * nz, T);
  for (let k = 0; k < T.length; k++) {
    if (Number.isFinite(T[k])) {
      state[k] = TRIAL;
      heap.push(k);
    }
  }
  // slowness with a border of Infinity, so that cells off the grid need no test
  const px = cx + 2;
  const padded = new Float64Array(px * (cz + 2)).fill(Infinity);
  for (let j = 0; j < cz; j++)
    padded.set(slowness.subarray(j * cx, (j + 1) * cx), (j + 1) * px + 1);
  const cell = (i: number, j: number): number => padded[(j + 1) * px + i + 1];
  const SQRT2 = Math.SQRT2;
  const INV_SQRT2 = Math.SQRT1_2;

  const offer = (node: number, t: number): void => {
    if (t < T[node]) {
      T[node] = t;
      state[node] = TRIAL;
      heap.push(node);
    }
  };

  // plane wave through a cell edge (a: endpoint adjacent to M, d: the far corner); the
  // ray reaches M through the edge when the wave came from d's side: 0 ≤ ta − td ≤ hs/√2
  const transmit = (ta: number, td: number, s: number): number => {
    const dt = ta - td;
    const hs = h * s;
    if (dt < 0 || dt > hs * INV_SQRT2) return Infinity;
    return ta + Math.sqrt(hs * hs - dt * dt);
  };

  while (heap.length > 0) {
    const x = heap.pop();
    state[x] = DONE;
    const xi = x % nx;
    const xj = (x - xi) / nx;
    const tx = T[x];
    for (let dj = -1; dj <= 1; dj++) {
      const nj = xj + dj;
      if (nj < 0 || nj >= nz) continue;
      for (let di = -1; di <= 1; di++) {
        if (di === 0 && dj === 0) continue;
        const ni = xi + di;
        if (ni < 0 || ni >= nx) continue;
        const nnode = nj * nx + ni;
        if (state[nnode] === DONE) continue;
        if (di !== 0 && dj !== 0) {
          // X is the far corner of the cell between N and X
          const ci = Math.min(ni, xi);
          const cj = Math.min(nj, xj);
          const s = cell(ci, cj);
          if (s === Infinity) continue;
          let best = tx + SQRT2 * h * s;
          const a = nj * nx + xi; // N's horizontal neighbour in that cell
          const b = xj * nx + ni; // N's vertical neighbour
          if (state[a] === DONE) best = Math.min(best, transmit(T[a], tx, s));
          if (state[b] === DONE) best = Math.min(best, transmit(T[b], tx, s));
          offer(nnode, best);
        } else if (dj === 0) {
          // horizontal edge neighbour: head wave along the edge, transmission with X as
          // the adjacent endpoint (far corner above or below)
          const ci = Math.min(ni, xi);
          const sUp = cell(ci, nj - 1);
          const sDown = cell(ci, nj);
          const sEdge = Math.min(sUp, sDown);
          if (sEdge === Infinity) continue;
          let best = tx + h * sEdge;
          if (nj > 0) {
            const d = (nj - 1) * nx + xi;
            if (state[d] === DONE && sUp !== Infinity)
              best = Math.min(best, transmit(tx, T[d], sUp));
          }
          if (nj < nz - 1) {
            const d = (nj + 1) * nx + xi;
            if (state[d] === DONE && sDown !== Infinity)
              best = Math.min(best, transmit(tx, T[d], sDown));
          }
          offer(nnode, best);
        } else {
          // vertical edge neighbour
          const cj = Math.min(nj, xj);
          const sLeft = cell(ni - 1, cj);
          const sRight = cell(ni, cj);
          const sEdge = Math.min(sLeft, sRight);
          if (sEdge === Infinity) continue;
          let best = tx + h * sEdge;
          if (ni > 0) {
            const d = xj * nx + ni - 1;
            if (state[d] === DONE && sLeft !== Infinity)
              best = Math.min(best, transmit(tx, T[d], sLeft));
          }
          if (ni < nx - 1) {
            const d = xj * nx + ni + 1;
            if (state[d] === DONE && sRight !== Infinity)
              best = Math.min(best, transmit(tx, T[d], sRight));
          }
          offer(nnode, best);
        }
      }
    }
  }
  return T;
}
