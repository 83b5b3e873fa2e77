/**
 * The ray path of the first arrival between a shot and a geophone, for drawing the Section.
 */
import { layoutExtent } from "./branches";
import { checkedEarth } from "./geometry";
import { criticalRay, traceDown } from "./dipping";
import { prepareEarth, linesFor } from "./head-waves";
import { createLineSet } from "./lines";
import type { GroundModel } from "./plan-schema";
import { createPieces, firstArrivalPieces, pieceAt } from "./segments";
import type { ArrivalKind } from "./arrivals";

/** A ray path as a polyline of [position m, depth m] points, with the arrival it belongs to. */
export type RayPath = ArrivalKind & {
  /** Travel time, s. */
  time: number;
  /** Polyline from the shot to the geophone, [position, depth] in metres (depth downwards). */
  points: [number, number][];
};

/**
 * Ray path of the first arrival from a shot at `shotPosition` to a geophone at
 * `geophonePosition` (m). The direct wave runs along the surface; a head wave goes down at
 * the critical angles (Snell's law at each planar interface, exact for dipping interfaces),
 * along the refractor and back up. Throws RangeError when the interfaces cross between the
 * two positions.
 */
export function firstArrivalRayPath(
  model: Pick<GroundModel, "layers">,
  shotPosition: number,
  geophonePosition: number,
): RayPath {
  if (!Number.isFinite(shotPosition) || !Number.isFinite(geophonePosition)) {
    throw new RangeError("shot and geophone positions must be finite numbers");
  }
  const extent = layoutExtent({
    spacing: 1,
    channels: 1,
    firstGeophone: geophonePosition,
    shots: [shotPosition],
  });
  const earth = checkedEarth(model, extent.from, extent.to);
  const n = earth.layerCount;
  const sign: 1 | -1 = geophonePosition >= shotPosition ? 1 : -1;
  const offset = Math.abs(geophonePosition - shotPosition);
  const prep = prepareEarth(earth);
  const lines = linesFor(prep, shotPosition, sign, createLineSet(n));
  const pieces = firstArrivalPieces(lines, n, createPieces(n));
  const piece = offset === 0 ? -1 : pieceAt(pieces, offset);
  const m = piece < 0 ? 0 : pieces.arrival[piece];
  const time = lines.intercept[m] + lines.slowness[m] * offset;
  if (m === 0) {
    return {
      kind: "direct",
      time,
      points: [
        [shotPosition, 0],
        [geophonePosition, 0],
      ],
    };
  }
  const ray = criticalRay(earth, m, sign, true);
  const down: [number, number][] = [[shotPosition, 0]];
  const up: [number, number][] = [[geophonePosition, 0]];
  const scratch = new Float64Array(3);
  traceDown(earth, ray.down, m, shotPosition, scratch, down);
  traceDown(earth, ray.back, m, geophonePosition, scratch, up);
  return { kind: "head", layer: m + 1, time, points: [...down, ...up.reverse()] };
}
