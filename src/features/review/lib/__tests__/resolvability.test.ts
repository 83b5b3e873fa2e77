import { describe, expect, it } from "vitest";
import { analyzePlan } from "@engine";
import { resolvabilityOf, summarise } from "../resolvability";
import { planDocument } from "../../testing/fixtures";

describe("resolvabilityOf", () => {
  it("uses the stored summary when the revision has one", async () => {
    const stored = { ...summarise(analyzePlan(planDocument)), worstVerdict: "inverted" as const };
    const result = await resolvabilityOf(planDocument, stored);
    expect(result.source).toBe("stored");
    expect(result.worstVerdict).toBe("inverted");
  });

  it("analyses the document when there is no stored summary, matching the engine refractor by refractor", async () => {
    const analysis = analyzePlan(planDocument);
    const result = await resolvabilityOf(planDocument, null);
    expect(result.source).toBe("computed");
    expect(result.worstVerdict).toBe(analysis.worstStatus);
    const model = analysis.models[0];
    expect(result.models[0].refractors.map((r) => [r.layer, r.status, r.trueDepth])).toEqual(
      model.refractors.map((r) => [r.layer, r.status, r.depth]),
    );
    for (const r of result.models[0].refractors) {
      const seen = model.interpretation?.refractors.find((i) => i.layer === r.layer);
      expect(r.error).toBe(seen?.error ?? null);
    }
  });

  it("ignores a stored value that is not a revision summary", async () => {
    const result = await resolvabilityOf(planDocument, { format: "something-else", models: [] });
    expect(result.source).toBe("computed");
  });

  it("hands the analysis to the modeller it is given (the worker in the browser)", async () => {
    const asked: unknown[] = [];
    const result = await resolvabilityOf(planDocument, null, async (plan) => {
      asked.push(plan);
      return analyzePlan(plan);
    });
    expect(asked).toEqual([planDocument]);
    expect(result.source).toBe("computed");
  });
});
