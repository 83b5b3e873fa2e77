import { describe, expect, it } from "vitest";
import { render } from "@testing-library/react";
import { SectionAxes, SectionGrid } from "../section-axes";

const frame = { width: 400, height: 200, margin: { top: 20, right: 10, bottom: 40, left: 50 } };

describe("SectionAxes", () => {
  it("writes each tick label at its place, a tick mark per x tick, and both axis titles", () => {
    const { container } = render(
      <svg>
        <SectionGrid frame={frame} yTicks={[{ px: 60, label: "96" }]} />
        <SectionAxes
          frame={frame}
          xTicks={[
            { px: 100, label: "0" },
            { px: 300, label: "50" },
          ]}
          yTicks={[{ px: 60, label: "96" }]}
          xLabel="Position along the line (m)"
          yLabel="Elevation (m)"
        />
      </svg>,
    );
    const texts = [...container.querySelectorAll("text")];
    const x50 = texts.find((t) => t.textContent === "50")!;
    expect(x50.getAttribute("x")).toBe("300");
    // labels sit under the bottom axis (height − margin.bottom = 160)
    expect(Number(x50.getAttribute("y"))).toBeGreaterThan(160);
    const y96 = texts.find((t) => t.textContent === "96")!;
    expect(y96.getAttribute("text-anchor")).toBe("end");
    expect(texts.map((t) => t.textContent)).toEqual(
      expect.arrayContaining(["Position along the line (m)", "Elevation (m)"]),
    );
    // two axis lines, two x tick marks, one grid line
    expect(container.querySelectorAll("line")).toHaveLength(5);
  });
});
