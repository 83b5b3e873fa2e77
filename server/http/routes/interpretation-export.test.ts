import { beforeAll, describe, expect, it } from "vitest";
import type { TeamApis } from "../../testing/plans";
import { planFixture } from "../../testing/exports";

// GET /api/plans/:id/interpretation.csv: the saved picks interpreted as the report does.
// Picks from the closed form for two flat layers (Telford, Geldart & Sheriff 1990 §4.3).

const fixture = planFixture();
let apis: TeamApis;
let planId: string;
beforeAll(() => {
  ({ apis, planId } = fixture);
});

describe("interpretation CSV export", () => {
  it("is a header only before picks are saved", async () => {
    const res = await apis.lead.get(`/api/plans/${planId}/interpretation.csv`);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toContain("text/csv");
    expect(res.headers["content-disposition"]).toMatch(/filename=\S+-rev1-interpretation\.csv/);
    expect(res.text.trimEnd()).toBe(
      "layer,method,position_m,depth_m,elevation_m,sigma_m,velocity_m_s,phantom,datum_m",
    );
  });

  it("carries the interpreted depths once reversed picks are saved (6 m within 1 %)", async () => {
    const ti = (2 * 6 * Math.sqrt(1 - (550 / 2800) ** 2)) / 550;
    const picks = [-1, 47].flatMap((s) =>
      Array.from({ length: 24 }, (_, k) => 2 * k).map((r) => {
        const x = Math.abs(r - s);
        return { sourcePosition: s, receiverPosition: r, time: Math.min(x / 550, x / 2800 + ti) };
      }),
    );
    const saved = await apis.lead.put(`/api/plans/${planId}/picks`).send({ picks, picker: "csv" });
    expect(saved.status).toBe(200);
    const res = await apis.reviewer.get(`/api/plans/${planId}/interpretation.csv`);
    expect(res.status).toBe(200);
    const rows = res.text
      .trimEnd()
      .split("\r\n")
      .slice(1)
      .map((l) => l.split(","));
    expect(rows.length).toBeGreaterThan(5);
    for (const r of rows) expect(Math.abs(Number(r[3]) - 6) / 6).toBeLessThan(0.01);
  });

  it("is refused to a trainee outside a sandbox, and with a query string", async () => {
    expect((await apis.trainee.get(`/api/plans/${planId}/interpretation.csv`)).status).toBe(403);
    expect((await apis.lead.get(`/api/plans/${planId}/interpretation.csv?x=1`)).status).toBe(400);
  });
});
