/**
 * A section model's first arrivals in the shape Side by side overlays (the layered models'
 * sampled curves): the modelled geophone times of one shot, joined through the shot point.
 * Pure; the times come from the section analysis (the 2-D modeller), nothing is recomputed.
 */
import type { ArrivalCurves, SectionModelAnalysis, ShotArrivals } from "@engine";

/** Curves and arrivals of shot `shot` (0-based) of a section analysis, for the overlay. */
export function sectionOverlayData(
  analysis: SectionModelAnalysis,
  shot: number,
): { curves: ArrivalCurves; arrivals: ShotArrivals } {
  const record = analysis.arrivals.find((a) => a.shot === shot);
  const geophones = (record?.geophones ?? []).filter((g) => g.time !== null);
  const shotPosition = record?.position ?? 0;
  const samples = [
    { offset: 0, position: shotPosition, time: 0, via: 1 },
    ...geophones.map((g) => ({
      offset: g.position - shotPosition,
      position: g.position,
      time: g.time as number,
      via: g.via,
    })),
  ].sort((a, b) => a.offset - b.offset);
  const n = samples.length;
  const curves = {
    offsets: Float64Array.from(samples, (s) => s.offset),
    positions: Float64Array.from(samples, (s) => s.position),
    direct: { times: new Float64Array(n).fill(Number.NaN), first: new Uint8Array(n) },
    head: [],
    reflections: [],
    first: {
      times: Float64Array.from(samples, (s) => s.time),
      layer: Int16Array.from(samples, (s) => s.via),
    },
  } satisfies ArrivalCurves;
  const arrivals = {
    shot,
    shotPosition,
    geophones: geophones.map((g) => ({
      position: g.position,
      first: { time: g.time, layer: g.via },
    })),
  } as unknown as ShotArrivals;
  return { curves, arrivals };
}
