import { describe, expect, it } from "vitest";
import { serializeFramedSvg } from "../export";
import { legendNear } from "@/features/plans/components/charts/export-buttons";

function chartInFigure() {
  document.body.innerHTML = `
    <figure>
      <div><svg width="400" height="200" viewBox="0 0 400 200"><path d="M0 0L10 10" stroke="#000"/><g data-export-skip="1"><rect/></g></svg></div>
      <ul aria-label="Legend">
        <li><span style="background: rgb(10, 20, 30)"></span>first arrival</li>
        <li><span style="background: rgb(200, 100, 0)"></span>Head wave, layer 2</li>
      </ul>
    </figure>`;
  return document.querySelector("svg") as SVGSVGElement;
}

describe("exported charts", () => {
  it("carry their title above and their legend below (issue 14)", () => {
    const svg = chartInFigure();
    const legend = legendNear(svg);
    expect(legend).toEqual([
      { label: "first arrival", colour: "rgb(10, 20, 30)" },
      { label: "Head wave, layer 2", colour: "rgb(200, 100, 0)" },
    ]);
    const text = serializeFramedSvg(svg, "Arrivals – Expected ground, shot 1", legend);
    const doc = new DOMParser().parseFromString(text, "image/svg+xml");
    const root = doc.documentElement;
    // 30 px title band + 200 px chart + one 18 px legend row + 8 px margin (by hand).
    expect(root.getAttribute("height")).toBe("256");
    const texts = Array.from(root.querySelectorAll(":scope > text")).map((t) => t.textContent);
    expect(texts).toEqual([
      "Arrivals – Expected ground, shot 1",
      "first arrival",
      "Head wave, layer 2",
    ]);
    const chart = root.querySelector(":scope > svg")!;
    expect(chart.getAttribute("y")).toBe("30");
    expect(chart.querySelector("path")).not.toBeNull();
    expect(chart.querySelector("[data-export-skip]")).toBeNull();
  });
});
