/**
 * The Arrivals chart as data: scales, path strings, geophone marks, segment labels and the
 * flags of hidden refractors, for one shot of one ground model. Pure (d3 scales and line
 * generators only, no DOM), so it is tested without a browser; the component binds it to SVG.
 *
 * Every time and segment count comes from the engine (sampleCurves, computeArrivals and the
 * analysis); this module only places them on the page.
 */
import { scaleLinear, type ScaleLinear } from "d3-scale";
import { line } from "d3-shape";
import { arrivalColour } from "@/lib/chart/palette";
import { tickCount } from "@/lib/chart/tick-count";
import { formatQuantity, toDisplay, unitLabel, type UnitSystem } from "@/lib/units";
import type { ArrivalCurves, BranchVerdict, ModelAnalysis, ShotArrivals, Status } from "./engine";

export interface ArrivalsChartInput {
  curves: ArrivalCurves;
  arrivals: ShotArrivals;
  analysis: ModelAnalysis;
  /** Names of the model's layers (index 0 = layer 1), for labels. */
  layerNames: Array<string | null | undefined>;
  width: number;
  height: number;
  /** Signed offset range shown, m (defaults to the sampled range). */
  domain?: [number, number];
  showReflections: boolean;
  /** The plan's minimum geophone count per segment (criteria.minGeophones). */
  minGeophones: number;
  units: UnitSystem;
}

export interface ChartTick {
  px: number;
  label: string;
}

export interface CurveMark {
  key: string;
  /** 1 = direct wave, L ≥ 2 = head wave along the top of layer L. */
  layer: number;
  label: string;
  colour: string;
  /** Where the arrival exists (drawn faint). */
  faintPath: string;
  /** Where it is the first arrival (drawn solid). */
  solidPath: string;
}

export interface GeophoneMark {
  channel: number;
  /** 1-based geophone number. */
  number: number;
  position: number;
  /** Signed offset, m. */
  offset: number;
  time: number;
  /** 1 = direct wave, L ≥ 2 = head wave of layer L. */
  layer: number;
  x: number;
  y: number;
  colour: string;
  /** The hover text: geophone, offset, time and arrival. */
  readout: string;
}

export interface SegmentLabel {
  key: string;
  layer: number;
  side: "forward" | "reverse";
  count: number;
  status: Status;
  x: number;
  /** Baseline of the text, px (already clear of the curve). */
  y: number;
  /** Which end of the text sits at x: "end" left of the curve, "start" right of it. */
  anchor: "start" | "end";
  text: string;
}

export interface RefractorFlag {
  key: string;
  layer: number;
  side: "forward" | "reverse" | null;
  status: Exclude<Status, "resolved">;
  text: string;
}

export interface ArrivalsChartModel {
  width: number;
  height: number;
  margin: { top: number; right: number; bottom: number; left: number };
  x: ScaleLinear<number, number>;
  y: ScaleLinear<number, number>;
  xTicks: ChartTick[];
  yTicks: ChartTick[];
  xLabel: string;
  yLabel: string;
  /** Shot marker on the offset axis (offset 0), when inside the domain. */
  shotX: number | null;
  curves: CurveMark[];
  reflections: Array<{ key: string; layer: number; colour: string; path: string }>;
  /** The first-arrival envelope, emphasised. */
  firstPath: string;
  geophones: GeophoneMark[];
  segmentLabels: SegmentLabel[];
  flags: RefractorFlag[];
}

export const arrivalName = (layer: number) =>
  layer <= 1 ? "direct wave" : `head wave, layer ${layer}`;

const layerTitle = (layer: number, names: ArrivalsChartInput["layerNames"]) => {
  const name = names[layer - 1];
  const title = layer === 1 ? "Direct wave, layer 1" : `Layer ${layer}`;
  return name ? `${title} (${name})` : title;
};

const sideWords = { forward: "towards the line end", reverse: "towards the line start" };

/** Why a refractor is hidden on a branch, in plain words (design.md verdicts). */
export function flagReason(
  verdict: Pick<BranchVerdict, "status" | "geophones">,
  minGeophones: number,
  layerAbove: { layer: number; velocity: number } | null,
  units: UnitSystem,
): string {
  switch (verdict.status) {
    case "inverted":
      return layerAbove
        ? `no head wave: not faster than layer ${layerAbove.layer} (${formatQuantity("velocity", layerAbove.velocity, units)}) above it`
        : "no head wave: not faster than a layer above it";
    case "blind":
      // The flag already names the verdict ("blind: …"): say why, not the word again.
      return "its head wave is never the first arrival";
    case "under-sampled":
      return `only ${verdict.geophones} geophone${verdict.geophones === 1 ? "" : "s"} on its segment (minimum ${minGeophones})`;
    case "resolved":
      return "resolved";
  }
}

function pathFor(
  offsets: Float64Array,
  times: Float64Array,
  include: (i: number) => boolean,
  x: ScaleLinear<number, number>,
  y: ScaleLinear<number, number>,
  domain: [number, number],
): string {
  const index = Array.from(offsets, (_, i) => i);
  const gen = line<number>()
    .defined(
      (i) =>
        include(i) &&
        Number.isFinite(times[i]) &&
        offsets[i] >= domain[0] - 1e-9 &&
        offsets[i] <= domain[1] + 1e-9,
    )
    .x((i) => x(offsets[i]))
    .y((i) => y(times[i]));
  return gen(index) ?? "";
}

export function buildArrivalsChart(input: ArrivalsChartInput): ArrivalsChartModel {
  const { curves, arrivals, analysis, units, width, height } = input;
  const margin = { top: 16, right: 20, bottom: 46, left: 58 };
  const n = curves.offsets.length;
  const sampled: [number, number] = [curves.offsets[0] ?? 0, curves.offsets[n - 1] ?? 1];
  const domain = input.domain ?? sampled;

  // Time range: the latest first arrival inside the domain, with some headroom.
  let tMax = 0;
  for (let i = 0; i < n; i++) {
    const o = curves.offsets[i];
    if (o < domain[0] - 1e-9 || o > domain[1] + 1e-9) continue;
    const t = curves.first.times[i];
    if (Number.isFinite(t)) tMax = Math.max(tMax, t);
  }
  if (!(tMax > 0)) tMax = 0.01;
  tMax *= 1.15;

  const x = scaleLinear()
    .domain(domain[0] === domain[1] ? [domain[0] - 1, domain[1] + 1] : domain)
    .range([margin.left, width - margin.right]);
  const y = scaleLinear()
    .domain([0, tMax])
    .range([height - margin.bottom, margin.top]);

  // Ticks in display units (offset in m or ft, time in ms).
  const xShown = scaleLinear().domain(x.domain().map((d) => toDisplay("length", d, units)));
  const xTicks = xShown.ticks(tickCount(width - margin.left - margin.right)).map((v) => ({
    px: x(v / toDisplay("length", 1, units)),
    label: String(v),
  }));
  const yShown = scaleLinear().domain([0, tMax * 1000]);
  const yTicks = yShown.ticks(6).map((v) => ({ px: y(v / 1000), label: String(v) }));

  const curvesOut: CurveMark[] = [];
  curvesOut.push({
    key: "direct",
    layer: 1,
    label: "Direct wave",
    colour: arrivalColour(1),
    faintPath: pathFor(curves.offsets, curves.direct.times, () => true, x, y, domain),
    solidPath: pathFor(
      curves.offsets,
      curves.direct.times,
      (i) => curves.direct.first[i] === 1,
      x,
      y,
      domain,
    ),
  });
  for (const head of curves.head) {
    curvesOut.push({
      key: `head-${head.layer}`,
      layer: head.layer,
      label: `Head wave, layer ${head.layer}`,
      colour: arrivalColour(head.layer),
      faintPath: pathFor(curves.offsets, head.times, () => true, x, y, domain),
      solidPath: pathFor(curves.offsets, head.times, (i) => head.first[i] === 1, x, y, domain),
    });
  }
  const reflections = input.showReflections
    ? curves.reflections.map((r) => ({
        key: `reflection-${r.layer}`,
        layer: r.layer,
        colour: arrivalColour(r.layer),
        path: pathFor(curves.offsets, r.times, () => true, x, y, domain),
      }))
    : [];
  const firstPath = pathFor(curves.offsets, curves.first.times, () => true, x, y, domain);

  const shotPosition = arrivals.shotPosition;
  const geophones: GeophoneMark[] = arrivals.geophones
    .map((g) => {
      const signed = g.position - shotPosition;
      const layer = g.first.kind === "direct" ? 1 : g.first.layer;
      return {
        channel: g.channel,
        number: g.channel + 1,
        position: g.position,
        offset: signed,
        time: g.first.time,
        layer,
        x: x(signed),
        y: y(g.first.time),
        colour: arrivalColour(layer),
        readout:
          `Geophone ${g.channel + 1} at ${formatQuantity("length", g.position, units)} · ` +
          `offset ${formatQuantity("length", Math.abs(signed), units)} · ` +
          `first break ${formatQuantity("time", g.first.time, units)} (${arrivalName(layer)})`,
      };
    })
    .filter((g) => g.offset >= domain[0] - 1e-9 && g.offset <= domain[1] + 1e-9);

  // Segment labels and flags for this shot's branches, straight from the analysis.
  const segmentLabels: SegmentLabel[] = [];
  const flags: RefractorFlag[] = [];
  const shot = arrivals.shot;
  const arrivalsByLayer: Array<{ layer: number; branches: BranchVerdict[] }> = [
    { layer: 1, branches: analysis.direct.branches },
    ...analysis.refractors.map((r) => ({ layer: r.layer, branches: r.branches })),
  ];
  const { minGeophones } = input;
  for (const { layer, branches } of arrivalsByLayer) {
    for (const b of branches) {
      if (b.shot !== shot || b.branchGeophones === 0) continue;
      const sign = b.side === "forward" ? 1 : -1;
      if (b.segment && b.geophones > 0) {
        const from = b.segment.from;
        const to = Math.min(b.segment.to ?? b.maxOffset, b.maxOffset);
        const mid = (from + Math.max(from, to)) / 2;
        const signed = sign * mid;
        if (signed >= domain[0] && signed <= domain[1]) {
          const t =
            b.interceptTime !== null && b.apparentVelocity
              ? b.interceptTime + mid / b.apparentVelocity
              : mid / analysis.direct.velocity;
          const name = layer === 1 ? "direct" : `L${layer}`;
          // The label ends just left of the curve (which rises to the right, so the text stays
          // above it). Near the plot's left edge there is no room (labels are about 120 px
          // wide): it starts right of the curve and sits below it instead, off the line.
          const px = x(signed);
          const left = px - 8 >= margin.left + 140;
          segmentLabels.push({
            key: `${layer}-${b.side}`,
            layer,
            side: b.side,
            count: b.geophones,
            status: b.status,
            x: left
              ? Math.min(px - 8, width - margin.right)
              : Math.min(px + 10, width - margin.right - 120),
            y: left ? y(t) - 6 : y(t) + 16,
            anchor: left ? "end" : "start",
            text: `${name}: ${b.geophones} geophone${b.geophones === 1 ? "" : "s"}`,
          });
        }
      }
      if (b.status !== "resolved") {
        const above = analysis.refractors
          .filter((r) => r.layer < layer)
          .reduce<{ layer: number; velocity: number }>(
            (best, r) =>
              r.velocity >= best.velocity ? { layer: r.layer, velocity: r.velocity } : best,
            { layer: 1, velocity: analysis.direct.velocity },
          );
        const both = branches.filter((o) => o.shot === shot && o.branchGeophones > 0);
        const sameEverywhere = both.every(
          (o) => o.status === b.status && o.geophones === b.geophones,
        );
        if (sameEverywhere && b.side === "reverse" && both.length > 1) continue; // said once below
        flags.push({
          key: `${layer}-${b.side}`,
          layer,
          side: sameEverywhere ? null : b.side,
          status: b.status,
          text:
            `${layerTitle(layer, input.layerNames)}` +
            (sameEverywhere || both.length === 1 ? "" : ` ${sideWords[b.side]}`) +
            ` — ${b.status}: ${flagReason(b, minGeophones, above, units)}`,
        });
      }
    }
  }

  return {
    width,
    height,
    margin,
    x,
    y,
    xTicks,
    yTicks,
    // the long form needs about 380 px at 12 px text; a phone's chart gets the short one
    xLabel:
      width >= 420
        ? `Offset from the shot (${unitLabel("length", units)}; negative towards the line start)`
        : `Offset from the shot (${unitLabel("length", units)}; − towards the start)`,
    yLabel: "Time (ms)",
    shotX: 0 >= x.domain()[0] && 0 <= x.domain()[1] ? x(0) : null,
    curves: curvesOut,
    reflections,
    firstPath,
    geophones,
    segmentLabels,
    flags,
  };
}

/** The nearest geophone to a pointer at horizontal pixel `px`, for the hover readout. */
export function nearestGeophone(model: ArrivalsChartModel, px: number): GeophoneMark | null {
  let best: GeophoneMark | null = null;
  for (const g of model.geophones) {
    if (!best || Math.abs(g.x - px) < Math.abs(best.x - px)) best = g;
  }
  return best;
}
