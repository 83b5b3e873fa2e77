import { describe, expect, it } from "vitest";
import { applyChoices } from "../apply-choices";
import { threeLayerPlan } from "../../__tests__/fixtures";
import type { Spread } from "../engine";

// Geometry by hand: N channels at Δx span (N − 1)·Δx (common practice).
const spread = (spacing: number, channels: number, shots: Spread["shots"] = []): Spread => ({
  spacing,
  channels,
  firstGeophone: 0,
  shots: shots.length
    ? shots
    : [
        { position: -spacing / 2, anchor: { to: "start", offset: -spacing / 2 } },
        {
          position: (channels - 1) * spacing + spacing / 2,
          anchor: { to: "end", offset: spacing / 2 },
        },
      ],
});

const byChoice = (options: ReturnType<typeof applyChoices>) =>
  Object.fromEntries(options.map((o) => [o.choice, o]));

describe("applyChoices", () => {
  it("never coarsens a working 3 m design (issue 14: 3 m → 5 m)", () => {
    const o = byChoice(
      applyChoices(spread(3, 39), { maxSpacing: 5.2, spreadLength: 100 }, "metric"),
    );
    expect(o["keep-spacing"].spacing).toBe(3);
    expect(o["keep-length"].spacing).toBe(3);
    expect(o["keep-channels"].spacing).toBe(3);
    expect(o.recommended.spacing).toBe(3);
    for (const option of Object.values(o)) expect(option.flags.join(" ")).not.toMatch(/Coarser/);
  });

  it("follows the recommendation: the finer spacing and channels reaching the needed offset", () => {
    const o = byChoice(
      applyChoices(spread(5, 24), { maxSpacing: 2.6, spreadLength: 140 }, "metric"),
    );
    // 2.6 m rounds down to 2.5 m; 140 m / 2.5 m = 56 intervals = 57 channels (by hand).
    expect(o.recommended.spacing).toBe(2.5);
    expect(o.recommended.channels).toBe(57);
    expect(o.recommended.flags.some((f) => /more than the seismograph's 48/.test(f))).toBe(true);
  });

  it("keeps the spacing by adding channels that reach the needed offset", () => {
    const o = byChoice(
      applyChoices(spread(2, 24), { maxSpacing: 2.5, spreadLength: 80 }, "metric"),
    );
    // 80 m at 2 m = 40 intervals = 41 channels (by hand).
    expect(o["keep-spacing"].channels).toBe(41);
    expect(o["keep-spacing"].consequence).toBe(
      "17 more channels: 41 at 2.00 m span 80.00 m (80.00 m needed).",
    );
  });

  it("says a coarser kept spacing may be under-sampled, not that it is (a resolved 8 m × 12 design)", () => {
    // 8 m is coarser than the 5.16 m guarantee, yet the plan's verdict can be resolved where the
    // geophones happen to fall (seen in Chromium, issue 14 QA): the line must not contradict it.
    const o = byChoice(
      applyChoices(spread(8, 12), { maxSpacing: 5.16, spreadLength: 20.66 }, "metric"),
    );
    expect(o["keep-spacing"].consequence).toMatch(
      /coarser than the 5\.16 m .*may be under-sampled/,
    );
    expect(o["keep-spacing"].consequence).not.toMatch(/stays under-sampled/);
  });

  it("keeps the spread length at the finer recommended spacing and says when it falls short", () => {
    const o = byChoice(
      applyChoices(spread(5, 24), { maxSpacing: 2.6, spreadLength: 140 }, "metric"),
    );
    // 115 m at 2.5 m = 46 intervals = 47 channels; 140 − 115 = 25 m short (by hand).
    expect(o["keep-length"].spacing).toBe(2.5);
    expect(o["keep-length"].channels).toBe(47);
    expect(o["keep-length"].consequence).toMatch(/25\.00 m short of the 140\.00 m needed/);
  });

  it("keeps the channel count and flags a coarser spacing when the length needs it", () => {
    const o = byChoice(applyChoices(spread(2, 12), { maxSpacing: 3, spreadLength: 60 }, "metric"));
    // 60 m over 11 intervals = 5.4545… m, rounded up to 5.46 m (by hand).
    expect(o["keep-channels"].channels).toBe(12);
    expect(o["keep-channels"].spacing).toBeCloseTo(5.46, 9);
    expect(o["keep-channels"].flags).toContain("Coarser than the plan's 2.00 m spacing.");
    expect(o["keep-channels"].consequence).toMatch(/coarser than the 3\.00 m needed/);
  });

  it("flags an impractical spacing and more channels than the seismograph (issue 14: 0.087 m, 211 channels)", () => {
    const o = byChoice(
      applyChoices(spread(1, 24), { maxSpacing: 0.087, spreadLength: 18.3 }, "metric"),
    );
    const fine = o["keep-length"];
    expect(fine.spacing).toBeLessThan(0.25);
    expect(fine.flags.some((f) => /impractical to lay out/.test(f))).toBe(true);
    expect(fine.channels).toBeGreaterThan(48);
    expect(fine.flags.some((f) => /more than the seismograph's 48/.test(f))).toBe(true);
    // A 24-channel recorder as the team setting flags the keep-spacing option too.
    const small = byChoice(
      applyChoices(spread(1, 24), { maxSpacing: 1, spreadLength: 40 }, "metric", 24),
    );
    expect(small["keep-spacing"].channels).toBe(41);
    expect(small["keep-spacing"].flags.some((f) => /seismograph's 24/.test(f))).toBe(true);
  });

  it("moves anchored shots with the new spread and leaves fixed ones", () => {
    const plan = threeLayerPlan();
    const s = spread(5, 24, [
      { position: 117.5, anchor: { to: "end", offset: 2.5 } },
      { position: 40 },
    ]);
    const o = byChoice(applyChoices(s, { maxSpacing: 5, spreadLength: 200 }, "metric"));
    const k = o["keep-spacing"];
    expect(k.shots).toEqual([(k.channels - 1) * 5 + 2.5, 40]);
    expect(plan.spread.shots).toHaveLength(2);
  });

  it("rounds spacings in the user's feet", () => {
    const o = byChoice(
      applyChoices(spread(3.048, 24), { maxSpacing: 2, spreadLength: 60 }, "imperial"),
    );
    // 2 m = 6.56 ft → 6 ft = 1.8288 m (whole steps between 5 and 20 display units).
    expect(o["keep-length"].spacing).toBeCloseTo(6 * 0.3048, 12);
  });
});
