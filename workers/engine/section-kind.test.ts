import { describe, expect, it } from "vitest";
import type { ModelAnalysis } from "./analysis";
import { isSectionAnalysis } from "./section-kind";

// A plain tag check (our own convention, docs/plan-format.md): no physics to source.
describe("isSectionAnalysis", () => {
  it("is true only for an analysis tagged as a section", () => {
    expect(isSectionAnalysis({ kind: "section" } as unknown as ModelAnalysis)).toBe(true);
    expect(isSectionAnalysis({ name: "layered" } as unknown as ModelAnalysis)).toBe(false);
  });
});
