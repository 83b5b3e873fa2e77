/**
 * The Design sweep heatmap as data: one rectangle per cell of the engine's grid (columns the
 * spread axis, rows the model parameter), coloured by the cell's verdict, with axis ticks and
 * the readout for each cell. Pure; the component paints the cells (one pixel each, scaled) and
 * binds the rest to SVG. A cell's description (`cellAt`) is made when asked for, so a 200 × 200
 * grid costs no 40 000 objects and readouts up front.
 */
import { scaleBand } from "d3-scale";
import { palette } from "@/lib/chart/palette";
import { formatQuantity, formatSigned, unitLabel, type UnitSystem } from "@/lib/units";
import { CELL_INVALID, CELL_NOT_COMPUTED, STATUSES, type Status, type SweepResult } from "./engine";

export const CELL_FILL: Record<Status | "invalid" | "pending", string> = {
  resolved: palette.mossSoft,
  "under-sampled": palette.ochreSoft,
  blind: "#e4b3a8",
  inverted: palette.brick,
  invalid: "#c9c3b6",
  pending: palette.card,
};

export interface HeatCell {
  row: number;
  col: number;
  x: number;
  y: number;
  w: number;
  h: number;
  state: Status | "invalid" | "pending";
  fill: string;
  axisValue: number;
  parameterValue: number;
  depthError: number | null;
  readout: string;
}

export interface HeatmapModel {
  width: number;
  height: number;
  margin: { top: number; right: number; bottom: number; left: number };
  rows: number;
  cols: number;
  /** The plot area (px): cell (row, col) sits at column col from the left, row 0 at the bottom. */
  plot: { x: number; y: number; width: number; height: number };
  /** One cell, described when asked for. */
  cellAt(row: number, col: number): HeatCell;
  /** The cell under a point of the drawing (px), or null outside the plot. */
  cellFromPoint(px: number, py: number): HeatCell | null;
  /** Every cell, row by row (built on first read: use cellAt for a single cell). */
  readonly cells: HeatCell[];
  xTicks: Array<{ px: number; label: string }>;
  yTicks: Array<{ px: number; label: string }>;
  xLabel: string;
  yLabel: string;
  /** Where the plan itself sits on the grid, when inside it. */
  marker: { x: number; y: number } | null;
}

export function cellState(code: number): HeatCell["state"] {
  if (code === CELL_INVALID) return "invalid";
  if (code === CELL_NOT_COMPUTED) return "pending";
  return STATUSES[code] ?? "invalid";
}

export function axisText(kind: "spacing" | "channels", value: number, units: UnitSystem) {
  return kind === "spacing"
    ? formatQuantity("length", value, units)
    : `${Math.round(value)} channels`;
}

export function parameterText(
  parameter: SweepResult["parameter"],
  value: number,
  units: UnitSystem,
) {
  return parameter.kind === "thickness"
    ? formatQuantity("length", value, units)
    : formatQuantity("velocity", value, units);
}

/** Pixel of `value` along band centres whose values run evenly from values[0] to values[n−1]. */
function along(values: Float64Array, value: number, first: number, last: number): number | null {
  const n = values.length;
  const lo = values[0];
  const hi = values[n - 1];
  if (n === 1) return Math.abs(value - lo) < 1e-9 ? first : null;
  const t = (value - lo) / (hi - lo);
  if (!(t >= -1e-9 && t <= 1 + 1e-9)) return null;
  return first + t * (last - first);
}

export function buildHeatmap(
  result: SweepResult,
  width: number,
  units: UnitSystem,
  current?: { axis: number; parameter: number },
): HeatmapModel {
  const margin = { top: 12, right: 12, bottom: 48, left: 84 };
  const plotWidth = Math.max(100, width - margin.left - margin.right);
  const cellH = Math.max(6, Math.min(22, 420 / result.rows));
  const plotHeight = cellH * result.rows;
  const height = plotHeight + margin.top + margin.bottom;
  const x = scaleBand<number>()
    .domain(Array.from({ length: result.cols }, (_, j) => j))
    .range([margin.left, margin.left + plotWidth]);
  // Row 0 (smallest parameter) at the bottom.
  const y = scaleBand<number>()
    .domain(Array.from({ length: result.rows }, (_, i) => result.rows - 1 - i))
    .range([margin.top, margin.top + plotHeight]);
  const paramName = `layer ${result.parameter.layer} ${result.parameter.kind}`;
  const cellAt = (row: number, col: number): HeatCell => {
    const index = row * result.cols + col;
    const state = cellState(result.status[index]);
    const e = result.depthError[index];
    const depthError = Number.isFinite(e) ? e : null;
    const axisValue = result.axis.values[col];
    const parameterValue = result.parameter.values[row];
    const verdict =
      state === "invalid"
        ? "interfaces cross: not a valid model"
        : state === "pending"
          ? "not computed"
          : state;
    const errorText =
      depthError === null
        ? "no depth interpreted"
        : `depth error ${formatSigned("length", depthError, units)}`;
    return {
      row,
      col,
      x: x(col) ?? 0,
      y: y(row) ?? 0,
      w: x.bandwidth(),
      h: y.bandwidth(),
      state,
      fill: CELL_FILL[state],
      axisValue,
      parameterValue,
      depthError,
      readout:
        `${result.axis.kind} ${axisText(result.axis.kind, axisValue, units)} · ` +
        `${paramName} ${parameterText(result.parameter, parameterValue, units)} → ${verdict}; ${errorText}`,
    };
  };
  const cellFromPoint = (px: number, py: number): HeatCell | null => {
    const col = Math.floor((px - margin.left) / x.bandwidth());
    const fromTop = Math.floor((py - margin.top) / y.bandwidth());
    if (!(col >= 0 && col < result.cols && fromTop >= 0 && fromTop < result.rows)) return null;
    return cellAt(result.rows - 1 - fromTop, col);
  };
  let all: HeatCell[] | null = null;
  const every = (n: number, want: number) => Math.max(1, Math.ceil(n / want));
  const xStep = every(result.cols, 8);
  const yStep = every(result.rows, 8);
  const xTicks = Array.from(result.axis.values)
    .map((v, j) => ({ j, v }))
    .filter(({ j }) => j % xStep === 0)
    .map(({ j, v }) => ({
      px: (x(j) ?? 0) + x.bandwidth() / 2,
      label:
        result.axis.kind === "spacing"
          ? formatQuantity("length", v, units, 2).replace(` ${unitLabel("length", units)}`, "")
          : String(Math.round(v)),
    }));
  const yTicks = Array.from(result.parameter.values)
    .map((v, i) => ({ i, v }))
    .filter(({ i }) => i % yStep === 0)
    .map(({ i, v }) => ({
      px: (y(i) ?? 0) + y.bandwidth() / 2,
      label: parameterText(result.parameter, v, units),
    }));
  let marker: HeatmapModel["marker"] = null;
  if (current) {
    const mx = along(
      result.axis.values,
      current.axis,
      (x(0) ?? 0) + x.bandwidth() / 2,
      (x(result.cols - 1) ?? 0) + x.bandwidth() / 2,
    );
    const my = along(
      result.parameter.values,
      current.parameter,
      (y(0) ?? 0) + y.bandwidth() / 2,
      (y(result.rows - 1) ?? 0) + y.bandwidth() / 2,
    );
    if (mx !== null && my !== null) marker = { x: mx, y: my };
  }
  return {
    width,
    height,
    margin,
    rows: result.rows,
    cols: result.cols,
    plot: { x: margin.left, y: margin.top, width: plotWidth, height: plotHeight },
    cellAt,
    cellFromPoint,
    get cells() {
      if (!all) {
        all = [];
        for (let row = 0; row < result.rows; row++)
          for (let col = 0; col < result.cols; col++) all.push(cellAt(row, col));
      }
      return all;
    },
    marker,
    xTicks,
    yTicks,
    xLabel:
      result.axis.kind === "spacing"
        ? `Geophone spacing (${unitLabel("length", units)})`
        : "Channels",
    yLabel: `Layer ${result.parameter.layer} ${result.parameter.kind} (${unitLabel(
      result.parameter.kind === "thickness" ? "length" : "velocity",
      units,
    )})`,
  };
}

const rgbOf = (hex: string): [number, number, number] => [
  parseInt(hex.slice(1, 3), 16),
  parseInt(hex.slice(3, 5), 16),
  parseInt(hex.slice(5, 7), 16),
];

/**
 * The cells as an image, one pixel per cell (row 0 at the bottom), as a data URL for an SVG
 * `<image>` scaled over the plot; null where no canvas can be drawn (jsdom), in which case the
 * component draws one rectangle per cell instead.
 */
export function heatmapImage(result: SweepResult): string | null {
  if (typeof document === "undefined" || /jsdom/i.test(navigator.userAgent)) return null;
  const canvas = document.createElement("canvas");
  canvas.width = result.cols;
  canvas.height = result.rows;
  const context = canvas.getContext("2d");
  if (!context) return null;
  const image = context.createImageData(result.cols, result.rows);
  const colours = new Map<number, [number, number, number]>();
  for (let row = 0; row < result.rows; row++) {
    const line = (result.rows - 1 - row) * result.cols;
    for (let col = 0; col < result.cols; col++) {
      const code = result.status[row * result.cols + col];
      let rgb = colours.get(code);
      if (!rgb) {
        rgb = rgbOf(CELL_FILL[cellState(code)]);
        colours.set(code, rgb);
      }
      const at = (line + col) * 4;
      image.data[at] = rgb[0];
      image.data[at + 1] = rgb[1];
      image.data[at + 2] = rgb[2];
      image.data[at + 3] = 255;
    }
  }
  context.putImageData(image, 0, 0);
  return canvas.toDataURL("image/png");
}
