// First-break pickers on synthetic traces (seeded white noise plus a causal damped 80 Hz sine
// starting at a known onset; SNR = wavelet peak / noise standard deviation; 0.25 ms sampling).
// Methods: STA/LTA (Allen 1978), AIC (Maeda 1985), modified energy ratio (Han, Wong & Bancroft
// 2009). The tolerances below are ours, chosen for hammer-source refraction work where a pick
// error of about 0.5–1 ms is common practice (from memory); each is named beside its check.
import { describe, expect, it } from "vitest";
import { pickAic } from "./aic-picker";
import { pickEnergyRatio } from "./energy-ratio-picker";
import { pickRecord, pickTrace } from "./pick-record";
import { pickStaLta } from "./sta-lta-picker";
import { syntheticTrace } from "./__fixtures__/synthetic-trace";
import type { PickResult } from "./pick-window";

const SEEDS = Array.from({ length: 20 }, (_, i) => i + 1);

function traceFor(seed: number, snr: number) {
  // Onsets from 50 to 128 ms; every other trace has a 10 ms pre-trigger (DELAY = -0.01 s).
  return syntheticTrace({
    seed,
    snr,
    onset: 0.05 + (seed % 7) * 0.013,
    delay: seed % 2 ? -0.01 : 0,
  });
}

function errorMs(result: PickResult, onset: number): number {
  if (result.time === null) throw new Error(`no pick: ${result.reason}`);
  return (result.time - onset) * 1000;
}

describe("pickAic", () => {
  // Tolerance: ±1 ms (4 samples) at SNR ≥ 10, ±2.5 ms at SNR 5 and 3, in a window from 30 ms
  // before to 20 ms after the onset.
  for (const [snr, tolerance] of [
    [20, 1],
    [10, 1],
    [5, 2.5],
    [3, 2.5],
  ] as const) {
    it(`picks within ±${tolerance} ms of the onset at SNR ${snr}`, () => {
      for (const seed of SEEDS) {
        const tr = traceFor(seed, snr);
        const result = pickAic(tr.samples, {
          sampleInterval: tr.sampleInterval,
          delay: tr.delay,
          search: [tr.onset - 0.03, tr.onset + 0.02],
        });
        expect(Math.abs(errorMs(result, tr.onset))).toBeLessThanOrEqual(tolerance);
      }
    });
  }

  it("finds no onset in pure noise", () => {
    for (let seed = 100; seed < 150; seed++) {
      const tr = syntheticTrace({ seed, snr: null });
      const result = pickAic(tr.samples, { sampleInterval: tr.sampleInterval });
      expect(result.time).toBeNull();
    }
  });

  it("reports the pick on the record clock: sample time plus DELAY", () => {
    const samples = new Float32Array(400);
    for (let i = 200; i < 400; i++) samples[i] = (i % 2 ? 1 : -1) * 100;
    for (let i = 0; i < 200; i++) samples[i] = (i % 3) - 1;
    const result = pickAic(samples, { sampleInterval: 0.0005, delay: -0.02 });
    expect(result).toEqual({ sample: 200, time: -0.02 + 200 * 0.0005 });
  });

  it("gives a reason for a flat trace, a window outside the trace and a non-finite sample", () => {
    expect(pickAic(new Float32Array(100), { sampleInterval: 0.001 })).toMatchObject({
      time: null,
      reason: "the trace is flat in the search window",
    });
    expect(pickAic(new Float32Array(100), { sampleInterval: 0.001, search: [1, 2] })).toMatchObject(
      { time: null, reason: "the search window lies outside the trace" },
    );
    const bad = new Float32Array(100);
    bad[5] = Number.NaN;
    expect(pickAic(bad, { sampleInterval: 0.001 })).toMatchObject({
      time: null,
      reason: "sample 6 is not a finite number",
    });
  });

  it("throws a RangeError for a non-positive sample interval or a reversed window", () => {
    expect(() => pickAic(new Float32Array(10), { sampleInterval: 0 })).toThrow(RangeError);
    expect(() =>
      pickAic(new Float32Array(10), { sampleInterval: 0.001, search: [0.5, 0.1] }),
    ).toThrow(RangeError);
  });
});

describe("pickStaLta", () => {
  // Tolerance for the raw trigger: it may not precede the onset by more than 0.5 ms and lags
  // it by at most the short-term window (4 ms) plus 1 ms.
  for (const snr of [20, 10, 5]) {
    it(`triggers between 0.5 ms before and 5 ms after the onset at SNR ${snr}`, () => {
      for (const seed of SEEDS) {
        const tr = traceFor(seed, snr);
        const e = errorMs(
          pickStaLta(tr.samples, { sampleInterval: tr.sampleInterval, delay: tr.delay }),
          tr.onset,
        );
        expect(e).toBeGreaterThanOrEqual(-0.5);
        expect(e).toBeLessThanOrEqual(5);
      }
    });

    // Tolerance with AIC refinement: ±2 ms.
    it(`with AIC refinement picks within ±2 ms of the onset at SNR ${snr}`, () => {
      for (const seed of SEEDS) {
        const tr = traceFor(seed, snr);
        const result = pickStaLta(tr.samples, {
          sampleInterval: tr.sampleInterval,
          delay: tr.delay,
          refine: "aic",
        });
        expect(Math.abs(errorMs(result, tr.onset))).toBeLessThanOrEqual(2);
      }
    });
  }

  it("does not trigger on pure noise at the default threshold of 4", () => {
    for (let seed = 200; seed < 260; seed++) {
      const tr = syntheticTrace({ seed, snr: null });
      const result = pickStaLta(tr.samples, { sampleInterval: tr.sampleInterval });
      expect(result.time).toBeNull();
      if (result.time === null) expect(result.reason).toMatch(/never reached the threshold 4/);
    }
  });

  it("triggers on pure noise when the threshold is set just above 1", () => {
    const tr = syntheticTrace({ seed: 7, snr: null });
    expect(
      pickStaLta(tr.samples, { sampleInterval: tr.sampleInterval, threshold: 1.2 }).time,
    ).not.toBeNull();
  });

  it("ignores an earlier, stronger event outside the search window", () => {
    const tr = traceFor(3, 10);
    const early = Math.round((0.02 - tr.delay) / tr.sampleInterval);
    for (let i = early; i < early + 20; i++) tr.samples[i] += 5000 * Math.sin(i);
    const outside = pickStaLta(tr.samples, { sampleInterval: tr.sampleInterval, delay: tr.delay });
    expect(errorMs(outside, 0.02)).toBeLessThan(5);
    const inside = pickStaLta(tr.samples, {
      sampleInterval: tr.sampleInterval,
      delay: tr.delay,
      search: [tr.onset - 0.02, tr.onset + 0.05],
    });
    expect(Math.abs(errorMs(inside, tr.onset))).toBeLessThanOrEqual(5);
  });

  it("uses plain energy as the characteristic function when asked", () => {
    const tr = traceFor(5, 20);
    const e = errorMs(
      pickStaLta(tr.samples, {
        sampleInterval: tr.sampleInterval,
        delay: tr.delay,
        characteristic: "energy",
      }),
      tr.onset,
    );
    expect(e).toBeGreaterThanOrEqual(-0.5);
    expect(e).toBeLessThanOrEqual(5);
  });

  it("gives a reason when the trace is too short for the windows", () => {
    const result = pickStaLta(new Float32Array(20), { sampleInterval: 0.001 });
    expect(result.time).toBeNull();
  });

  it("throws a RangeError for a threshold not above 1", () => {
    expect(() =>
      pickStaLta(new Float32Array(100), { sampleInterval: 0.001, threshold: 1 }),
    ).toThrow(RangeError);
  });
});

describe("pickEnergyRatio", () => {
  // Tolerance: ±1.5 ms at SNR 20 and 10.
  for (const snr of [20, 10]) {
    it(`picks within ±1.5 ms of the onset at SNR ${snr}`, () => {
      for (const seed of SEEDS) {
        const tr = traceFor(seed, snr);
        const result = pickEnergyRatio(tr.samples, {
          sampleInterval: tr.sampleInterval,
          delay: tr.delay,
        });
        expect(Math.abs(errorMs(result, tr.onset))).toBeLessThanOrEqual(1.5);
      }
    });
  }

  it("finds no onset in pure noise at the default energy ratio of 5", () => {
    for (let seed = 300; seed < 350; seed++) {
      const tr = syntheticTrace({ seed, snr: null });
      expect(pickEnergyRatio(tr.samples, { sampleInterval: tr.sampleInterval }).time).toBeNull();
    }
  });
});

describe("pickRecord", () => {
  it("picks every trace and keeps channel, receiver and source positions", () => {
    const traces = [0, 1, 2].map((k) => {
      const tr = syntheticTrace({ seed: 40 + k, snr: 20, onset: 0.04 + 0.01 * k });
      return {
        index: k,
        samples: tr.samples,
        sampleInterval: tr.sampleInterval,
        delay: tr.delay,
        channel: k === 2 ? null : 11 + k,
        receiverPosition: 5 * k,
        sourcePosition: -2,
      };
    });
    traces.push({
      ...traces[0],
      index: 3,
      channel: 20,
      samples: syntheticTrace({ seed: 9, snr: null }).samples,
    });
    const picks = pickRecord({ traces }, { method: "sta-lta", options: { refine: "aic" } });
    expect(picks.map((p) => p.channel)).toEqual([11, 12, 3, 20]);
    expect(picks.map((p) => p.receiverPosition)).toEqual([0, 5, 10, 0]);
    expect(picks.every((p) => p.sourcePosition === -2)).toBe(true);
    [0.04, 0.05, 0.06].forEach((onset, k) => {
      expect(Math.abs((picks[k].time ?? Number.NaN) - onset)).toBeLessThanOrEqual(0.002);
    });
    expect(picks[3].time).toBeNull();
    expect(picks[3].reason).toMatch(/never reached/);
  });

  it("runs the AIC and energy-ratio pickers through the same entry", () => {
    const tr = syntheticTrace({ seed: 77, snr: 20, onset: 0.07 });
    const trace = { index: 0, channel: 1, receiverPosition: 0, sourcePosition: 0, ...tr };
    for (const method of ["aic", "energy-ratio"] as const) {
      const result = pickTrace(trace, { method, options: { search: [0.04, 0.1] } });
      expect(Math.abs(errorMs(result, 0.07))).toBeLessThanOrEqual(1.5);
    }
  });
});
