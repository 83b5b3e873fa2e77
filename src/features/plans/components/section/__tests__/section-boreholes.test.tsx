import { act, fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { FormProvider, useForm } from "react-hook-form";
import { describe, expect, it } from "vitest";
import type { Plan } from "@engine";
import {
  formToPlanInput,
  planFormResolver,
  planToForm,
  type PlanForm,
} from "../../../lib/plan-form";
import { SectionEditor } from "../section-editor";

/** An invented sloping site with two stored boreholes; BH2's log disagrees with the base. */
const sectionPlan = (): Plan =>
  ({
    format: "spreadsight-plan/2",
    name: "Brackenhill lane, line 1",
    models: [
      {
        kind: "section",
        name: "Channel",
        surface: [
          [0, 100],
          [120, 100],
        ],
        layers: [
          {
            name: "silty clay",
            velocity: 550,
            base: [
              [0, 95],
              [120, 95],
            ],
          },
          { name: "mudstone", velocity: 2600 },
        ],
        boreholes: [
          { name: "BH1", position: 20, depths: [5] },
          // logged 100 − 3 = 97 m, the model's base is at 95 m: 2 m apart, more than 0.5 m
          { name: "BH2", position: 80, depths: [3] },
        ],
      },
    ],
    spread: { spacing: 5, channels: 24, firstGeophone: 0, shots: [{ position: -2.5 }] },
    criteria: { minGeophones: 2, pickError: 0.0005, depthTolerance: 1 },
  }) as Plan;

let latest: ReturnType<typeof useForm<PlanForm>> | null = null;

function Harness({ readOnly = false, plan = sectionPlan() }: { readOnly?: boolean; plan?: Plan }) {
  const form = useForm<PlanForm, unknown, Plan>({
    resolver: planFormResolver("metric", "plan"),
    mode: "onChange",
    defaultValues: planToForm(plan, "metric"),
  });
  latest = form as never;
  return (
    <FormProvider {...form}>
      <SectionEditor index={0} units="metric" readOnly={readOnly} />
    </FormProvider>
  );
}

const stored = () => latest!.getValues("models.0.section.boreholes")?.map((b) => b.name);

describe("boreholes in the section editor", () => {
  it("lists the stored boreholes, draws them, and notes the log the model disagrees with", () => {
    render(<Harness />);
    const table = screen.getByRole("table", { name: "Stored boreholes" });
    expect(within(table).getByText("BH1")).toBeInTheDocument();
    expect(within(table).getByText("20.0 m")).toBeInTheDocument();
    expect(screen.getByLabelText("Boreholes").querySelectorAll("text")).toHaveLength(2);
    expect(
      screen.getByText(
        "BH2: top of mudstone logged at 97.0 m, model has 95.0 m (2.0 m apart, more than 0.5 m)",
      ),
    ).toBeInTheDocument();
  });

  it("removes a borehole from the form (and so from the saved plan); the last one drops the field", () => {
    render(<Harness />);
    fireEvent.click(screen.getByRole("button", { name: "Remove borehole BH2" }));
    expect(stored()).toEqual(["BH1"]);
    expect(screen.queryByText(/^BH2:/)).toBeNull();
    fireEvent.click(screen.getByRole("button", { name: "Remove borehole BH1" }));
    expect(stored()).toBeUndefined();
    expect(screen.queryByRole("table", { name: "Stored boreholes" })).toBeNull();
    const model = (formToPlanInput(latest!.getValues(), "metric", "p") as { models: object[] })
      .models[0];
    expect(model).not.toHaveProperty("boreholes");
  });

  it("shows the list without Remove buttons when read-only", () => {
    render(<Harness readOnly />);
    expect(screen.getByRole("table", { name: "Stored boreholes" })).toBeInTheDocument();
    expect(screen.queryByRole("button", { name: /Remove borehole/ })).toBeNull();
  });

  it("stores the boreholes of an imported file with the model", async () => {
    render(<Harness />);
    const file = new File(["borehole,position,depth1\nBH7,30,4\nBH8,90,6\n"], "logs.csv", {
      type: "text/csv",
    });
    fireEvent.change(screen.getByLabelText(/Layer bases from boreholes/), {
      target: { files: [file] },
    });
    await waitFor(() => expect(stored()).toEqual(["BH7", "BH8"]));
    // the base now runs through the logs: 100 − 4 = 96 m at 30 m
    expect(latest!.getValues("models.0.section.layers.0.base")).toContainEqual([30, 96]);
    expect(screen.getByRole("status")).toHaveTextContent(/kept with the plan/);
  });

  it("lists a borehole the schema refuses among the section's problems, by name", async () => {
    const plan = sectionPlan();
    const model = plan.models[0] as { boreholes?: unknown[] };
    model.boreholes = [{ name: "BH9", position: 130, depths: [4] }];
    render(<Harness plan={plan} />);
    await act(async () => {
      await latest!.trigger();
    });
    expect(screen.getByRole("alert")).toHaveTextContent(
      'boreholes: borehole "BH9" at 130 m stands beyond the section\'s surface (0 to 120 m)',
    );
  });

  it("refuses a borehole file with a borehole beyond the surface, keeping what was stored", async () => {
    render(<Harness />);
    const file = new File(["BH7,30,4\nBH8,150,6\n"], "far.csv", { type: "text/csv" });
    fireEvent.change(screen.getByLabelText(/Layer bases from boreholes/), {
      target: { files: [file] },
    });
    expect(await screen.findByText(/far\.csv: borehole BH8 at 150/)).toHaveTextContent(
      "stands beyond the section's surface (0.00 m to 120.00 m)",
    );
    expect(stored()).toEqual(["BH1", "BH2"]);
  });
});
