import { describe, expect, it } from "vitest";
import { fireEvent, render, screen, within } from "@testing-library/react";
import { FormProvider, useForm } from "react-hook-form";
import { MemoryRouter, useLocation } from "react-router-dom";
import { analyzePlan } from "@engine";
import { planFormResolver, planToForm, type PlanForm } from "../../../lib/plan-form";
import { threeLayerPlan } from "../../../__tests__/fixtures";
import type { Plan } from "../../../lib/engine";
import type { UnitSystem } from "@/lib/units";
import { usePlanHistory } from "../../../hooks/use-plan-history";
import { RollAlongFields, RollAlongTable } from "../roll-along-panel";

function Fields({ values, units = "metric" }: { values: PlanForm; units?: UnitSystem }) {
  const form = useForm<PlanForm>({
    defaultValues: values,
    mode: "onChange",
    resolver: planFormResolver(units, "t") as never,
  });
  const history = usePlanHistory(form, true);
  return (
    <FormProvider {...form}>
      <RollAlongFields units={units} />
      <button type="button" onClick={() => history.undo()}>
        undo
      </button>
    </FormProvider>
  );
}

// 24 geophones at 5 m from 0 m (fixtures: threeLayerPlan).
const form = () => planToForm(threeLayerPlan(), "metric");

describe("RollAlongFields (light)", () => {
  it("is off by default and, switched on, shows the line of 2 spreads sharing 2 stations", () => {
    render(<Fields values={form()} />);
    const box = screen.getByRole("checkbox", { name: /several spreads/ });
    expect(box).not.toBeChecked();
    expect(screen.queryByLabelText("Spreads")).toBeNull();
    fireEvent.click(box);
    expect(screen.getByLabelText("Spreads")).toHaveValue("2");
    expect(screen.getByLabelText("Overlap (geophones shared)")).toHaveValue("2");
    // 24 + (2 − 1)(24 − 2) = 46 stations over 45 · 5 = 225 m; step 22 stations = 110 m (by hand).
    expect(
      screen.getByText(
        "Line of 2 spreads: 46 stations, numbered 1–46, over 225.00 m from 0.00 m to 225.00 m; each spread moves on 22 stations (110.00 m).",
      ),
    ).toBeVisible();
  });

  it("says when fixed shots will be recorded by one spread only, and not once they are anchored", () => {
    const { unmount } = render(<Fields values={form()} />);
    fireEvent.click(screen.getByRole("checkbox", { name: /several spreads/ }));
    // Both fixture shots are fixed (no anchor).
    expect(screen.getByTestId("roll-along-fixed-shots")).toHaveTextContent(
      "2 shots are fixed: a fixed shot is recorded by one spread only",
    );
    unmount();
    const plan = threeLayerPlan();
    plan.spread.shots = [
      { position: -2.5, anchor: { to: "start", offset: -2.5 } },
      { position: 117.5, anchor: { to: "end", offset: 2.5 } },
    ];
    render(<Fields values={planToForm(plan, "metric")} />);
    fireEvent.click(screen.getByRole("checkbox", { name: /several spreads/ }));
    expect(screen.queryByTestId("roll-along-fixed-shots")).toBeNull();
  });

  it("is a form field: undo switches it off again", () => {
    render(<Fields values={form()} />);
    const box = screen.getByRole("checkbox", { name: /several spreads/ });
    fireEvent.click(box);
    expect(box).toBeChecked();
    fireEvent.click(screen.getByRole("button", { name: "undo" }));
    expect(screen.getByRole("checkbox", { name: /several spreads/ })).not.toBeChecked();
    expect(screen.queryByLabelText("Spreads")).toBeNull();
  });

  it("names the box that is wrong", async () => {
    render(<Fields values={form()} />);
    fireEvent.click(screen.getByRole("checkbox", { name: /several spreads/ }));
    const overlap = screen.getByLabelText("Overlap (geophones shared)");
    fireEvent.change(overlap, { target: { value: "24" } });
    expect(
      await screen.findByText("roll-along overlap must be below the 24 channels of a spread"),
    ).toBeVisible();
    expect(screen.getByText(/Fill in spacing/)).toBeVisible();
    fireEvent.change(screen.getByLabelText("Spreads"), { target: { value: "1" } });
    expect(await screen.findByText("roll-along needs at least 2 spreads")).toBeVisible();
  });

  it("shows a saved roll-along switched on", () => {
    const plan: Plan = {
      ...threeLayerPlan(),
      spread: { ...threeLayerPlan().spread, rollAlong: { spreads: 3, overlap: 4 } },
    };
    render(<Fields values={planToForm(plan, "metric")} />);
    expect(screen.getByRole("checkbox", { name: /several spreads/ })).toBeChecked();
    expect(screen.getByLabelText("Spreads")).toHaveValue("3");
    // 24 + 2 · 20 = 64 stations over 63 · 5 = 315 m (by hand).
    expect(screen.getByText(/64 stations, numbered 1–64, over 315\.00 m/)).toBeVisible();
  });

  it("gives the line in feet for a user who chose feet", () => {
    const plan: Plan = {
      ...threeLayerPlan(),
      spread: { ...threeLayerPlan().spread, rollAlong: { spreads: 3, overlap: 4 } },
    };
    render(<Fields values={planToForm(plan, "imperial")} units="imperial" />);
    // From the boxes as shown: 5 m reads 16.40 ft, and 63 · 16.40 = 1,033.20 ft (by hand).
    expect(screen.getByText(/64 stations, numbered 1–64, over 1,033\.20 ft/)).toBeVisible();
  });
});

function Where() {
  const location = useLocation();
  return <output aria-label="where">{location.search}</output>;
}

describe("RollAlongTable (light)", () => {
  // 3 spreads of 24 at 5 m sharing 4: spread k starts at (k − 1) · 20 · 5 = 0, 100, 200 m and
  // ends 115 m later (by hand). The fixture's two shots are fixed at −2.5 m and 117.5 m.
  const plan = (): Plan => ({
    ...threeLayerPlan(),
    spread: { ...threeLayerPlan().spread, rollAlong: { spreads: 3, overlap: 4 } },
  });

  it("lists each spread's stations, geophones and shots without an analysis", () => {
    render(
      <MemoryRouter>
        <RollAlongTable plan={plan()} analysis={null} units="metric" />
      </MemoryRouter>,
    );
    const table = screen.getByRole("region", { name: "Roll-along spreads" });
    const rows = within(table).getAllByRole("row").slice(1);
    expect(rows).toHaveLength(3);
    expect(rows[1]).toHaveTextContent(/21–44.*100\.00 m to 215\.00 m/);
    expect(rows[2]).toHaveTextContent(/41–64.*200\.00 m to 315\.00 m/);
    // A fixed shot goes to the spread whose centre is nearest: −2.5 m to spread 1 (centre
    // 57.5 m), 117.5 m to spread 2 (centre 157.5 m is 40 m away, spread 1's 60 m).
    expect(rows[0]).toHaveTextContent("end, start at -2.50 m");
    expect(rows[1]).toHaveTextContent("end, far at 117.50 m");
    expect(rows[2]).toHaveTextContent("none");
    expect(within(table).queryByRole("combobox")).toBeNull();
    expect(within(table).queryByRole("columnheader", { name: "Verdict" })).toBeNull();
  });

  it("shows verdicts from the analysis and chooses the spread the charts show", () => {
    const analysis = analyzePlan(plan());
    expect(analysis.rollAlong).toBeDefined();
    render(
      <MemoryRouter>
        <RollAlongTable plan={plan()} analysis={analysis} units="metric" />
        <Where />
      </MemoryRouter>,
    );
    const table = screen.getByRole("region", { name: "Roll-along spreads" });
    expect(within(table).getByRole("columnheader", { name: "Verdict" })).toBeVisible();
    const select = within(table).getByRole("combobox", { name: "Charts show spread" });
    expect(select).toHaveValue(String(analysis.rollAlong!.shown));
    // Spread 3 records no shot: it cannot be shown.
    expect(within(select).getByRole("option", { name: "3" })).toBeDisabled();
    fireEvent.change(select, { target: { value: "2" } });
    expect(screen.getByLabelText("where")).toHaveTextContent("?spread=2");
    // The choice shows at once, before the analysis of spread 2 (still spread 1's here) lands.
    expect(analysis.rollAlong!.shown).not.toBe(2);
    expect(select).toHaveValue("2");
  });
});
