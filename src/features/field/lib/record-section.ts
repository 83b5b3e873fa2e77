/**
 * Drawing transforms of the record section (pure functions, no DOM): traces side by side in
 * channel order, time increasing downwards; each trace as a wiggle with its positive lobes
 * filled (variable area). Gain multiplies the normalised amplitude; clip limits the deflection
 * to a number of trace spacings. Units: CSS pixels, seconds.
 */

export interface Margins {
  left: number;
  right: number;
  top: number;
  bottom: number;
}

export const DEFAULT_MARGINS: Margins = { left: 56, right: 16, top: 34, bottom: 14 };

export interface SectionLayout {
  width: number;
  height: number;
  margins: Margins;
  traces: number;
  /** Time window shown, s: [top, bottom]. */
  window: [number, number];
  /** Pixels between neighbouring traces. */
  spacing: number;
  /** Centre line of trace i (0-based), px. */
  traceX(i: number): number;
  /** Vertical pixel of a time, s. */
  timeY(t: number): number;
  /** Time, s, of a vertical pixel. */
  yTime(y: number): number;
}

/**
 * Geometry of a record section of `traces` traces in a canvas of `width` × `height` px,
 * showing the time window `window` (s).
 * @throws RangeError for a non-positive size, no traces or an empty window
 */
export function sectionLayout(options: {
  width: number;
  height: number;
  traces: number;
  window: [number, number];
  margins?: Margins;
}): SectionLayout {
  const { width, height, traces, window } = options;
  const margins = options.margins ?? DEFAULT_MARGINS;
  if (!(width > 0 && height > 0)) throw new RangeError("the section needs a positive size");
  if (!(Number.isInteger(traces) && traces >= 1)) throw new RangeError("the section needs traces");
  const [t0, t1] = window;
  if (!(Number.isFinite(t0) && Number.isFinite(t1) && t1 > t0)) {
    throw new RangeError("the time window must run forwards");
  }
  const plotWidth = Math.max(1, width - margins.left - margins.right);
  const plotHeight = Math.max(1, height - margins.top - margins.bottom);
  const spacing = plotWidth / traces;
  const scale = plotHeight / (t1 - t0);
  return {
    width,
    height,
    margins,
    traces,
    window: [t0, t1],
    spacing,
    traceX: (i) => margins.left + (i + 0.5) * spacing,
    timeY: (t) => margins.top + (t - t0) * scale,
    yTime: (y) => t0 + (y - margins.top) / scale,
  };
}

/** Largest absolute sample value (0 for an empty or silent trace). */
export function peakAmplitude(samples: ArrayLike<number>): number {
  let peak = 0;
  for (let i = 0; i < samples.length; i++) {
    const a = Math.abs(samples[i]);
    if (a > peak && Number.isFinite(a)) peak = a;
  }
  return peak;
}

export interface WiggleStyle {
  /** Amplitude multiplier (1 = the normalising peak spans one trace spacing). */
  gain: number;
  /** Largest deflection, in trace spacings (e.g. 1). */
  clip: number;
  /** Amplitude that counts as 1 (the trace's own peak, or the record's). */
  norm: number;
}

/** Horizontal deflection, px, of a sample value: gain-scaled, clipped to ±clip spacings. */
export function deflection(value: number, style: WiggleStyle, spacing: number): number {
  if (!(style.norm > 0) || !Number.isFinite(value)) return 0;
  const d = (value / style.norm) * style.gain * spacing;
  const limit = style.clip * spacing;
  return Math.max(-limit, Math.min(limit, d));
}

export interface TraceTiming {
  /** Sample interval, s. */
  sampleInterval: number;
  /** Time of the first sample, s. */
  delay: number;
}

export interface WigglePaths {
  /** The wiggle polyline as [x0, y0, x1, y1, …]. */
  line: number[];
  /** Filled positive lobes, each a closed polygon as [x0, y0, …] (baseline to curve and back). */
  fills: number[][];
}

/** Sample index range that covers the time window, one sample of margin each side. */
export function visibleSamples(
  count: number,
  timing: TraceTiming,
  window: [number, number],
): [number, number] {
  const from = Math.floor((window[0] - timing.delay) / timing.sampleInterval) - 1;
  const to = Math.ceil((window[1] - timing.delay) / timing.sampleInterval) + 1;
  return [Math.max(0, from), Math.min(count - 1, to)];
}

/**
 * The wiggle and variable-area polygons of trace `index` in the layout. Lobes are split at
 * zero crossings (linear interpolation), so the fill meets the baseline exactly.
 */
export function wigglePaths(
  samples: ArrayLike<number>,
  timing: TraceTiming,
  layout: SectionLayout,
  index: number,
  style: WiggleStyle,
): WigglePaths {
  const line: number[] = [];
  const fills: number[][] = [];
  if (samples.length === 0) return { line, fills };
  const x0 = layout.traceX(index);
  const [from, to] = visibleSamples(samples.length, timing, layout.window);
  let lobe: number[] | null = null;
  let prevD = 0;
  let prevY = 0;
  for (let i = from; i <= to; i++) {
    const y = layout.timeY(timing.delay + i * timing.sampleInterval);
    const d = deflection(samples[i], style, layout.spacing);
    line.push(x0 + d, y);
    if (i > from && prevD > 0 !== d > 0) {
      // Zero crossing between the previous sample and this one.
      const f = prevD / (prevD - d);
      const yc = prevY + f * (y - prevY);
      if (lobe) {
        lobe.push(x0, yc);
        fills.push(lobe);
        lobe = null;
      } else {
        lobe = [x0, yc];
      }
    } else if (i === from && d > 0) {
      lobe = [x0, y];
    }
    if (lobe && d > 0) lobe.push(x0 + d, y);
    prevD = d;
    prevY = y;
  }
  if (lobe) {
    lobe.push(x0, prevY);
    fills.push(lobe);
  }
  return { line, fills };
}

/** The trace and time under a pointer, or null outside the plot. */
export function pointerTarget(
  x: number,
  y: number,
  layout: SectionLayout,
): { trace: number; time: number } | null {
  const { margins, width, height } = layout;
  if (x < margins.left || x > width - margins.right) return null;
  if (y < margins.top || y > height - margins.bottom) return null;
  const trace = Math.min(
    layout.traces - 1,
    Math.max(0, Math.floor((x - margins.left) / layout.spacing)),
  );
  return { trace, time: layout.yTime(y) };
}

/** Time of the sample nearest to `time` on a trace of `count` samples, s. */
export function snapToSample(time: number, timing: TraceTiming, count: number): number {
  const i = Math.round((time - timing.delay) / timing.sampleInterval);
  const clamped = Math.max(0, Math.min(Math.max(0, count - 1), i));
  return timing.delay + clamped * timing.sampleInterval;
}

/**
 * Zooms the time window by `factor` (< 1 zooms in) about `anchor` (s), kept within `limits`.
 * The window never shrinks below `minSpan` s.
 */
export function zoomWindow(
  window: [number, number],
  factor: number,
  anchor: number,
  limits: [number, number],
  minSpan = 0.005,
): [number, number] {
  const span = Math.min(limits[1] - limits[0], Math.max(minSpan, (window[1] - window[0]) * factor));
  const a = Math.max(window[0], Math.min(window[1], anchor));
  const ratio = (a - window[0]) / (window[1] - window[0]);
  let start = a - ratio * span;
  start = Math.max(limits[0], Math.min(limits[1] - span, start));
  return [start, start + span];
}

/** Tick times for the time axis, s: about `count` round steps inside the window. */
export function timeTicks(window: [number, number], count = 8): number[] {
  const span = window[1] - window[0];
  if (!(span > 0)) return [];
  const raw = span / count;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * power).find((s) => s >= raw) ?? 10 * power;
  const ticks: number[] = [];
  for (let t = Math.ceil(window[0] / step) * step; t <= window[1] + 1e-12; t += step) {
    ticks.push(Number(t.toFixed(12)));
  }
  return ticks;
}
