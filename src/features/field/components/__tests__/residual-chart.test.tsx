import { describe, expect, it } from "vitest";
import { render, screen, within } from "@testing-library/react";
import type { ModelFit } from "../../../../../workers/field/index";
import { ResidualChart, ResidualTable } from "../comparison-panel";

// 24 geophones every 2 m from 0 to 46 m, one shot at −1 m; residuals swing up to ±3.4 ms so that
// the old scale (±1.1 × the largest residual) put its ticks at 3.4, 1.7 … ms.
const fit: ModelFit = {
  name: "sand over clay",
  rms: 0.002,
  meanResidual: 0,
  count: 24,
  unmodelled: 0,
  residuals: Array.from({ length: 24 }, (_, k) => {
    const residual = 0.0034 * Math.sin(k);
    return {
      sourcePosition: -1,
      receiverPosition: 2 * k,
      offset: 2 * k + 1,
      time: 0.02 + residual,
      modelled: 0.02,
      residual,
    };
  }),
};

/** The numbers a tick group shows ("−5" read as −5). */
const tickNumbers = (group: HTMLElement) =>
  Array.from(group.querySelectorAll("text")).map((t) =>
    Number((t.textContent ?? "").replace("−", "-")),
  );

describe("ResidualChart", () => {
  it("numbers the geophone axis in feet for a feet user and titles it with the unit", () => {
    render(<ResidualChart fit={fit} pickError={0.001} units="imperial" />);
    expect(screen.getByText("geophone position (ft)")).toBeInTheDocument();
    const xs = tickNumbers(screen.getByTestId("residual-x-ticks"));
    expect(xs.length).toBeGreaterThanOrEqual(3);
    // 46 m is 150.9 ft (1 ft = 0.3048 m exactly): the last tick lies past 100 ft and not beyond it.
    expect(Math.max(...xs)).toBeGreaterThan(100);
    expect(Math.max(...xs)).toBeLessThanOrEqual(150.9 + 10);
    // Round values in feet, evenly spaced.
    const step = xs[1] - xs[0];
    for (const x of xs) expect(x % step).toBeCloseTo(0, 9);
    expect(screen.getByText("shot at -3.3 ft")).toBeInTheDocument();
  });

  it("numbers the geophone axis in metres for a metric user", () => {
    render(<ResidualChart fit={fit} pickError={0.001} units="metric" />);
    expect(screen.getByText("geophone position (m)")).toBeInTheDocument();
    const xs = tickNumbers(screen.getByTestId("residual-x-ticks"));
    expect(Math.max(...xs)).toBeLessThanOrEqual(47);
    expect(Math.max(...xs)).toBeGreaterThanOrEqual(40);
  });

  it("puts the residual ticks on round ms values through zero", () => {
    render(<ResidualChart fit={fit} pickError={0.001} units="metric" />);
    const ys = tickNumbers(screen.getByTestId("residual-y-ticks"));
    expect(ys).toContain(0);
    // A 1, 2 or 5 × 10ⁿ ms step (d3's nice ticks), symmetric about zero: never 3.7 or 7.5 ms.
    const step = ys[1] - ys[0];
    expect([0.5, 1, 2, 5, 10]).toContain(Number(step.toFixed(6)));
    for (const y of ys) expect(Math.abs(y / step - Math.round(y / step))).toBeLessThan(1e-9);
    expect(ys).toContain(-ys[ys.length - 1]);
    // The ±3.4 ms residuals are inside the labelled range.
    expect(Math.max(...ys)).toBeGreaterThanOrEqual(2);
    expect(screen.getByText("residual (ms)")).toBeInTheDocument();
  });
});

describe("ResidualTable", () => {
  it("gives positions and offsets in the user's unit, named in the column heads", () => {
    const { container } = render(<ResidualTable fit={fit} units="imperial" />);
    const table = container.querySelector("table") as HTMLTableElement;
    expect(within(table).getByText("Offset (ft)")).toBeInTheDocument();
    const row = table.querySelectorAll("tr")[2]; // geophone at 2 m, offset 3 m
    // 3 m = 9.84 ft and 2 m = 6.56 ft (÷ 0.3048), shown to 0.1 ft.
    expect(row).toHaveTextContent("6.6");
    expect(row).toHaveTextContent("9.8");
  });
});
