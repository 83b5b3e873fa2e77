// The report's and the CSV export's interpreted section: the same interpretation as the
// screen and the command line, on closed-form picks (two flat layers, Telford, Geldart &
// Sheriff 1990 §4.3: t = x/v2 + 2h cos θ/v1, h = 6 m).
import { describe, expect, it } from "vitest";
import { interpretationCsv, interpretationSummary } from "./field-interpretation";

const v1 = 550;
const v2 = 2800;
const ti = (2 * 6 * Math.sqrt(1 - (v1 / v2) ** 2)) / v1;
const picks = [-1, 47].flatMap((s) =>
  Array.from({ length: 24 }, (_, k) => 2 * k).map((r) => {
    const x = Math.abs(r - s);
    return { sourcePosition: s, receiverPosition: r, time: Math.min(x / v1, x / v2 + ti) };
  }),
);
const plan = {
  models: [
    {
      name: "Dry sand over sandstone",
      layers: [{ velocity: 550, thickness: 6 }, { velocity: 2800 }],
    },
  ],
  criteria: { pickError: 0.0005 },
};

describe("interpretationSummary", () => {
  it("gives depths within 1 % of 6 m and names where the assignment came from", () => {
    const s = interpretationSummary(picks, plan);
    if (!s || !s.ok) throw new Error("no interpretation");
    expect(s.suggestedFrom).toBe("Dry sand over sandstone");
    expect(s.refractors[0].rows.length).toBeGreaterThan(5);
    for (const r of s.refractors[0].rows) expect(Math.abs(r.depth - 6) / 6).toBeLessThan(0.01);
    expect(s.misfits[0].layers[0].rms).toBeLessThan(0.06);
  });

  it("is null without picks and says why when nothing can be interpreted", () => {
    expect(interpretationSummary([], plan)).toBeNull();
    const oneSided = interpretationSummary(
      picks.filter((p) => p.sourcePosition === -1),
      plan,
    );
    expect(oneSided?.ok).toBe(true);
    if (oneSided?.ok) expect(oneSided.refractors).toEqual([]);
    if (oneSided?.ok) expect(oneSided.notes.join(" ")).toMatch(/no reversed pair/);
  });
});

describe("interpretationCsv", () => {
  it("writes one row per refractor and geophone under a fixed header", () => {
    const s = interpretationSummary(picks, plan);
    const lines = interpretationCsv(s).trimEnd().split("\r\n");
    expect(lines[0]).toBe(
      "layer,method,position_m,depth_m,elevation_m,sigma_m,velocity_m_s,phantom,datum_m",
    );
    expect(lines.length - 1).toBe(s?.ok ? s.refractors[0].rows.length : -1);
    const first = lines[1].split(",");
    expect(first[0]).toBe("2");
    expect(first[1]).toBe("plus-minus");
    expect(Math.abs(Number(first[3]) - 6)).toBeLessThan(0.06);
    expect(interpretationCsv(null).trimEnd()).toBe(lines[0]);
  });
});
