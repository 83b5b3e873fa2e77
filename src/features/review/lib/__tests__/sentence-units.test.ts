import { describe, expect, it } from "vitest";
import { sentenceInUnits } from "../sentence-units";

describe("sentenceInUnits", () => {
  const sentence =
    "Use spacing at most 3.05 m and shot branches reaching 30 m offset (11 channels at 3.05 m). No spread can reveal layer 2 (blind) from first arrivals.";

  it("converts every length of an engine sentence to feet (1 ft = 0.3048 m, exact)", () => {
    expect(sentenceInUnits(sentence, "imperial")).toBe(
      "Use spacing at most 10.01 ft and shot branches reaching 98.4 ft offset (11 channels at 10.01 ft). No spread can reveal layer 2 (blind) from first arrivals.",
    );
  });

  it("leaves metric text, counts, layer numbers and velocities alone", () => {
    expect(sentenceInUnits(sentence, "metric")).toBe(sentence);
    expect(sentenceInUnits("layer 3 at 1550 m/s under 2 m of till", "imperial")).toBe(
      "layer 3 at 1550 m/s under 6.6 ft of till",
    );
  });
});
