/**
 * The Section as data: the ground model drawn to scale (depth against position), each layer
 * a polygon shaded by its velocity, the geophones and shots on the surface, and a ray path.
 * Pure (d3 scales only). Interfaces are planar: the depth of the base of layer k at position
 * x is the sum of the thicknesses above at position 0 plus x · tan(dip) — the plan schema's
 * own convention (workers/engine/plan-schema.ts), so dipping interfaces are drawn as they dip.
 */
import { interpolateRgb } from "d3-interpolate";
import { scaleLinear, type ScaleLinear } from "d3-scale";
import { palette } from "@/lib/chart/palette";
import { toDisplay, unitLabel, type UnitSystem } from "@/lib/units";
import type { GroundModel, RayPath, Spread } from "./engine";
import { velocityLegendTicks } from "./velocity-legend";
import { tickCount } from "@/lib/chart/tick-count";

export interface SectionInput {
  model: GroundModel;
  spread: Spread;
  /** Shot whose ray path is drawn (0-based). */
  shotIndex: number;
  ray: RayPath | null;
  /** 1-based geophone of the ray path, for the caption. */
  geophone: number | null;
  width: number;
  units: UnitSystem;
  /** Vertical exaggeration; "auto" picks the smallest of 1, 2, 5, 10 giving a readable height. */
  exaggeration: number | "auto";
}

export interface SectionLayer {
  layer: number;
  name: string;
  velocity: number;
  fill: string;
  /** Polygon path of the layer within the drawn extent. */
  path: string;
  /** Where to write the layer's label. */
  labelX: number;
  labelY: number;
  textColour: string;
}

export interface SectionModel {
  width: number;
  height: number;
  margin: { top: number; right: number; bottom: number; left: number };
  x: ScaleLinear<number, number>;
  y: ScaleLinear<number, number>;
  exaggeration: number;
  xTicks: Array<{ px: number; label: string }>;
  yTicks: Array<{ px: number; label: string }>;
  xLabel: string;
  yLabel: string;
  layers: SectionLayer[];
  /** The base of each layer above the half-space, as a line (drawn over the fills). */
  interfaces: Array<{ layer: number; path: string }>;
  geophones: Array<{ number: number; x: number; position: number }>;
  shots: Array<{ index: number; x: number; label: string; selected: boolean }>;
  ray: { path: string; points: Array<[number, number]> } | null;
  /** The scale note above the plot ("vertical exaggeration ×5"; shorter on a narrow chart). */
  scaleNote: string;
  legend: {
    stops: Array<{ offset: number; colour: string }>;
    ticks: Array<{ at: number; label: string }>;
    unit: string;
    /** The bar's width, px, and the words at its left ("velocity (m/s)", or the unit alone). */
    width: number;
    label: string;
  };
}

/** Below this width (px) a chart is a phone's: fewer ticks, shorter notes. */
export const NARROW_CHART = 520;

/** The velocity shading: light for slow ground, deep teal for fast rock. */
export function velocityColour(vMin: number, vMax: number) {
  const lo = Math.log(Math.max(1, vMin));
  const hi = Math.log(Math.max(vMin + 1, vMax));
  const mix = interpolateRgb("#f1e5c6", palette.ink);
  return (v: number) => mix(hi === lo ? 0.5 : (Math.log(v) - lo) / (hi - lo));
}

/** Depth (m) of the base of layer index `k` (0-based; the surface is k = −1) at position x. */
export function baseDepth(model: GroundModel, k: number, x: number): number {
  if (k < 0) return 0;
  let atZero = 0;
  for (let i = 0; i <= k; i++) atZero += model.layers[i].thickness ?? 0;
  const dip = model.layers[k].dip ?? 0;
  return atZero + x * Math.tan((dip * Math.PI) / 180);
}

const EXAGGERATIONS = [1, 2, 5, 10];

export function buildSection(input: SectionInput): SectionModel {
  const { model, spread, units, width } = input;
  const margin = { top: 56, right: 16, bottom: 40, left: 56 };
  const geophonePositions = Array.from(
    { length: spread.channels },
    (_, i) => spread.firstGeophone + i * spread.spacing,
  );
  const shotPositions = spread.shots.map((s) => s.position);
  const all = [...geophonePositions, ...shotPositions];
  const lo = Math.min(...all);
  const hi = Math.max(...all);
  const pad = Math.max(spread.spacing, (hi - lo) * 0.04);
  const x0 = lo - pad;
  const x1 = hi + pad;
  const n = model.layers.length;
  let deepest = 0;
  for (let k = 0; k < n - 1; k++) {
    deepest = Math.max(deepest, baseDepth(model, k, x0), baseDepth(model, k, x1));
  }
  if (input.ray) for (const [, d] of input.ray.points) deepest = Math.max(deepest, d);
  const zMax = Math.max(deepest * 1.3, deepest + 2, 5);

  const plotWidth = width - margin.left - margin.right;
  const metresPerPx = (x1 - x0) / plotWidth;
  const trueHeight = zMax / metresPerPx;
  let exaggeration: number;
  if (input.exaggeration === "auto") {
    exaggeration = EXAGGERATIONS.find((e) => trueHeight * e >= 150) ?? 10;
  } else exaggeration = input.exaggeration;
  const plotHeight = Math.min(Math.max(trueHeight * exaggeration, 60), 900);
  const height = plotHeight + margin.top + margin.bottom;
  // Keep the scale honest: when the height was clamped, the depth range follows the scale.
  const zShown = (plotHeight / exaggeration) * metresPerPx;

  const x = scaleLinear()
    .domain([x0, x1])
    .range([margin.left, width - margin.right]);
  const y = scaleLinear()
    .domain([0, zShown])
    .range([margin.top, margin.top + plotHeight]);

  const velocities = model.layers.map((l) => l.velocity);
  const colour = velocityColour(Math.min(...velocities), Math.max(...velocities));
  const clampY = (d: number) => y(Math.min(Math.max(d, 0), zShown));
  const layers: SectionLayer[] = model.layers.map((layer, k) => {
    const topA = clampY(baseDepth(model, k - 1, x0));
    const topB = clampY(baseDepth(model, k - 1, x1));
    const last = k === n - 1;
    const botA = last ? y(zShown) : clampY(baseDepth(model, k, x0));
    const botB = last ? y(zShown) : clampY(baseDepth(model, k, x1));
    const fill = colour(layer.velocity);
    const xm = (x0 + x1) / 2;
    const midTop = clampY(baseDepth(model, k - 1, xm));
    const midBottom = last ? y(zShown) : clampY(baseDepth(model, k, xm));
    const dark = luminance(fill) < 0.45;
    return {
      layer: k + 1,
      name: layer.name || (last ? "half-space" : `layer ${k + 1}`),
      velocity: layer.velocity,
      fill,
      path: `M${x(x0)},${topA}L${x(x1)},${topB}L${x(x1)},${botB}L${x(x0)},${botA}Z`,
      labelX: x((x0 + x1) / 2),
      labelY: (midTop + midBottom) / 2 + 4,
      textColour: dark ? palette.card : palette.inkDeep,
    };
  });
  const interfaces = model.layers.slice(0, -1).map((_, k) => ({
    layer: k + 1,
    path: `M${x(x0)},${clampY(baseDepth(model, k, x0))}L${x(x1)},${clampY(baseDepth(model, k, x1))}`,
  }));

  const xShown = scaleLinear().domain([x0, x1].map((v) => toDisplay("length", v, units)));
  const perUnit = toDisplay("length", 1, units);
  const xTicks = xShown
    .ticks(tickCount(width - margin.left - margin.right))
    .map((v) => ({ px: x(v / perUnit), label: String(v) }));
  const zShownDisplay = scaleLinear().domain([0, toDisplay("length", zShown, units)]);
  const yTicks = zShownDisplay.ticks(5).map((v) => ({ px: y(v / perUnit), label: String(v) }));

  const ray = input.ray
    ? {
        points: input.ray.points,
        path: input.ray.points.map(([p, d], i) => `${i === 0 ? "M" : "L"}${x(p)},${y(d)}`).join(""),
      }
    : null;

  // the bar spans every velocity drawn (the half-space included), labelled at both ends
  const vLo = Math.min(...velocities);
  const vHi = Math.max(...velocities);
  // On a phone the bar is short: its labels (up to "10,827", about 40 px at 9 px) keep 44 px
  // apart, and the words beside it shrink so they no longer run into the scale note.
  const narrow = width < NARROW_CHART;
  const legendWidth = Math.min(220, width * 0.35);
  const velocityUnit = unitLabel("velocity", units);

  return {
    width,
    height,
    margin,
    x,
    y,
    exaggeration,
    scaleNote:
      exaggeration === 1
        ? narrow
          ? "true scale"
          : "true scale (no vertical exaggeration)"
        : `${narrow ? "vertical" : "vertical exaggeration"} ×${exaggeration}`,
    xTicks,
    yTicks,
    xLabel: `Position along the line (${unitLabel("length", units)})`,
    yLabel: `Depth (${unitLabel("length", units)})`,
    layers,
    interfaces,
    geophones: geophonePositions.map((p, i) => ({ number: i + 1, x: x(p), position: p })),
    shots: spread.shots.map((s, i) => ({
      index: i,
      x: x(s.position),
      label: s.label || `shot ${i + 1}`,
      selected: i === input.shotIndex,
    })),
    ray,
    legend: {
      stops: [0, 0.25, 0.5, 0.75, 1].map((t) => ({
        offset: t,
        colour: colour(
          Math.exp(Math.log(vLo) + t * (Math.log(Math.max(vHi, vLo + 1)) - Math.log(vLo))),
        ),
      })),
      ticks: velocityLegendTicks(vLo, vHi, units, Math.max(0.16, 44 / legendWidth)),
      unit: velocityUnit,
      width: legendWidth,
      label: narrow ? velocityUnit : `velocity (${velocityUnit})`,
    },
  };
}

function luminance(colour: string): number {
  const m = /rgb\((\d+), (\d+), (\d+)\)/.exec(colour);
  if (!m) return 1;
  const [r, g, b] = [m[1], m[2], m[3]].map(Number);
  return (0.2126 * r + 0.7152 * g + 0.0722 * b) / 255;
}
