import { describe, expect, it } from "vitest";
import { parsePlan, type Plan } from "@engine";
import { createModeller } from "./modeller";

function plan(input: unknown): Plan {
  const r = parsePlan(input);
  if (!r.ok) throw new Error(r.issues.join("\n"));
  return r.plan;
}

describe("modeller facade: sectionReading without a Worker", () => {
  it("reads a flat section on this thread at the closed-form depth", async () => {
    // Plus-minus on a flat refractor gives its depth h (Hagedoorn 1959; Telford et al. 1990 §4.3).
    const m = createModeller({ createWorker: null });
    const p = plan({
      format: "spreadsight-plan/2",
      name: "flat",
      models: [
        {
          kind: "section",
          name: "flat",
          surface: [
            [-5, 50],
            [75, 50],
          ],
          layers: [
            {
              velocity: 600,
              base: [
                [-5, 46],
                [75, 46],
              ],
            },
            { velocity: 2400 },
          ],
        },
      ],
      spread: {
        spacing: 3,
        channels: 24,
        firstGeophone: 0,
        shots: [{ position: 0 }, { position: 69 }],
      },
    });
    const reading = await m.sectionReading(p, 0);
    m.dispose();
    const pm = reading.readings[0];
    expect(pm.method).toBe("plus-minus");
    const depths = pm.interfaces[0].points.map((q) => q.depth);
    expect(depths.length).toBeGreaterThan(3);
    for (const d of depths) expect(Math.abs(d - 4)).toBeLessThanOrEqual(0.3);
  });

  it("rejects a model index that is not a section", async () => {
    const m = createModeller({ createWorker: null });
    const p = plan({
      name: "layered",
      models: [{ name: "l", layers: [{ velocity: 500, thickness: 4 }, { velocity: 2000 }] }],
      spread: { spacing: 3, channels: 12, firstGeophone: 0, shots: [{ position: 0 }] },
    });
    await expect(m.sectionReading(p, 0)).rejects.toThrow(/not a section model/);
    m.dispose();
  });
});
