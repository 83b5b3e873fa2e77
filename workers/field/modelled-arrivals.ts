/**
 * The modelled first arrival of a ground model for any shot and geophone position, from the
 * engine (`sampleCurves` at one offset), in the form the field-check maths take.
 */
import { sampleCurves, type GroundModel } from "@engine";
import type { FirstArrivalFn } from "./field-picks";

/**
 * A `FirstArrivalFn` for one model: first-arrival time, s, from a shot at `sourcePosition` to a
 * geophone at `receiverPosition` (m). Returns NaN where the engine gives no time (e.g. the
 * model's interfaces cross between the two positions). Results are cached per position pair.
 */
export function modelFirstArrival(model: Pick<GroundModel, "layers">): FirstArrivalFn {
  const cache = new Map<string, number>();
  return (sourcePosition, receiverPosition) => {
    const key = `${sourcePosition}|${receiverPosition}`;
    const hit = cache.get(key);
    if (hit !== undefined) return hit;
    const offset = receiverPosition - sourcePosition;
    let time = Number.NaN;
    try {
      const curves = sampleCurves(model, sourcePosition, offset, offset, 1, {
        reflections: false,
      });
      time = curves.first.times[0];
    } catch {
      time = Number.NaN;
    }
    cache.set(key, time);
    return time;
  };
}
