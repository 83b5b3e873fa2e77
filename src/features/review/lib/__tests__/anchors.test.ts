import { describe, expect, it } from "vitest";
import { anchorKey, anchorLabel, anchorOptions, parseAnchorKey } from "../anchors";
import { planDocument } from "../../testing/fixtures";

describe("anchors", () => {
  it("round-trips through its key", () => {
    const anchor = { kind: "refractor", model: 0, index: 2 } as const;
    expect(parseAnchorKey(anchorKey(anchor))).toEqual(anchor);
    expect(parseAnchorKey("")).toBeNull();
    expect(parseAnchorKey("layer:x:1")).toBeNull();
  });

  it("labels layers, refractors and shots from the document, in the user's units", () => {
    expect(anchorLabel({ kind: "layer", model: 0, index: 1 }, planDocument)).toBe(
      "Layer 2 · clay lens",
    );
    expect(anchorLabel({ kind: "refractor", model: 0, index: 2 }, planDocument)).toBe(
      "Refractor · top of layer 3 (weathered sandstone)",
    );
    expect(anchorLabel({ kind: "shot", model: 0, index: 1 }, planDocument, "imperial")).toBe(
      "Shot 2 · 154.2 ft",
    );
  });

  it("says when the anchored layer is no longer in the plan", () => {
    expect(anchorLabel({ kind: "layer", model: 0, index: 7 }, planDocument)).toBe(
      "Layer 8 (no longer in the plan)",
    );
  });

  it("offers every layer, every refractor below the first layer, and every shot", () => {
    const groups = anchorOptions(planDocument);
    expect(groups.map((g) => g.group)).toEqual(["Ground model: Lens present", "Spread"]);
    expect(groups[0].options.map((o) => o.key)).toEqual([
      "layer:0:0",
      "layer:0:1",
      "layer:0:2",
      "refractor:0:1",
      "refractor:0:2",
    ]);
    expect(groups[1].options).toHaveLength(2);
  });
});
