import { describe, expect, it } from "vitest";
import { render, screen, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { FormProvider, useForm } from "react-hook-form";
import type { PlanForm } from "../../../lib/plan-form";
import { SpreadPanel } from "../spread-panel";

function Harness({ values }: { values: PlanForm }) {
  const form = useForm<PlanForm>({ defaultValues: values });
  return (
    <FormProvider {...form}>
      <SpreadPanel units="metric" readOnly={false} />
    </FormProvider>
  );
}

const values = (): PlanForm => ({
  models: [],
  spread: {
    spacing: "3",
    channels: "24",
    firstGeophone: "0",
    shots: [
      { position: "-1.5", label: "end A" },
      { position: "70.5", label: "end B" },
    ],
  },
  criteria: { minGeophones: "2", pickError: "0.5", depthTolerance: "1" },
});

describe("SpreadPanel shot anchors (light)", () => {
  it("moves an end shot anchored to the end when 24 channels become 48 (issue 14)", async () => {
    render(<Harness values={values()} />);
    await userEvent.selectOptions(screen.getByLabelText("Shot 2 placed"), "end");
    // 24 geophones at 3 m end at 69 m (by hand): end B is 1.5 m beyond.
    expect(screen.getByLabelText("Shot 2 offset from the end (m)")).toHaveValue("1.5");
    const channels = screen.getByLabelText("Channels");
    await userEvent.clear(channels);
    await userEvent.type(channels, "48");
    // 48 geophones end at 141 m: end B at 142.5 m, still beyond the last geophone.
    const row = screen.getByLabelText("Shot 2 placed").closest("tr")!;
    expect(within(row).getByText("at 142.50 m")).toBeVisible();
    expect(within(row).getByText(/beyond the last/)).toBeVisible();
    // The fixed shot stays where it was.
    expect(screen.getByLabelText("Shot 1 position (m)")).toHaveValue("-1.5");
  });

  it("anchors new centre and off-end shots by default", async () => {
    render(<Harness values={values()} />);
    await userEvent.click(screen.getByRole("button", { name: "+ Centre shot" }));
    expect(screen.getByLabelText("Shot 3 placed")).toHaveValue("centre");
    await userEvent.click(screen.getByRole("button", { name: "+ Off-end shots" }));
    expect(screen.getByLabelText("Shot 4 placed")).toHaveValue("start");
    expect(screen.getByLabelText("Shot 5 placed")).toHaveValue("end");
  });
});

describe("SpreadPanel shot rows on a phone (light)", () => {
  it("heads each box of a shot card with its column's name, as the table head is hidden below 640 px (issue 14)", () => {
    render(<Harness values={values()} />);
    const row = screen.getByLabelText("Shot 1 placed").closest("tr")!;
    // PhoneLabel repeats the hidden table head inside the cell (shown only below `sm`).
    for (const heading of ["Where (m)", "Label", "Offsets it records"])
      expect(within(row).getByText(heading, { selector: "span.sm\\:hidden" })).toBeInTheDocument();
  });
});
