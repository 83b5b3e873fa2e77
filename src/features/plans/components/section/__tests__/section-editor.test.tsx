import { fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { FormProvider, useForm } from "react-hook-form";
import { describe, expect, it } from "vitest";
import type { Plan } from "@engine";
import { planFormResolver, planToForm, type PlanForm } from "../../../lib/plan-form";
import { SectionEditor } from "../section-editor";

/** An invented sloping site: surface and one base, 24 geophones at 5 m. */
const sectionPlan = (): Plan =>
  ({
    format: "spreadsight-plan/2",
    name: "Brackenhill lane, line 1",
    models: [
      {
        kind: "section",
        name: "Channel",
        surface: [
          [-5, 102],
          [60, 99.5],
          [125, 97],
        ],
        layers: [
          {
            name: "silty clay",
            velocity: 550,
            base: [
              [-5, 97],
              [50, 93],
              [70, 92.5],
              [125, 94],
            ],
          },
          { name: "mudstone", velocity: 2600 },
        ],
      },
    ],
    spread: { spacing: 5, channels: 24, firstGeophone: 0, shots: [{ position: -2.5 }] },
    criteria: { minGeophones: 2, pickError: 0.0005, depthTolerance: 1 },
  }) as Plan;

function Harness({ onForm }: { onForm?: (f: ReturnType<typeof useForm<PlanForm>>) => void }) {
  const form = useForm<PlanForm, unknown, Plan>({
    resolver: planFormResolver("metric", "plan"),
    mode: "onChange",
    defaultValues: planToForm(sectionPlan(), "metric"),
  });
  onForm?.(form as never);
  return (
    <FormProvider {...form}>
      <SectionEditor index={0} units="metric" readOnly={false} />
    </FormProvider>
  );
}

describe("SectionEditor", () => {
  it("lists the surface points in a table with units", () => {
    render(<Harness />);
    const table = screen.getByLabelText("Points of the surface");
    expect(within(table).getByText("Elevation (m)")).toBeInTheDocument();
    expect(within(table).getByLabelText("surface point 2 elevation (m)")).toHaveValue("99.5");
  });

  it("nudges a selected point up with the arrow key and removes it with Delete", () => {
    render(<Harness />);
    const point = screen.getByLabelText(/^surface point 2 at/);
    fireEvent.focus(point);
    fireEvent.keyDown(point, { key: "ArrowUp" });
    const table = screen.getByLabelText("Points of the surface");
    // one nudge is 0.1 m: 99.5 → 99.6
    expect(within(table).getByLabelText("surface point 2 elevation (m)")).toHaveValue("99.6");
    fireEvent.keyDown(screen.getByLabelText(/^surface point 2 at/), { key: "Delete" });
    // the middle point is gone: the table has the two end points left
    expect(within(table).queryByLabelText("surface point 3 elevation (m)")).toBeNull();
    expect(within(table).getByLabelText("surface point 2 elevation (m)")).toHaveValue("97");
  });

  it("names the point when a base rises above the surface", async () => {
    render(<Harness />);
    fireEvent.change(screen.getByLabelText("Polyline shown in the table"), {
      target: { value: "0" },
    });
    const box = screen.getByLabelText("base of silty clay point 2 elevation (m)");
    fireEvent.change(box, { target: { value: "105" } });
    const alert = await screen.findByText(/cannot be analysed or saved/);
    const list = alert.closest("[role=alert]") as HTMLElement;
    await waitFor(() =>
      expect(list.textContent).toMatch(
        /base of silty clay, point \d: base rises above the surface/,
      ),
    );
  });
});
