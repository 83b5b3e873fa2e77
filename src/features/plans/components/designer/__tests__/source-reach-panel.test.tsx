import { describe, expect, it } from "vitest";
import { render, screen } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { FormProvider, useForm } from "react-hook-form";
import type { PlanForm } from "../../../lib/plan-form";
import { SourceReachPanel } from "../source-reach-panel";

function Harness({
  values,
  units = "metric",
}: {
  values: PlanForm;
  units?: "metric" | "imperial";
}) {
  const form = useForm<PlanForm>({ defaultValues: values });
  return (
    <FormProvider {...form}>
      <SourceReachPanel units={units} readOnly={false} />
    </FormProvider>
  );
}

const values = (): PlanForm => ({
  models: [],
  spread: {
    spacing: "3",
    channels: "48",
    firstGeophone: "0",
    noise: "moderate",
    shots: [
      { position: "-1.5", label: "end A", source: "sledgehammer" },
      { position: "70.5", label: "centre", source: "" },
    ],
  },
  criteria: { minGeophones: "2", pickError: "0.5", depthTolerance: "1" },
});

describe("SourceReachPanel", () => {
  it("flags a hammer shot that must reach past its range, with the stacking that helps", () => {
    render(<Harness values={values()} />);
    // Farthest geophone: 141 m + 1.5 m = 142.5 m from the shot (by hand); a hammer on a
    // moderate site reaches 60 m (common practice); (142.5/60)² = 5.6 → 6 stacks (√N gain).
    expect(screen.getByRole("list", { name: "Reach flags" })).toHaveTextContent(
      "Shot 1 must record out to 142.50 m, beyond the 60 m a sledgehammer reaches on a moderate site: stack 6 shots",
    );
    expect(screen.getByRole("list", { name: "Source cautions" })).toHaveTextContent(
      /eye and hearing protection.*Defer to local codes and licensed practice/,
    );
  });

  it("writes a source's rough reach in whole feet for a user in feet (issue 14 QA: 196.85 ft)", () => {
    render(<Harness values={values()} units="imperial" />);
    // 60 m / 0.3048 = 196.85 ft, a common-practice figure: shown as 197 ft (by hand).
    expect(screen.getAllByRole("option", { name: "sledgehammer (to 197 ft)" })).toHaveLength(2);
  });

  it("clears the flag with a stronger source and names the licence a charge needs", async () => {
    render(<Harness values={values()} />);
    await userEvent.selectOptions(screen.getByLabelText("Shot 1 source"), "buried-charge");
    expect(screen.queryByRole("list", { name: "Reach flags" })).toBeNull();
    expect(screen.getByRole("list", { name: "Source cautions" })).toHaveTextContent(
      /licensed shotfirer/,
    );
  });
});
