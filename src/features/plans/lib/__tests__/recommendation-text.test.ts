import { describe, expect, it } from "vitest";
import {
  hiddenStatementInUnits,
  readingInUnits,
  recommendationSentence,
} from "../recommendation-text";

// The engine's sentence for the default plan (workers/engine/analysis.ts, combineModels).
const rec = {
  text: "Across 1 ground model: use spacing at most 5.16 m and shot branches reaching 20.7 m offset (6 channels at 5.16 m span 25.8 m).",
  maxSpacing: 5.1649,
  spreadLength: 20.66,
  channels: 6,
};

describe("recommendationSentence", () => {
  it("writes feet only, from the recommendation's own figures (issue 14: no '5.16 m (16.93 ft)')", () => {
    const text = recommendationSentence(rec, 3, "imperial");
    // 5.1649 m / 0.3048 = 16.945 ft; 20.66 m = 67.78 ft; 5 × 5.1649 m = 25.82 m = 84.73 ft (by hand).
    expect(text).toBe(
      "Across 1 ground model: use spacing at most 16.95 ft and shot branches reaching 67.78 ft offset (6 channels at 16.95 ft span 84.73 ft).",
    );
    expect(text).not.toMatch(/\d m\b/);
  });

  it("writes metres at the same precision as the figures line below it", () => {
    expect(recommendationSentence(rec, 3, "metric")).toBe(
      "Across 1 ground model: use spacing at most 5.16 m and shot branches reaching 20.66 m offset (6 channels at 5.16 m span 25.82 m).",
    );
  });

  it("keeps a roll-along lead and the sentences after it, in feet", () => {
    const text = recommendationSentence(
      {
        ...rec,
        text: "Across 1 ground model and 3 roll-along spreads (24 channels each, 2 shared, stations 1–68 from 0 m to 201 m): use any spacing and shot branches reaching 20.7 m offset (6 channels at 3 m span 15 m). The detailed results are for spread 1.",
        maxSpacing: null,
      },
      3,
      "imperial",
    );
    // 201 m / 0.3048 = 659.4 ft, written whole as the engine wrote 201; 3 m = 9.84 ft; 5 × 3 m = 15 m = 49.21 ft (by hand).
    expect(text).toBe(
      "Across 1 ground model and 3 roll-along spreads (24 channels each, 2 shared, stations 1–68 from 0 ft to 659 ft): use any spacing and shot branches reaching 67.78 ft offset (6 channels at 9.84 ft span 49.21 ft). The detailed results are for spread 1.",
    );
  });

  it("falls back to rewriting every length of an unknown sentence", () => {
    expect(
      readingInUnits("No spread can reveal layer 2 under 2.47 m of 2400 m/s rock.", "imperial"),
    ).toBe("No spread can reveal layer 2 under 8.10 ft of 7,874 ft/s rock.");
  });

  it("writes a hidden layer's minimum thickness from the refractor's figure, as the table does", () => {
    // 2.237 m = 7.34 ft (by hand); the engine's rounded "2.24 m" would read 7.35 ft.
    expect(
      hiddenStatementInUnits(
        "It would need to be at least 2.24 m thick to be resolved with this spread.",
        2.237,
        "imperial",
      ),
    ).toBe("It would need to be at least 7.34 ft thick to be resolved with this spread.");
  });

  it("writes a 2-D section's ranges in feet, the unit once, to the decimals the engine wrote", () => {
    // 12 m = 39.4 ft, 79.5 m = 260.8 ft; 32 m = 105 ft, 35 m = 115 ft; 1.5 m = 4.9 ft (by hand).
    expect(
      readingInUnits(
        "Layer 2 top from 12 to 79.5 m: use geophone spacing at most 1.5 m over 32–35 m.",
        "imperial",
      ),
    ).toBe(
      "Layer 2 top from 39.4 to 260.8 ft: use geophone spacing at most 4.9 ft over 105–115 ft.",
    );
  });
});
