import { describe, expect, it, vi } from "vitest";
import { screen, waitFor, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { readFileSync } from "node:fs";
import type { AttachmentSummary, PickSetView } from "@/contracts/field";
import type { PlanDetail } from "@/contracts/plans";
import type { Plan } from "@engine";
import { renderWithApp, stubFetch, testMe } from "@/testing/render";
import { FieldCheckPage } from "../field-check-page";
import { ImportPlanButton } from "../import-plan-button";
import { UploadPanel } from "../upload-panel";

const document = JSON.parse(readFileSync("docs/examples/two-layer-simple.json", "utf8")) as Plan;
const planId = "22222222-2222-4222-8222-222222222222";
const siteId = "11111111-1111-4111-8111-111111111111";

const plan = (overrides: Partial<PlanDetail> = {}): PlanDetail =>
  ({
    id: planId,
    siteId,
    siteName: "Invented quarry",
    name: document.name,
    status: "approved",
    sandbox: false,
    author: { id: "00000000-0000-4000-8000-000000000001", name: "Test Lead" },
    revision: 3,
    worstVerdict: "resolved",
    updatedAt: "2026-11-02T10:00:00.000Z",
    createdAt: "2026-11-02T10:00:00.000Z",
    document,
    permissions: {
      edit: false,
      submit: false,
      decide: false,
      comment: true,
      reopen: true,
      archive: true,
    },
    ...overrides,
  }) as PlanDetail;

// Picks from the plan's own model (two layers: 550 m/s over 2800 m/s, 6 m; Telford et al. 1990
// §4.3 closed form), so the plan's model must fit with zero RMS.
const [l1, l2] = document.models[0].layers;
const ti =
  (2 * (l1.thickness ?? 0) * Math.sqrt(1 - (l1.velocity / l2.velocity) ** 2)) / l1.velocity;
const savedPicks: PickSetView = {
  planId,
  revision: 3,
  picks: Array.from({ length: 24 }, (_, k) => {
    const x = 2 * k + 1;
    return {
      sourcePosition: -1,
      receiverPosition: 2 * k,
      time: Math.min(x / l1.velocity, x / l2.velocity + ti),
      origin: "auto" as const,
    };
  }),
  attachmentId: null,
  picker: "sta-lta",
  updatedBy: { id: "x", name: "Test Lead" },
  updatedAt: "2026-11-02T10:00:00.000Z",
};

const boreholeLog: AttachmentSummary = {
  id: "33333333-3333-4333-8333-333333333333",
  planId,
  revision: 3,
  kind: "borehole",
  fileName: "BH-2.csv",
  mediaType: "text/csv",
  size: 120,
  sha256: "0".repeat(64),
  facts: {
    kind: "borehole",
    intervals: 2,
    layers: 2,
    model: {
      name: "Borehole BH-2",
      layers: [
        { name: "sand", velocity: 550, thickness: 9 },
        { name: "sandstone", velocity: 2800 },
      ],
    },
  },
  uploadedBy: { id: "x", name: "Test Lead" },
  createdAt: "2026-11-02T10:00:00.000Z",
};

function stubField(detail: PlanDetail) {
  return stubFetch({
    [`GET /api/plans/${planId}`]: () => ({ status: 200, body: detail }),
    [`GET /api/plans/${planId}/attachments`]: () => ({ status: 200, body: [boreholeLog] }),
    [`GET /api/plans/${planId}/picks`]: () => ({ status: 200, body: savedPicks }),
  });
}

const route = { path: "/plans/:planId/field", route: `/plans/${planId}/field` };

describe("FieldCheckPage", () => {
  it("compares the saved picks with the plan's model and the borehole log's, naming the best fit", async () => {
    stubField(plan());
    renderWithApp(<FieldCheckPage />, route);
    // The first comparison loads the field core lazily (no Worker in jsdom): slow on a busy machine.
    const table = await screen.findByRole(
      "table",
      { name: /how well each ground model fits/i },
      { timeout: 5000 },
    );
    const rows = within(table).getAllByRole("row");
    expect(rows).toHaveLength(3);
    expect(rows[1]).toHaveTextContent(document.models[0].name);
    expect(rows[1]).toHaveTextContent("best fit");
    expect(rows[1]).toHaveTextContent("0.00 ms");
    expect(rows[2]).toHaveTextContent("Borehole BH-2");
    // Its name already says it is a borehole: the note does not repeat it.
    expect(rows[2]).toHaveTextContent("Borehole BH-2(not in the plan)");
    expect(screen.getByText(/No misfit pattern against/)).toBeInTheDocument();
    expect(
      screen.getByRole("img", { name: /Time–distance chart: 24 observed picks/ }),
    ).toBeInTheDocument();
    // the upload time reads like every other date in the app, not in the browser's locale
    const files = screen.getByRole("table", { name: /uploaded field data/i });
    expect(within(files).getAllByText(/2 Nov 2026, \d\d:\d\d/).length).toBeGreaterThan(0);
  });

  it("shows the misfit pattern when the thicker log's model is chosen", async () => {
    stubField(plan());
    renderWithApp(<FieldCheckPage />, route);
    await userEvent.click(await screen.findByRole("radio", { name: "Show Borehole BH-2" }));
    const warnings = await screen.findByRole("list", { name: "Misfit warnings" });
    expect(within(warnings).getAllByText(/Picks systematically early/).length).toBeGreaterThan(0);
  });

  it("gives a lead uploads and exports, a reviewer exports only, a trainee neither on a team plan", async () => {
    stubField(plan());
    const lead = renderWithApp(<FieldCheckPage />, route);
    expect(await screen.findByRole("form", { name: "Upload field data" })).toBeInTheDocument();
    expect(screen.getByRole("link", { name: "Report (PDF)" })).toHaveAttribute(
      "href",
      `/api/plans/${planId}/report.pdf`,
    );
    lead.unmount();

    stubField(plan());
    const reviewer = renderWithApp(<FieldCheckPage />, {
      ...route,
      me: testMe({ role: "reviewer" }),
    });
    await screen.findByRole("table", { name: /how well each ground model fits/i });
    expect(screen.queryByRole("form", { name: "Upload field data" })).toBeNull();
    expect(screen.getByRole("link", { name: "Station layout (CSV)" })).toBeInTheDocument();
    reviewer.unmount();

    stubField(plan());
    renderWithApp(<FieldCheckPage />, { ...route, me: testMe({ role: "trainee" }) });
    await screen.findByRole("table", { name: /how well each ground model fits/i });
    expect(screen.queryByRole("form", { name: "Upload field data" })).toBeNull();
    expect(screen.queryByRole("link", { name: "Report (PDF)" })).toBeNull();
  });

  it("reads segments with the intercept-time method", async () => {
    stubField(plan());
    renderWithApp(<FieldCheckPage />, route);
    await userEvent.click(await screen.findByRole("button", { name: /Suggest from/ }));
    const layers = await screen.findByRole("table", {
      name: /Layers from the intercept-time method/,
    });
    // Depth to the refractor: the plan's 6 m (two-layer intercept-time formula, Kearey et al. 2002 ch. 5).
    expect(within(layers).getAllByRole("row")[2]).toHaveTextContent("6 m");
  });

  it("shows a feet user positions, offsets, depths and velocities in ft and ft/s", async () => {
    stubField(plan());
    renderWithApp(<FieldCheckPage />, {
      ...route,
      me: testMe({ preferences: { units: "imperial" } }),
    });
    await userEvent.click(await screen.findByRole("button", { name: /Suggest from/ }));
    const layers = await screen.findByRole("table", {
      name: /Layers from the intercept-time method/,
    });
    // The plan's 6 m and 550 m/s: 19.7 ft and 1804 ft/s (÷ 0.3048, the international foot).
    expect(within(layers).getAllByRole("row")[2]).toHaveTextContent("19.7 ft");
    expect(within(layers).getAllByRole("row")[1]).toHaveTextContent("1804 ft/s");
    expect(screen.getByLabelText("Segment 1 from offset (ft)")).toBeInTheDocument();
    expect(screen.getByText("position along the line (ft)")).toBeInTheDocument();
  });
});

describe("UploadPanel", () => {
  it("lists every problem the server named when a file is refused", async () => {
    const messages = [
      "line 3, column time_ms: 'abc' is not a number",
      "line 5, column geophone_m: value is missing",
    ];
    globalThis.fetch = vi.fn(
      async () =>
        new Response(
          JSON.stringify({
            error: {
              code: "invalid_csv",
              message: "the picks CSV has problems",
              fields: { file: messages },
            },
          }),
          { status: 422, headers: { "Content-Type": "application/json" } },
        ),
    ) as unknown as typeof fetch;
    const onUploaded = vi.fn();
    renderWithApp(<UploadPanel planId={planId} onUploaded={onUploaded} />);
    await userEvent.selectOptions(screen.getByLabelText("Kind of file"), "picks");
    await userEvent.upload(
      screen.getByLabelText("File to upload"),
      new File(["shot_m,geophone_m,time_ms\n"], "picks.csv", { type: "text/csv" }),
    );
    await userEvent.click(screen.getByRole("button", { name: "Upload" }));
    const alert = await screen.findByRole("alert");
    expect(alert).toHaveTextContent("The file was not stored");
    for (const m of messages) expect(alert).toHaveTextContent(m);
    expect(onUploaded).not.toHaveBeenCalled();
    const [, init] = vi.mocked(globalThis.fetch).mock.calls[0];
    const form = init?.body as FormData;
    expect(form.get("kind")).toBe("picks");
    expect((form.get("file") as File).name).toBe("picks.csv");
  });
});

describe("ImportPlanButton", () => {
  it("names each bad field of a refused plan document", async () => {
    stubFetch({
      [`POST /api/sites/${siteId}/plans/import`]: () => ({
        status: 400,
        body: {
          error: {
            code: "invalid_input",
            message: "invalid plan document",
            fields: { "spread.spacing": ["spacing must be > 0"], colour: ["unknown field"] },
          },
        },
      }),
    });
    const onImported = vi.fn();
    renderWithApp(<ImportPlanButton siteId={siteId} onImported={onImported} />);
    await userEvent.upload(
      screen.getByLabelText("Import plan (JSON)"),
      new File([JSON.stringify({ ...document, colour: "teal" })], "plan.json", {
        type: "application/json",
      }),
    );
    const alert = await screen.findByRole("alert");
    expect(alert).toHaveTextContent("Spread: spacing must be > 0");
    expect(alert).toHaveTextContent("colour: unknown field");
    expect(onImported).not.toHaveBeenCalled();
  });

  it("imports a valid document and hands back the new plan", async () => {
    const calls = stubFetch({
      [`POST /api/sites/${siteId}/plans/import`]: () => ({
        status: 201,
        body: plan({ id: "new-id" }),
      }),
    });
    const onImported = vi.fn();
    renderWithApp(<ImportPlanButton siteId={siteId} onImported={onImported} />);
    await userEvent.upload(
      screen.getByLabelText("Import plan (JSON)"),
      new File([JSON.stringify(document)], "plan.json", { type: "application/json" }),
    );
    await waitFor(() =>
      expect(onImported).toHaveBeenCalledWith(expect.objectContaining({ id: "new-id" })),
    );
    expect(calls[0].body).toEqual(document);
  });

  it("says so when the file is not JSON, without calling the server", async () => {
    const calls = stubFetch({});
    renderWithApp(<ImportPlanButton siteId={siteId} />);
    await userEvent.upload(
      screen.getByLabelText("Import plan (JSON)"),
      new File(["{ not json"], "plan.json", { type: "application/json" }),
    );
    expect(await screen.findByRole("alert")).toHaveTextContent(
      "plan.json is not a plan JSON file: its text is not JSON",
    );
    expect(calls).toHaveLength(0);
  });
});
