// The report follows the requesting user's units (their preference, or `?units=`); the CSV
// exports stay SI. 1 ft = 0.3048 m exactly, so the example's 2 m spacing is 6.56 ft.
import { beforeAll, describe, expect, it } from "vitest";
import type { TeamApis } from "../../testing/plans";
import { binary, hasTool, pdfText as pdfLayoutText, planFixture } from "../../testing/exports";

const fixture = planFixture({ teamName: "Rowan Test Surveys", slug: "rowan" });
let apis: TeamApis;
let planId: string;
beforeAll(async () => {
  ({ apis, planId } = fixture);
  const prefs = await apis.lead.put("/api/me/preferences").send({ units: "imperial" });
  expect(prefs.status).toBeLessThan(300);
});

/** The report's text laid out as on the page. */
const pdfText = (bytes: Buffer) => pdfLayoutText(bytes, { layout: true });

describe("report units", () => {
  it("refuses an unknown units value, naming the parameter", async () => {
    const response = await apis.lead.get(`/api/plans/${planId}/report.pdf?units=yards`);
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe("invalid_input");
    expect(JSON.stringify(response.body.error)).toContain("units must be metric or imperial");
  });

  it.skipIf(!hasTool("pdftotext"))(
    "writes feet for a user who prefers feet, metres when asked (pdftotext; skipped where poppler-utils is missing)",
    async () => {
      const feet = await binary(apis.lead.get(`/api/plans/${planId}/report.pdf`));
      expect(feet.status).toBe(200);
      const feetText = pdfText(feet.body as Buffer);
      expect(feetText).toContain("6.56 ft spacing");
      expect(feetText).toContain("Velocity (ft/s)");

      const metres = await binary(apis.lead.get(`/api/plans/${planId}/report.pdf?units=metric`));
      expect(metres.status).toBe(200);
      const metresText = pdfText(metres.body as Buffer);
      expect(metresText).toContain("2 m spacing");
      expect(metresText).toContain("Velocity (m/s)");

      // Another user of the team without a preference reads metres.
      const reviewer = pdfText(
        (await binary(apis.reviewer.get(`/api/plans/${planId}/report.pdf`))).body as Buffer,
      );
      expect(reviewer).toContain("2 m spacing");
    },
  );

  it("keeps the station CSV in SI with the unit in the column name for a feet user", async () => {
    const csv = await apis.lead.get(`/api/plans/${planId}/stations.csv`);
    expect(csv.status).toBe(200);
    const [header, first, second] = csv.text.split("\r\n");
    expect(header).toContain("position_m");
    // The example's geophones every 2 m from 0 (docs/examples/two-layer-simple.json).
    const at = header.split(",").indexOf("position_m");
    expect(Number(second.split(",")[at]) - Number(first.split(",")[at])).toBe(2);
  });
});
