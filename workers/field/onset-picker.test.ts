// The onset picker and the record-wide picking (first pass, neighbour pass, quality words) on
// seeded synthetic records with known onsets (__fixtures__/onset-record.ts: closed-form flat-layer
// first arrivals, Telford et al. 1990 §4.3; noise std = peak / (4·SNR) per trace). The targets
// are those of the issue this serves: at SNR ≥ 10 at least 95 % of picks within 1 ms or 2
// samples (whichever is larger) and none off by more than 5 ms. Tolerances are ours otherwise.
import { describe, expect, it } from "vitest";
import { pickOnset, traceNoise } from "./onset-picker";
import { pickRecord } from "./pick-record";
import { neighbourPrediction, pickQuality } from "./pick-quality";
import { onsetRecord } from "./__fixtures__/onset-record";
import { seededNormal } from "./__fixtures__/random";

const INTERVALS = [0.000125, 0.00025, 0.0005, 0.001];
const SHOTS = [-1, 23, 47]; // off-end, centre (no pre-trigger: the nearest onsets at 2 ms), far end

function statistics(snr: number, dt: number, seeds: number[]) {
  let n = 0;
  let within = 0;
  let gross = 0;
  let missing = 0;
  for (const seed of seeds) {
    for (const shot of SHOTS) {
      const rec = onsetRecord({ seed, snr, sampleInterval: dt, shot });
      const picks = pickRecord(rec, { method: "onset" });
      picks.forEach((p, i) => {
        n++;
        if (p.time === null) {
          missing++;
          return;
        }
        const e = Math.abs(p.time - rec.onsets[i]);
        if (e <= Math.max(0.001, 2 * dt)) within++;
        if (e > 0.005) gross++;
      });
    }
  }
  return { n, within: within / n, gross, missing };
}

describe("traceNoise", () => {
  it("estimates the standard deviation of white noise within 10 % (seeded simulation)", () => {
    for (const seed of [1, 2, 3]) {
      const normal = seededNormal(seed);
      const samples = new Float32Array(4000).map(() => 7 * normal());
      const sigma = traceNoise(samples, 0.00025)!;
      expect(sigma / 7).toBeGreaterThan(0.9);
      expect(sigma / 7).toBeLessThan(1.1);
    }
  });
});

describe("pickOnset", () => {
  it("picks a near trace whose onset comes 2 ms after the first sample (no pre-trigger)", () => {
    const rec = onsetRecord({ seed: 5, snr: 15, sampleInterval: 0.0005, shot: 23 });
    const near = rec.traces.findIndex((t) => Math.abs(t.receiverPosition - 23) === 1);
    expect(rec.onsets[near]).toBeCloseTo(0.002, 9); // 1 m at 500 m/s
    const r = pickOnset(rec.traces[near].samples, rec.traces[near]);
    expect(r.time).not.toBeNull();
    expect(Math.abs((r.time ?? 1) - rec.onsets[near])).toBeLessThanOrEqual(0.001);
  });

  it("finds nothing in pure noise and says why", () => {
    const normal = seededNormal(9);
    const samples = new Float32Array(1000).map(() => normal());
    const r = pickOnset(samples, { sampleInterval: 0.00025 });
    expect(r.time).toBeNull();
    if (r.time === null) expect(r.reason).toMatch(/no sample rises above 5 times the noise/);
  });
});

describe("pickRecord with the onset picker (the issue's targets)", () => {
  for (const snr of [10, 20]) {
    for (const dt of INTERVALS) {
      it(`SNR ${snr}, ${dt * 1000} ms sampling: ≥ 95 % within max(1 ms, 2 samples), none off by > 5 ms`, () => {
        const s = statistics(snr, dt, [1, 2, 3]);
        expect(s.within).toBeGreaterThanOrEqual(0.95);
        expect(s.gross).toBe(0);
        expect(s.missing).toBe(0);
      });
    }
  }

  it("SNR 4: the documented floor (measured 100 % within tolerance on these records; asserted ≥ 90 %, at most 1 % gross)", () => {
    for (const dt of INTERVALS) {
      const s = statistics(4, dt, [4, 5]);
      expect(s.within).toBeGreaterThanOrEqual(0.9);
      expect(s.gross).toBeLessThanOrEqual(Math.ceil(0.01 * s.n));
    }
  });

  it("searches around a predicted arrival: a loud early spike outside the window is ignored", () => {
    const rec = onsetRecord({ seed: 11, snr: 15, sampleInterval: 0.00025, shot: -1 });
    const k = 10;
    const trace = rec.traces[k];
    // a burst 15 ms before the first break (e.g. a passing vehicle)
    const at = Math.round((rec.onsets[k] - 0.015) / trace.sampleInterval);
    for (let i = at; i < at + 8; i++) trace.samples[i] += 5000 * (i % 2 ? 1 : -1);
    const blind = pickRecord({ traces: [trace] }, { method: "onset" })[0];
    expect(Math.abs((blind.time ?? 0) - rec.onsets[k])).toBeGreaterThan(0.01);
    const guided = pickRecord(
      { traces: [trace] },
      { method: "onset", options: { predicted: [rec.onsets[k] + 0.003] } },
    )[0];
    expect(Math.abs((guided.time ?? 1) - rec.onsets[k])).toBeLessThanOrEqual(0.001);
  });

  it("second pass: a trace spoiled by a burst is picked again from its neighbours and marked weak", () => {
    const rec = onsetRecord({ seed: 12, snr: 15, sampleInterval: 0.0005, shot: -1 });
    const k = 12;
    const trace = rec.traces[k];
    const at = Math.round((rec.onsets[k] - 0.02) / trace.sampleInterval);
    for (let i = at; i < at + 6; i++) trace.samples[i] += 3000 * (i % 2 ? 1 : -1);
    const picks = pickRecord(rec, { method: "onset" });
    expect(Math.abs((picks[k].time ?? 0) - rec.onsets[k])).toBeLessThanOrEqual(0.001);
    expect(picks[k].quality).toBe("weak");
    expect(picks.filter((p) => p.quality === "clear").length).toBeGreaterThanOrEqual(20);
  });

  it("marks a trace without a pick 'none' with a reason", () => {
    const rec = onsetRecord({ seed: 13, snr: 15, sampleInterval: 0.0005, shot: -1, channels: 6 });
    rec.traces[3].samples.fill(0);
    const picks = pickRecord(rec, { method: "onset" });
    expect(picks[3]).toMatchObject({ time: null, quality: "none" });
    expect(picks[3].reason).toBeTruthy();
  });
});

describe("pick quality words", () => {
  it("predicts from neighbours by interpolation and extrapolation (median)", () => {
    // straight first breaks t = 0.002 + x/1000: every guess is exact
    const xs = [0, 2, 4, 6, 8];
    const ts = xs.map((x) => 0.002 + x / 1000);
    expect(neighbourPrediction(xs, [ts[0], ts[1], null, ts[3], ts[4]], 2)).toBeCloseTo(ts[2], 12);
    expect(neighbourPrediction(xs, [null, null, ts[2], null, null], 0)).toBeNull();
  });

  it("calls a faint or off-trend pick weak, a missing one none", () => {
    expect(pickQuality(null, null, null, 0.00025)).toBe("none");
    expect(pickQuality(0.02, 1.5, 0, 0.00025)).toBe("weak");
    expect(pickQuality(0.02, 8, 0.004, 0.00025)).toBe("weak");
    expect(pickQuality(0.02, 8, 0.0005, 0.00025)).toBe("clear");
  });
});
