/**
 * The report's two figures as vector graphics, from the engine's numbers: the Arrivals chart
 * (first-arrival time against position for every shot, coloured by which arrival is first)
 * and the Section (the ground model to scale with geophones, shots and one first-arrival ray
 * path). The geometry is computed by pure functions (`arrivalsFigure`, `sectionFigure`) so it
 * can be tested without a PDF; `drawArrivals` and `drawSection` only bind it to pdfkit.
 */
import { scaleLinear } from "d3";
import type PDFDocument from "pdfkit";
import { firstArrivalRayPath, sampleCurves, type GroundModel, type Spread } from "@engine";
import { fromDisplay, toDisplay, unitLabel, type UnitSystem } from "@/lib/units";
import { pdfText, type ReportFonts } from "./fonts";
import { ink } from "./layout";

type Doc = InstanceType<typeof PDFDocument>;

/** Colour per arrival, index 0 the direct wave (the client's arrival colours). */
const ARRIVAL_COLOURS = [
  "#0b2f30",
  "#b8862b",
  "#4f7a3a",
  "#6a4c7d",
  "#2f7d8c",
  "#8a5a2b",
  "#51612a",
  "#a04e6a",
  "#3a5f8f",
  "#7d7a2e",
  "#5b3f2f",
  "#2e6b55",
];

/** Colour of an arrival by layer number: 1 = direct wave, L ≥ 2 = head wave of layer L. */
export function arrivalColour(layer: number): string {
  return ARRIVAL_COLOURS[(Math.max(1, layer) - 1) % ARRIVAL_COLOURS.length];
}

export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** Geophone positions of a spread, m. */
export function geophonePositions(spread: Spread): number[] {
  return Array.from(
    { length: spread.channels },
    (_, k) => spread.firstGeophone + k * spread.spacing,
  );
}

/** Positions covered by geophones and shots, m. */
export function lineExtent(spread: Spread): [number, number] {
  const g = geophonePositions(spread);
  const all = [...g, ...spread.shots.map((s) => s.position)];
  const lo = Math.min(...all);
  const hi = Math.max(...all);
  return hi > lo ? [lo, hi] : [lo - 1, hi + 1];
}

/** One stretch of a first-arrival curve where the same arrival is first. */
export interface CurveRun {
  layer: number;
  /** [position m, time s] */
  points: [number, number][];
}

export interface ArrivalsFigure {
  extent: [number, number];
  /** Largest time on any curve, s. */
  maxTime: number;
  shots: { label: string; position: number; runs: CurveRun[] }[];
  geophones: number[];
  /** Layers that are first somewhere (1 = direct wave). */
  layers: number[];
}

/** Splits sampled first arrivals into runs of the same arrival. */
export function curveRuns(
  positions: ArrayLike<number>,
  times: ArrayLike<number>,
  layer: ArrayLike<number>,
): CurveRun[] {
  const runs: CurveRun[] = [];
  let current: CurveRun | null = null;
  for (let i = 0; i < positions.length; i++) {
    const t = times[i];
    if (!Number.isFinite(t)) {
      current = null;
      continue;
    }
    const point: [number, number] = [positions[i], t];
    if (!current || current.layer !== layer[i]) {
      // Runs share their end points so the curve stays continuous across a crossover.
      if (current) current.points.push(point);
      current = { layer: layer[i], points: [point] };
      runs.push(current);
    } else current.points.push(point);
  }
  return runs;
}

/** First-arrival curves of every shot over the line, from the engine's `sampleCurves`. */
export function arrivalsFigure(
  model: Pick<GroundModel, "layers">,
  spread: Spread,
  samples = 241,
): ArrivalsFigure {
  const extent = lineExtent(spread);
  const layers = new Set<number>();
  let maxTime = 0;
  const shots = spread.shots.map((shot, i) => {
    const curves = sampleCurves(
      model,
      shot.position,
      extent[0] - shot.position,
      extent[1] - shot.position,
      samples,
      {
        reflections: false,
      },
    );
    const runs = curveRuns(curves.positions, curves.first.times, curves.first.layer);
    for (const run of runs) {
      layers.add(run.layer);
      for (const [, t] of run.points) maxTime = Math.max(maxTime, t);
    }
    return { label: shot.label || `S${i + 1}`, position: shot.position, runs };
  });
  return {
    extent,
    maxTime,
    shots,
    geophones: geophonePositions(spread),
    layers: [...layers].sort((a, b) => a - b),
  };
}

export interface SectionFigure {
  extent: [number, number];
  /** Depth of the figure's floor, m. */
  maxDepth: number;
  /** Each layer as a polygon of [position, depth] points, top first. */
  layers: {
    name: string;
    velocity: number;
    polygon: [number, number][];
    labelAt: [number, number];
  }[];
  /** Interfaces 1..n−1 as [position, depth] end points. */
  interfaces: [[number, number], [number, number]][];
  geophones: number[];
  shots: { label: string; position: number }[];
  /** First-arrival ray path from the first shot to the geophone farthest from it. */
  ray: { points: [number, number][]; layer: number } | null;
}

/** The model to scale over the line (interface k at depth D_k + x·tan dip, plan-schema.ts). */
export function sectionFigure(model: Pick<GroundModel, "layers">, spread: Spread): SectionFigure {
  const extent = lineExtent(spread);
  const [x0, x1] = extent;
  const depthAt: ((x: number) => number)[] = [() => 0];
  let cumulative = 0;
  model.layers.forEach((layer, i) => {
    if (i === model.layers.length - 1) return;
    cumulative += layer.thickness ?? 0;
    const base = cumulative;
    const slope = Math.tan(((layer.dip ?? 0) * Math.PI) / 180);
    depthAt.push((x) => base + x * slope);
  });
  let deepest = 0;
  for (const f of depthAt) deepest = Math.max(deepest, f(x0), f(x1));
  const maxDepth = Math.max(5, deepest * 1.35, deepest + 3);
  const layers = model.layers.map((layer, i) => {
    const top = depthAt[i];
    const base = depthAt[i + 1] ?? (() => maxDepth);
    const polygon: [number, number][] = [
      [x0, top(x0)],
      [x1, top(x1)],
      [x1, Math.min(maxDepth, base(x1))],
      [x0, Math.min(maxDepth, base(x0))],
    ];
    const mid = (x0 + x1) / 2;
    const labelDepth = (top(mid) + Math.min(maxDepth, base(mid))) / 2;
    return {
      name: layer.name || `layer ${i + 1}`,
      velocity: layer.velocity,
      polygon,
      labelAt: [mid, labelDepth] as [number, number],
    };
  });
  const interfaces = depthAt.slice(1).map(
    (f) =>
      [
        [x0, f(x0)],
        [x1, f(x1)],
      ] as [[number, number], [number, number]],
  );
  const geophones = geophonePositions(spread);
  const shots = spread.shots.map((s, i) => ({
    label: s.label || `S${i + 1}`,
    position: s.position,
  }));
  let ray: SectionFigure["ray"] = null;
  const first = spread.shots[0];
  if (first && geophones.length > 0) {
    const far = geophones.reduce((a, g) =>
      Math.abs(g - first.position) > Math.abs(a - first.position) ? g : a,
    );
    if (far !== first.position) {
      const path = firstArrivalRayPath(model, first.position, far);
      ray = { points: path.points, layer: path.kind === "direct" ? 1 : path.layer };
    }
  }
  return { extent, maxDepth, layers, interfaces, geophones, shots, ray };
}

const fmtTick = (v: number) => String(Number(v.toFixed(6)));

/**
 * About `count` ticks of a length scale (SI, m) at round values in the reader's unit, as
 * [position m, label]: a feet reader gets 0, 20, 40 ft, not the feet of 0, 5, 10 m.
 */
export function lengthTicks(
  scale: ReturnType<typeof scaleLinear<number, number>>,
  count: number,
  units: UnitSystem,
): [number, string][] {
  const shown = scale.domain().map((v) => toDisplay("length", v, units));
  return scaleLinear()
    .domain(shown)
    .ticks(count)
    .map((t) => [fromDisplay("length", t, units), fmtTick(t)]);
}

function axes(
  doc: Doc,
  fonts: ReportFonts,
  box: Box,
  x: ReturnType<typeof scaleLinear<number, number>>,
  y: ReturnType<typeof scaleLinear<number, number>>,
  labels: { x: string; y: string },
  yFormat: (v: number) => string,
  units: UnitSystem = "metric",
  yIsLength = false,
): void {
  // Position ticks (and depth ticks) at round values in the reader's unit.
  const xTicks = lengthTicks(x, 8, units);
  const yTicks: [number, string][] = yIsLength
    ? lengthTicks(y, 5, units)
    : y.ticks(5).map((t) => [t, yFormat(t)]);
  doc.save();
  doc.lineWidth(0.4).strokeColor(ink.rule);
  for (const [t] of yTicks) {
    doc
      .moveTo(box.x, y(t))
      .lineTo(box.x + box.width, y(t))
      .stroke();
  }
  for (const [t] of xTicks) {
    doc
      .moveTo(x(t), box.y)
      .lineTo(x(t), box.y + box.height)
      .stroke();
  }
  doc.lineWidth(0.8).strokeColor(ink.soft).rect(box.x, box.y, box.width, box.height).stroke();
  doc.restore();
  doc.font(fonts.regular).fontSize(7).fillColor(ink.soft);
  for (const [t, label] of yTicks) {
    doc.text(label, box.x - 34, y(t) - 3.5, { width: 30, align: "right", lineBreak: false });
  }
  for (const [t, label] of xTicks) {
    doc.text(label, x(t) - 20, box.y + box.height + 3, {
      width: 40,
      align: "center",
      lineBreak: false,
    });
  }
  doc.font(fonts.regular).fontSize(7.5).fillColor(ink.ink);
  doc.text(pdfText(labels.x), box.x, box.y + box.height + 13, {
    width: box.width,
    align: "center",
    lineBreak: false,
  });
  doc.save();
  doc.rotate(-90, { origin: [box.x - 40, box.y + box.height / 2] });
  doc.text(pdfText(labels.y), box.x - 40 - box.height / 2, box.y + box.height / 2 - 4, {
    width: box.height,
    align: "center",
    lineBreak: false,
  });
  doc.restore();
}

/** Draws the Arrivals chart into `box` (axes inside a left and bottom margin). */
export function drawArrivals(
  doc: Doc,
  fonts: ReportFonts,
  box: Box,
  figure: ArrivalsFigure,
  units: UnitSystem = "metric",
): void {
  const plot = { x: box.x + 46, y: box.y + 18, width: box.width - 52, height: box.height - 52 };
  const x = scaleLinear()
    .domain(figure.extent)
    .range([plot.x, plot.x + plot.width]);
  const y = scaleLinear()
    .domain([0, Math.max(1e-3, figure.maxTime * 1.08)])
    .nice()
    .range([plot.y + plot.height, plot.y]);
  axes(
    doc,
    fonts,
    plot,
    x,
    y,
    { x: `position along the line (${unitLabel("length", units)})`, y: "first-arrival time (ms)" },
    (v) => fmtTick(v * 1000),
    units,
  );
  doc.save();
  doc.rect(plot.x, plot.y, plot.width, plot.height).clip();
  for (const shot of figure.shots) {
    for (const run of shot.runs) {
      doc.lineWidth(1.3).strokeColor(arrivalColour(run.layer));
      run.points.forEach(([p, t], i) =>
        i === 0 ? doc.moveTo(x(p), y(t)) : doc.lineTo(x(p), y(t)),
      );
      doc.stroke();
    }
  }
  doc.restore();
  // Geophones as ticks on the time axis, shots as labelled triangles above the plot.
  doc.save();
  doc.lineWidth(0.6).strokeColor(ink.ink);
  for (const g of figure.geophones)
    doc
      .moveTo(x(g), plot.y + plot.height)
      .lineTo(x(g), plot.y + plot.height - 3)
      .stroke();
  for (const s of figure.shots) {
    const px = x(s.position);
    const py = plot.y;
    doc.polygon([px - 3.5, py - 6], [px + 3.5, py - 6], [px, py]).fill(ink.brick);
    doc
      .font(fonts.medium)
      .fontSize(6.5)
      .fillColor(ink.brick)
      .text(pdfText(s.label), px - 40, py - 15, { width: 80, align: "center", lineBreak: false });
  }
  doc.restore();
  // Legend.
  let lx = plot.x + 6;
  const ly = plot.y + 6;
  doc.font(fonts.regular).fontSize(7);
  for (const layer of figure.layers) {
    const label = layer === 1 ? "direct wave" : `head wave, top of layer ${layer}`;
    const w = doc.widthOfString(label) + 22;
    doc.rect(lx - 2, ly - 2, w, 11).fill("#ffffff");
    doc
      .lineWidth(1.6)
      .strokeColor(arrivalColour(layer))
      .moveTo(lx, ly + 3.5)
      .lineTo(lx + 12, ly + 3.5)
      .stroke();
    doc.fillColor(ink.deep).text(label, lx + 15, ly, { lineBreak: false });
    lx += w + 4;
  }
}

/** Fill of layer i: lighter for shallow layers, our paper tones. */
const LAYER_FILLS = ["#f7f1e4", "#efe4cc", "#e5d5b3", "#d9c79e", "#cdb98b", "#c1ab7a"];

/** Draws the Section into `box`; returns the vertical exaggeration used. */
export function drawSection(
  doc: Doc,
  fonts: ReportFonts,
  box: Box,
  figure: SectionFigure,
  units: UnitSystem = "metric",
): number {
  const plot = { x: box.x + 46, y: box.y + 18, width: box.width - 52, height: box.height - 52 };
  const x = scaleLinear()
    .domain(figure.extent)
    .range([plot.x, plot.x + plot.width]);
  const y = scaleLinear()
    .domain([0, figure.maxDepth])
    .nice()
    .range([plot.y, plot.y + plot.height]);
  const hScale = plot.width / (figure.extent[1] - figure.extent[0]);
  const vScale = plot.height / (y.domain()[1] - y.domain()[0]);
  doc.save();
  doc.rect(plot.x, plot.y, plot.width, plot.height).clip();
  figure.layers.forEach((layer, i) => {
    const pts = layer.polygon.map(([p, d]) => [x(p), y(d)] as [number, number]);
    if (i === figure.layers.length - 1) {
      pts[2] = [pts[2][0], plot.y + plot.height];
      pts[3] = [pts[3][0], plot.y + plot.height];
    }
    doc.polygon(...pts).fill(LAYER_FILLS[Math.min(i, LAYER_FILLS.length - 1)]);
  });
  doc.lineWidth(0.9).strokeColor(ink.ink);
  for (const [[a, da], [b, db]] of figure.interfaces)
    doc.moveTo(x(a), y(da)).lineTo(x(b), y(db)).stroke();
  if (figure.ray) {
    doc.lineWidth(1).strokeColor(arrivalColour(figure.ray.layer)).dash(3, { space: 2 });
    figure.ray.points.forEach(([p, d], i) =>
      i === 0 ? doc.moveTo(x(p), y(d)) : doc.lineTo(x(p), y(d)),
    );
    doc.stroke();
    doc.undash();
  }
  doc.restore();
  const len = unitLabel("length", units);
  axes(
    doc,
    fonts,
    plot,
    x,
    y,
    { x: `position along the line (${len})`, y: `depth (${len})` },
    fmtTick,
    units,
    true,
  );
  doc.font(fonts.regular).fontSize(7.5);
  for (const layer of figure.layers) {
    const [p, d] = layer.labelAt;
    const text = pdfText(
      `${layer.name} · ${Math.round(toDisplay("velocity", layer.velocity, units))} ${unitLabel("velocity", units)}`,
    );
    const tw = doc.widthOfString(text);
    doc.rect(x(p) - tw / 2 - 3, y(d) - 5, tw + 6, 12).fill("#fbf8f1");
    doc.fillColor(ink.deep).text(text, x(p) - tw / 2, y(d) - 3, { lineBreak: false });
  }
  doc.save();
  for (const g of figure.geophones) {
    const px = x(g);
    doc.polygon([px - 2.2, plot.y - 4], [px + 2.2, plot.y - 4], [px, plot.y]).fill(ink.ink);
  }
  for (const s of figure.shots) {
    const px = x(s.position);
    doc.circle(px, plot.y - 7, 2.6).fill(ink.brick);
    doc
      .font(fonts.medium)
      .fontSize(6.5)
      .fillColor(ink.brick)
      .text(pdfText(s.label), px - 40, plot.y - 17, {
        width: 80,
        align: "center",
        lineBreak: false,
      });
  }
  doc.restore();
  return vScale / hScale;
}
