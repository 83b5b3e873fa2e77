import { describe, expect, it } from "vitest";
import {
  deflection,
  peakAmplitude,
  pointerTarget,
  sectionLayout,
  snapToSample,
  timeTicks,
  visibleSamples,
  wigglePaths,
  zoomWindow,
} from "../record-section";

const margins = { left: 50, right: 10, top: 20, bottom: 10 };
const layout = sectionLayout({ width: 460, height: 230, traces: 4, window: [0, 0.2], margins });

describe("sectionLayout", () => {
  it("spreads traces evenly across the plot and maps time downwards", () => {
    expect(layout.spacing).toBe(100);
    expect(layout.traceX(0)).toBe(100);
    expect(layout.traceX(3)).toBe(400);
    expect(layout.timeY(0)).toBe(20);
    expect(layout.timeY(0.2)).toBe(220);
    expect(layout.yTime(120)).toBeCloseTo(0.1, 12);
  });

  it("throws when the window does not run forwards", () => {
    expect(() => sectionLayout({ width: 100, height: 100, traces: 2, window: [0.1, 0.1] })).toThrow(
      RangeError,
    );
    expect(() => sectionLayout({ width: 100, height: 100, traces: 0, window: [0, 1] })).toThrow(
      RangeError,
    );
  });
});

describe("deflection", () => {
  const style = { gain: 1, clip: 1, norm: 10 };
  it("scales by gain over the normalising amplitude, in trace spacings", () => {
    expect(deflection(5, style, 100)).toBe(50);
    expect(deflection(-5, { ...style, gain: 2 }, 100)).toBe(-100);
  });
  it("clips to the chosen number of spacings", () => {
    expect(deflection(50, style, 100)).toBe(100);
    expect(deflection(-50, { ...style, clip: 0.5 }, 100)).toBe(-50);
  });
  it("gives 0 for a silent trace or a non-finite value", () => {
    expect(deflection(3, { ...style, norm: 0 }, 100)).toBe(0);
    expect(deflection(Number.NaN, style, 100)).toBe(0);
  });
});

describe("wigglePaths", () => {
  const timing = { sampleInterval: 0.05, delay: 0 };
  const style = { gain: 1, clip: 1, norm: 1 };

  it("draws one point per sample and fills only positive lobes, closed on the baseline", () => {
    const samples = [0, 1, 0.5, -1, -0.5, 1];
    const paths = wigglePaths(samples, timing, layout, 1, style);
    const x0 = layout.traceX(1);
    // Samples 0..4 lie in the window [0, 0.2] plus one of margin; sample 5 (0.25 s) is the margin.
    expect(paths.line.length / 2).toBe(6);
    expect(paths.line[2]).toBe(x0 + 100);
    expect(paths.fills).toHaveLength(2);
    const first = paths.fills[0];
    // Every lobe starts and ends on the baseline.
    expect(first[0]).toBe(x0);
    expect(first[first.length - 2]).toBe(x0);
    // The zero crossing between samples 2 (+0.5) and 3 (−1) sits a third of the way: t = 0.1 + 0.05/3.
    expect(first[first.length - 1]).toBeCloseTo(layout.timeY(0.1 + 0.05 / 3), 9);
    for (let k = 0; k < first.length; k += 2) expect(first[k]).toBeGreaterThanOrEqual(x0);
  });

  it("returns nothing for an empty trace", () => {
    expect(wigglePaths([], timing, layout, 0, style)).toEqual({ line: [], fills: [] });
  });

  it("keeps only the samples near the window", () => {
    expect(visibleSamples(1000, { sampleInterval: 0.001, delay: 0.01 }, [0.1, 0.2])).toEqual([
      89, 191,
    ]);
    expect(visibleSamples(50, { sampleInterval: 0.001, delay: 0 }, [0, 1])).toEqual([0, 49]);
  });
});

describe("picking by pointer", () => {
  it("finds the trace and time under the pointer, nothing outside the plot", () => {
    expect(pointerTarget(255, 120, layout)).toEqual({ trace: 2, time: 0.1 });
    expect(pointerTarget(40, 120, layout)).toBeNull();
    expect(pointerTarget(255, 10, layout)).toBeNull();
  });

  it("snaps a time to the nearest sample within the trace", () => {
    const timing = { sampleInterval: 0.00025, delay: -0.002 };
    // (0.03011 + 0.002) / 0.00025 = 128.44 samples → sample 128 at 0.030 s.
    expect(snapToSample(0.03011, timing, 800)).toBeCloseTo(0.03, 12);
    expect(snapToSample(-1, timing, 800)).toBeCloseTo(-0.002, 12);
    expect(snapToSample(5, timing, 800)).toBeCloseTo(-0.002 + 799 * 0.00025, 12);
  });
});

describe("zoom and ticks", () => {
  it("halves the window about an anchor and stays inside the record", () => {
    const [z0, z1] = zoomWindow([0, 0.2], 0.5, 0.1, [0, 0.2]);
    expect(z0).toBeCloseTo(0.05, 12);
    expect(z1).toBeCloseTo(0.15, 12);
    const [a, b] = zoomWindow([0, 0.1], 0.5, 0, [0, 0.2]);
    expect(a).toBe(0);
    expect(b).toBeCloseTo(0.05, 12);
    expect(zoomWindow([0.05, 0.15], 4, 0.1, [0, 0.2])).toEqual([0, 0.2]);
    const [c, d] = zoomWindow([0, 0.01], 0.01, 0.005, [0, 0.2]);
    expect(d - c).toBeCloseTo(0.005, 12);
  });

  it("puts round ticks inside the window", () => {
    expect(timeTicks([0, 0.2], 8)).toEqual([0, 0.05, 0.1, 0.15, 0.2]);
    expect(timeTicks([0.013, 0.047], 4)).toEqual([0.02, 0.03, 0.04]);
    expect(timeTicks([1, 1])).toEqual([]);
  });

  it("finds a trace's peak amplitude, ignoring non-finite samples", () => {
    expect(peakAmplitude([1, -7, 3, Number.POSITIVE_INFINITY])).toBe(7);
    expect(peakAmplitude([])).toBe(0);
  });
});
