import { describe, expect, it } from "vitest";
import { fireEvent, screen } from "@testing-library/react";
import { renderWithApp, stubFetch } from "@/testing/render";
import { ImportPlanButton } from "../import-plan-button";

const siteId = "11111111-1111-4111-8111-111111111111";

/** Chooses a file the way a user picking "All files" would (the accept filter does not apply). */
function choose(file: File) {
  fireEvent.change(screen.getByLabelText("Import plan (JSON)"), { target: { files: [file] } });
}

describe("Import plan: words a survey lead reads", () => {
  it("counts models and layers from 1, as the screen does", async () => {
    stubFetch({
      [`POST /api/sites/${siteId}/plans/import`]: () => ({
        status: 400,
        body: {
          error: {
            code: "invalid_input",
            message: "invalid plan document",
            fields: {
              "models.0.layers.0.velocity": ["velocity must be > 0"],
              "models.1.layers.2.thickness": ["thickness must be a number"],
            },
          },
        },
      }),
    });
    renderWithApp(<ImportPlanButton siteId={siteId} />);
    choose(new File(['{"format":"spreadsight-plan/1"}'], "plan.json"));
    const alert = await screen.findByRole("alert");
    expect(alert).toHaveTextContent("Model 1, layer 1: velocity must be > 0");
    expect(alert).toHaveTextContent("Model 2, layer 3: thickness must be a number");
    expect(alert).not.toHaveTextContent("models.0");
  });

  it("says a CSV is not a plan JSON file instead of quoting the parser, and sends nothing", async () => {
    const calls = stubFetch({});
    renderWithApp(<ImportPlanButton siteId={siteId} />);
    choose(new File(["station,offset_m\n1,0\n2,2\n"], "stations.csv", { type: "text/csv" }));
    const alert = await screen.findByRole("alert");
    expect(alert).toHaveTextContent("stations.csv is not a plan JSON file");
    expect(alert).toHaveTextContent("CSV table");
    expect(alert).not.toHaveTextContent(/Unexpected token/i);
    expect(calls).toHaveLength(0);
  });
});
