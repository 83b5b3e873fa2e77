import { describe, expect, it } from "vitest";
import { render, screen, within } from "@testing-library/react";
import { FormProvider, useForm } from "react-hook-form";
import { exactValues, planToForm, type PlanForm } from "../../../lib/plan-form";
import { ExactValuesContext } from "../../../hooks/use-typed-number";
import { SpreadPanel } from "../spread-panel";
import { threeLayerPlan } from "../../../__tests__/fixtures";

// A 3 m × 24 spread with end shots anchored 1.5 m outside, read by a user who works in feet.
const plan = () => {
  const p = threeLayerPlan();
  p.spread = {
    spacing: 3,
    channels: 24,
    firstGeophone: 0,
    shots: [
      { position: -1.5, label: "end A", anchor: { to: "start", offset: -1.5 } },
      { position: 70.5, label: "end B", anchor: { to: "end", offset: 1.5 } },
    ],
  };
  return p;
};

function Harness({ withExact }: { withExact: boolean }) {
  const form = useForm<PlanForm>({ defaultValues: planToForm(plan(), "imperial") });
  return (
    <ExactValuesContext.Provider value={withExact ? exactValues(plan(), "imperial") : null}>
      <FormProvider {...form}>
        <SpreadPanel units="imperial" readOnly={false} />
      </FormProvider>
    </ExactValuesContext.Provider>
  );
}

describe("SpreadPanel in feet (light)", () => {
  it("reads unchanged boxes as the stored metres, so its figures agree with the analysis", () => {
    render(<Harness withExact />);
    // The box shows 3 m rounded: 9.84 ft.
    expect(screen.getByLabelText("Spacing (ft)")).toHaveValue("9.84");
    // 23 × 3 m = 69 m = 226.38 ft, and end B at 70.5 m = 231.30 ft (by hand, 1 ft = 0.3048 m);
    // read from the box text they were 23 × 9.84 = 226.32 ft and 231.24 ft.
    expect(screen.getByText(/Spread length 226\.38 ft/)).toBeInTheDocument();
    const row = screen.getByLabelText("Shot 2 placed").closest("tr")!;
    expect(within(row).getByText("at 231.30 ft")).toBeInTheDocument();
  });

  it("falls back to the box text outside the designer page (no stored values)", () => {
    render(<Harness withExact={false} />);
    expect(screen.getByText(/Spread length 226\.32 ft/)).toBeInTheDocument();
  });
});
