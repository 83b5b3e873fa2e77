import { describe, expect, it } from "vitest";
import { scaleLinear } from "d3-scale";
import { lengthTicks, residualScales } from "../td-chart";
import { length, localise, speed } from "../format";

const frame = { width: 600, height: 200, margin: { left: 50, right: 10, top: 10, bottom: 40 } };

describe("lengthTicks", () => {
  it("places ticks at round feet for a feet user, each at its SI position", () => {
    const x = scaleLinear().domain([0, 30]).range([0, 300]);
    const ticks = lengthTicks(x, "imperial", 5);
    // 30 m = 98.4 ft (÷ 0.3048, 1959 international foot): ticks 0, 20 … 80 ft.
    expect(ticks.map((t) => t.shown)).toEqual([0, 20, 40, 60, 80]);
    expect(ticks[1].si).toBeCloseTo(6.096, 9);
  });

  it("keeps metric ticks in metres", () => {
    const x = scaleLinear().domain([0, 30]).range([0, 300]);
    expect(lengthTicks(x, "metric", 5).map((t) => t.shown)).toEqual([0, 5, 10, 15, 20, 25, 30]);
  });
});

describe("residualScales", () => {
  it("widens an odd residual range to round ms values", () => {
    const rows = [
      { receiverPosition: 0, residual: 0.0068 },
      { receiverPosition: 10, residual: -0.002 },
    ];
    const { y, yTicks } = residualScales(frame, rows, 0.002, "metric");
    // ±6.8 ms × 1.1 = ±7.48 ms, made nice (d3 nice with a 5 ms step): ±10 ms, ticks every 5 ms.
    expect(y.domain().map((v) => Number((v * 1000).toFixed(6)))).toEqual([-10, 10]);
    expect(yTicks.map((t) => Number((t * 1000).toFixed(6)))).toEqual([-10, -5, 0, 5, 10]);
  });
});

describe("field format", () => {
  it("shows a length to 0.01 m or 0.1 ft and a velocity whole", () => {
    // 3.0 m = 9.84 ft; 1500 m/s = 4921 ft/s (÷ 0.3048).
    expect(length(3, "metric")).toBe("3 m");
    expect(length(3, "imperial")).toBe("9.8 ft");
    expect(length(12.345, "metric")).toBe("12.35 m");
    expect(speed(1500, "imperial")).toBe("4921 ft/s");
    expect(speed(1500, "metric")).toBe("1500 m/s");
    expect(length(null, "metric")).toBe("–");
  });

  it("writes a field-core message's metres in feet, leaving times alone", () => {
    // 18 m = 59.06 ft, 19 m = 62.34 ft, 2800 m/s = 9186 ft/s (÷ 0.3048).
    expect(localise("geophone 18 m (19 m offset) is 7.8 ms late; 2800 m/s", "imperial")).toBe(
      "geophone 59.1 ft (62.3 ft offset) is 7.8 ms late; 9186 ft/s",
    );
    expect(localise("geophone 18 m", "metric")).toBe("geophone 18 m");
  });
});
