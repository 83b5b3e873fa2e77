import { describe, expect, it } from "vitest";
import { render, screen } from "@testing-library/react";
import type { GroundModel } from "@engine";
import type { ModelFit } from "../../../../../workers/field/index";
import type { Candidate, Comparison } from "../../lib/comparison";
import { FitTable } from "../comparison-panel";

const fit = (name: string): ModelFit => ({
  name,
  rms: 0.001,
  meanResidual: 0,
  count: 24,
  unmodelled: 0,
  residuals: [],
});
const model = { name: "x", layers: [] } as unknown as GroundModel;

function table(names: Array<[string, Candidate["source"]]>) {
  const comparison = { fits: names.map(([n]) => fit(n)), best: 0 } as unknown as Comparison;
  const candidates: Candidate[] = names.map(([name, source]) => ({ name, model, source }));
  render(
    <FitTable comparison={comparison} candidates={candidates} selected={0} onSelect={() => {}} />,
  );
}

describe("FitTable", () => {
  it("says a log's model is not in the plan without repeating 'borehole log'", () => {
    table([
      ["Dry sand over sandstone", "plan"],
      ["Borehole log", "borehole"],
      ["Harwick lane 3", "borehole"],
    ]);
    const [, plan, log, named] = screen.getAllByRole("row");
    expect(log).toHaveTextContent(/^Borehole log\s*\(not in the plan\)/);
    expect(named).toHaveTextContent("Harwick lane 3(borehole log, not in the plan)");
    expect(plan).not.toHaveTextContent("not in the plan");
  });
});
