/**
 * A section model drawn to scale, as data: elevation against position, each layer a polygon
 * between its top and base polylines shaded by its velocity (the shading of the layered
 * Section, section-chart.ts), every polyline with its points, the geophones and shots on the
 * surface. Pure (d3 scales only), so the editor and the answers draw the same picture and
 * tests need no DOM.
 */
import { scaleLinear, type ScaleLinear } from "d3-scale";
import { palette } from "@/lib/chart/palette";
import { toDisplay, unitLabel, type UnitSystem } from "@/lib/units";
import type { Spread } from "./engine";
import type { SectionDraft } from "./plan-form";
import { velocityColour } from "./section-chart";

export type Pt = readonly [number, number];

/** Elevation of a polyline at x (linear between points, level beyond the ends). */
export function lineAt(points: readonly Pt[], x: number): number {
  const n = points.length;
  if (n === 0) return Number.NaN;
  if (x <= points[0][0]) return points[0][1];
  if (x >= points[n - 1][0]) return points[n - 1][1];
  for (let i = 1; i < n; i++) {
    const [x1, z1] = points[i];
    if (x1 >= x) {
      const [x0, z0] = points[i - 1];
      return x1 === x0 ? Math.min(z0, z1) : z0 + ((z1 - z0) * (x - x0)) / (x1 - x0);
    }
  }
  return points[n - 1][1];
}

/** The part of a polyline over [from, to], with points added at both ends. */
export function clipLine(points: readonly Pt[], from: number, to: number): Pt[] {
  const inside = points.filter(([x]) => x > from && x < to);
  return [[from, lineAt(points, from)], ...inside, [to, lineAt(points, to)]];
}

/** Geophone positions of a spread, m. */
export function geophonePositions(spread: Spread): number[] {
  return Array.from(
    { length: spread.channels },
    (_, i) => spread.firstGeophone + i * spread.spacing,
  );
}

export interface SectionViewInput {
  section: SectionDraft;
  spread: Spread | null;
  /** Shot drawn as chosen (0-based), null for none. */
  shotIndex: number | null;
  width: number;
  units: UnitSystem;
  /** Vertical exaggeration; "auto" picks the smallest of 1, 2, 5, 10 giving a readable height. */
  exaggeration: number | "auto";
  /** Elevations that must fit in the picture (deepest ray points, interpreted depths), m. */
  include?: number[];
}

export interface ViewLine {
  /** -1 for the surface, k for the base of layer k + 1 (0-based layer index). */
  line: number;
  label: string;
  path: string;
  points: Array<{ index: number; x: number; z: number; px: number; py: number }>;
}

export interface SectionView {
  width: number;
  height: number;
  margin: { top: number; right: number; bottom: number; left: number };
  x: ScaleLinear<number, number>;
  y: ScaleLinear<number, number>;
  from: number;
  to: number;
  exaggeration: number;
  xTicks: Array<{ px: number; label: string }>;
  yTicks: Array<{ px: number; label: string }>;
  xLabel: string;
  yLabel: string;
  layers: Array<{
    layer: number;
    name: string;
    velocityText: string;
    fill: string;
    path: string;
    label: { x: number; y: number; colour: string } | null;
  }>;
  lines: ViewLine[];
  geophones: Array<{ number: number; position: number; px: number; py: number }>;
  shots: Array<{ index: number; label: string; px: number; py: number; selected: boolean }>;
}

const EXAGGERATIONS = [1, 2, 5, 10];

/** Name shown for a layer (its own, or "layer n" / "half-space"). */
export function layerName(section: SectionDraft, k: number): string {
  const name = section.layers[k]?.name?.trim();
  if (name) return name;
  return k === section.layers.length - 1 ? "half-space" : `layer ${k + 1}`;
}

/** Label of a polyline: the surface or the base of a layer. */
export function lineLabel(section: SectionDraft, line: number): string {
  return line < 0 ? "surface" : `base of ${layerName(section, line)}`;
}

export function buildSectionView(input: SectionViewInput): SectionView {
  const { section, spread, units, width } = input;
  const margin = { top: 34, right: 18, bottom: 42, left: 62 };
  const surface = section.surface;
  const from = surface[0][0];
  const to = surface[surface.length - 1][0];
  const bases = section.layers.map((l) => l.base).filter((b): b is [number, number][] => !!b);
  const tops = surface.map((p) => p[1]);
  const lows = [...bases.flatMap((b) => clipLine(b, from, to).map((p) => p[1])), ...tops];
  const zHigh = Math.max(...tops);
  const zLowModel = Math.min(...lows, ...(input.include ?? []));
  const relief = Math.max(zHigh - zLowModel, 2);
  const zTop = zHigh + Math.max(relief * 0.08, 0.5);
  const zBottom = zLowModel - Math.max(relief * 0.3, 2);

  const plotWidth = Math.max(120, width - margin.left - margin.right);
  const metresPerPx = (to - from) / plotWidth;
  const trueHeight = (zTop - zBottom) / metresPerPx;
  const exaggeration =
    input.exaggeration === "auto"
      ? (EXAGGERATIONS.find((e) => trueHeight * e >= 220) ?? 10)
      : input.exaggeration;
  const plotHeight = Math.min(Math.max(trueHeight * exaggeration, 80), 640);
  // Keep the scale honest: when the height was clamped, the elevation range follows the scale.
  const zShownBottom = zTop - (plotHeight / exaggeration) * metresPerPx;
  const height = plotHeight + margin.top + margin.bottom;
  const x = scaleLinear()
    .domain([from, to])
    .range([margin.left, margin.left + plotWidth]);
  const y = scaleLinear()
    .domain([zTop, zShownBottom])
    .range([margin.top, margin.top + plotHeight]);
  const py = (z: number) => y(Math.max(zShownBottom, Math.min(zTop, z)));

  const velocities = section.layers.flatMap((l) => [
    l.velocity,
    ...(l.velocityAt?.map((p) => p[1]) ?? []),
  ]);
  const colour = velocityColour(Math.min(...velocities), Math.max(...velocities));
  const n = section.layers.length;
  const lineOf = (k: number): Pt[] =>
    k < 0 ? clipLine(surface, from, to) : clipLine(section.layers[k].base ?? [], from, to);
  const pathOf = (pts: readonly Pt[]) =>
    pts.map(([p, z], i) => `${i === 0 ? "M" : "L"}${x(p).toFixed(1)},${py(z).toFixed(1)}`).join("");

  const layers = section.layers.map((layer, k) => {
    const top = lineOf(k - 1);
    const last = k === n - 1 || !layer.base;
    const bottom: Pt[] = last
      ? [
          [from, zShownBottom],
          [to, zShownBottom],
        ]
      : lineOf(k);
    const path = `${pathOf(top)}L${[...bottom]
      .reverse()
      .map(([p, z]) => `${x(p).toFixed(1)},${py(z).toFixed(1)}`)
      .join("L")}Z`;
    const mean = layer.velocityAt?.length
      ? layer.velocityAt.reduce((s, p) => s + p[1], 0) / layer.velocityAt.length
      : layer.velocity;
    const fill = colour(mean);
    // label where the layer is thickest on screen, if there is room for a line of text
    let best = { px: 0, mid: 0, at: from };
    for (let i = 0; i <= 40; i++) {
      const at = from + ((to - from) * (i + 0.5)) / 41;
      const a = py(lineAt(top, at));
      const b = py(lineAt(bottom, at));
      if (b - a > best.px) best = { px: b - a, mid: (a + b) / 2, at };
    }
    const dark = luminance(fill) < 0.45;
    const vs = layer.velocityAt?.length
      ? `${fmtV(Math.min(...layer.velocityAt.map((p) => p[1])), units)}–${fmtV(Math.max(...layer.velocityAt.map((p) => p[1])), units)}`
      : fmtV(layer.velocity, units);
    // about 6.6 px per character at 11–12 px (name and velocity), half of it each side
    const half = ((layerName(section, k).length + vs.length + 7) * 6.6) / 2;
    return {
      layer: k + 1,
      name: layerName(section, k),
      velocityText: `${vs} ${unitLabel("velocity", units)}`,
      fill,
      path,
      label:
        best.px >= 16
          ? {
              x: Math.min(
                Math.max(x(best.at), margin.left + half + 6),
                margin.left + plotWidth - half - 6,
              ),
              y: best.mid + 4,
              colour: dark ? palette.card : palette.inkDeep,
            }
          : null,
    };
  });

  const lines: ViewLine[] = [-1, ...section.layers.slice(0, -1).map((_, k) => k)]
    .filter((k) => k < 0 || section.layers[k].base)
    .map((k) => {
      const own = k < 0 ? surface : (section.layers[k].base as [number, number][]);
      return {
        line: k,
        label: lineLabel(section, k),
        path: pathOf(lineOf(k)),
        points: own.map(([p, z], index) => ({
          index,
          x: p,
          z,
          px: x(Math.max(from, Math.min(to, p))),
          py: py(z),
        })),
      };
    });

  const perUnit = toDisplay("length", 1, units);
  const xTicks = scaleLinear()
    .domain([from * perUnit, to * perUnit])
    .ticks(Math.max(3, Math.round(plotWidth / 90)))
    .map((v) => ({ px: x(v / perUnit), label: String(v) }));
  const yTicks = scaleLinear()
    .domain([zShownBottom * perUnit, zTop * perUnit])
    .ticks(Math.max(3, Math.round(plotHeight / 50)))
    .map((v) => ({ px: y(v / perUnit), label: String(v) }));

  return {
    width,
    height,
    margin,
    x,
    y,
    from,
    to,
    exaggeration,
    xTicks,
    yTicks,
    xLabel: `Position along the line (${unitLabel("length", units)})`,
    yLabel: `Elevation (${unitLabel("length", units)})`,
    layers,
    lines,
    geophones: spread
      ? geophonePositions(spread).map((p, i) => ({
          number: i + 1,
          position: p,
          px: x(p),
          py: py(lineAt(surface, p)),
        }))
      : [],
    shots: spread
      ? spread.shots.map((s, i) => ({
          index: i,
          label: s.label || `shot ${i + 1}`,
          px: x(s.position),
          py: py(lineAt(surface, s.position) - (s.depth ?? 0)),
          selected: i === input.shotIndex,
        }))
      : [],
  };
}

const wholeGrouped = new Intl.NumberFormat("en-GB", { maximumFractionDigits: 0 });

/** A velocity as the other charts write it: whole, thousands grouped ("6,890"). */
function fmtV(v: number, units: UnitSystem): string {
  return wholeGrouped.format(Math.round(toDisplay("velocity", v, units)));
}

function luminance(colour: string): number {
  const m = /rgb\((\d+), (\d+), (\d+)\)/.exec(colour);
  if (!m) return 1;
  const [r, g, b] = [m[1], m[2], m[3]].map(Number);
  return (0.2126 * r + 0.7152 * g + 0.0722 * b) / 255;
}
