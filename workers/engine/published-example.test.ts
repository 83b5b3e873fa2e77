/**
 * External check against a published hidden-layer worked example:
 * Geldart & Sheriff (2004), Problems in Exploration Seismology and their Solutions (SEG),
 * problem 11.3 "Effect of a hidden layer". Its velocity–depth table (seven flat layers with two
 * low-velocity zones) is used as printed; the solution states that the 3650 m/s shale and the
 * 5000 m/s zone are hidden layers and gives the first-arrival window of the 5750 m/s head
 * wave as 1.30 km; the closed forms give 1.398 km (see the window test for what we could and
 * could not reproduce).
 */
import { describe, expect, it } from "vitest";
import { analyzePlan, parsePlan } from "./index";

const layers = [
  { velocity: 2650, thickness: 300 },
  { velocity: 5150, thickness: 120 },
  { velocity: 3650, thickness: 200 },
  { velocity: 5750, thickness: 170 },
  { velocity: 5000, thickness: 170 },
  { velocity: 5750, thickness: 240 },
  { velocity: 6400 },
];

const parsed = parsePlan({
  name: "Published hidden-layer example",
  models: [{ name: "seven flat layers", layers }],
  spread: { spacing: 25, channels: 480, firstGeophone: 25, shots: [{ position: 0 }] },
  criteria: { minGeophones: 2 },
});
if (!parsed.ok) throw new Error(parsed.issues.join("\n"));
const model = analyzePlan(parsed.plan).models[0];
const byLayer = (layer: number) => {
  const refractor = model.refractors.find((r) => r.layer === layer);
  if (!refractor) throw new Error(`no refractor for layer ${layer}`);
  return refractor;
};

/** Intercept time of the head wave on layer n (1-based), Telford et al. (1990) §4.3 eq. for flat layers. */
function interceptTime(n: number): number {
  const vn = layers[n - 1].velocity;
  let sum = 0;
  for (let i = 0; i < n - 1; i++) {
    const { velocity, thickness } = layers[i];
    sum += (2 * (thickness ?? 0) * Math.sqrt(1 - (velocity / vn) ** 2)) / velocity;
  }
  return sum;
}

describe("Geldart & Sheriff (2004) problem 11.3, effect of a hidden layer", () => {
  it("finds head waves on the 5150, 5750 and 6400 m/s layers with the closed-form intercept times", () => {
    for (const layer of [2, 4, 7]) {
      expect(byLayer(layer).headWave).toBe(true);
      expect(byLayer(layer).interceptTime).toBeCloseTo(interceptTime(layer), 9);
    }
  });

  it("calls the 3650 m/s shale and the 5000 m/s zone velocity inversions (the hidden layers)", () => {
    expect(byLayer(3).status).toBe("inverted");
    expect(byLayer(3).headWave).toBe(false);
    expect(byLayer(5).status).toBe("inverted");
    expect(byLayer(5).headWave).toBe(false);
  });

  it("gives the 5750 m/s head wave the first-arrival window of the closed forms (1.398 km)", () => {
    const segment = byLayer(4).segment;
    expect(segment).not.toBeNull();
    expect(segment!.to).not.toBeNull();
    const window = segment!.to! - segment!.from;
    // Closed-form crossover distances (Kearey et al. 2002 ch. 5) from the closed-form intercept
    // times above: the window is x47 − x24, which for the printed table is 1398.2 m.
    const x24 = (interceptTime(4) - interceptTime(2)) / (1 / 5150 - 1 / 5750);
    const x47 = (interceptTime(7) - interceptTime(4)) / (1 / 5750 - 1 / 6400);
    expect(segment!.from).toBeCloseTo(x24, 6);
    expect(segment!.to!).toBeCloseTo(x47, 6);
    expect(window).toBeCloseTo(x47 - x24, 6);
    expect(Math.abs(window - 1398.2)).toBeLessThan(0.5);
    // The printed solution says 1.30 km. We could not reproduce that figure: rounding the
    // intercept times to 1 ms moves the window to 1.436 km (away from 1.30), to 2 ms gives
    // 1.379 km; the printed value is most likely read off a plotted graph. So the test holds the
    // engine to the closed form above and only records that the printed value is 7 % below it.
    expect(Math.abs(window - 1300) / window).toBeGreaterThan(0.06);
    expect(Math.abs(window - 1300) / window).toBeLessThan(0.08);
  });

  it("reads the first refractor right and puts the refractors under the missed inversions too deep", () => {
    const interpreted = (layer: number) =>
      model.interpretation?.refractors.find((r) => r.layer === layer);
    expect(interpreted(2)!.interpretedDepth).toBeCloseTo(300, 6);
    // A missed velocity inversion makes the refractor below it look deeper (common practice;
    // the problem's own question is how large that error is).
    expect(interpreted(4)!.trueDepth).toBeCloseTo(620, 6);
    expect(interpreted(4)!.interpretedDepth).toBeGreaterThan(620 + 100);
    expect(interpreted(7)!.trueDepth).toBeCloseTo(1200, 6);
    expect(interpreted(7)!.interpretedDepth).toBeGreaterThan(1200 + 100);
  });
});
