import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  formatInput,
  formatQuantity,
  formatSigned,
  fromDisplay,
  localiseMessage,
  METRES_PER_FOOT,
  parseInput,
  toDisplay,
  unitLabel,
} from "../units";

describe("units", () => {
  it("converts metres to feet with the international foot (1 ft = 0.3048 m exactly, NIST SP 811)", () => {
    expect(toDisplay("length", 0.3048, "imperial")).toBeCloseTo(1, 12);
    expect(toDisplay("length", 100, "imperial")).toBeCloseTo(328.083989501, 8);
    expect(METRES_PER_FOOT).toBe(0.3048);
  });

  it("converts velocities the same way (m/s ↔ ft/s)", () => {
    expect(toDisplay("velocity", 1500, "imperial")).toBeCloseTo(4921.2598425, 6);
    expect(fromDisplay("velocity", 5000, "imperial")).toBeCloseTo(1524, 9);
  });

  it("leaves metric values alone and shows times in milliseconds in both systems", () => {
    expect(toDisplay("length", 12.5, "metric")).toBe(12.5);
    expect(toDisplay("time", 0.0125, "metric")).toBeCloseTo(12.5, 12);
    expect(toDisplay("time", 0.0125, "imperial")).toBeCloseTo(12.5, 12);
    expect(fromDisplay("time", 0.5, "imperial")).toBeCloseTo(0.0005, 12);
    expect(toDisplay("angle", 7, "imperial")).toBe(7);
  });

  it("round-trips any finite value through the display units", () => {
    fc.assert(
      fc.property(
        fc.constantFrom("length", "velocity", "time", "angle" as const),
        fc.constantFrom("metric", "imperial" as const),
        fc.double({ min: -1e6, max: 1e6, noNaN: true }),
        (q, system, v) => {
          const back = fromDisplay(q, toDisplay(q, v, system), system);
          expect(Math.abs(back - v)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(v)));
        },
      ),
    );
  });

  it("names the unit for each quantity and system", () => {
    expect(unitLabel("length", "metric")).toBe("m");
    expect(unitLabel("length", "imperial")).toBe("ft");
    expect(unitLabel("velocity", "metric")).toBe("m/s");
    expect(unitLabel("velocity", "imperial")).toBe("ft/s");
    expect(unitLabel("time", "imperial")).toBe("ms");
  });

  it("formats a value with its unit and never prints NaN", () => {
    expect(formatQuantity("length", 3.048, "imperial")).toBe("10.00 ft");
    expect(formatQuantity("velocity", 1500, "metric")).toBe("1,500 m/s");
    expect(formatQuantity("time", 0.0021, "metric")).toBe("2.10 ms");
    expect(formatQuantity("length", Number.NaN, "metric")).toBe("—");
    expect(formatQuantity("length", null, "metric")).toBe("—");
    expect(formatQuantity("angle", 4, "metric")).toBe("4.0°");
  });

  it("signs differences, and drops the sign of one that rounds to zero", () => {
    expect(formatSigned("length", 1.2, "metric")).toBe("+1.20 m");
    expect(formatSigned("length", -0.35, "metric")).toBe("−0.35 m");
    expect(formatSigned("length", 0.001, "metric")).toBe("0.00 m");
    expect(formatSigned("length", -0.004, "metric")).toBe("0.00 m");
    expect(formatSigned("percent", -12.34, "metric")).toBe("−12.3%");
    expect(formatSigned("length", Number.NaN, "metric")).toBe("—");
  });

  it("parses typed input into SI: empty is undefined, junk is NaN, commas are refused", () => {
    expect(parseInput("length", "10", "imperial")).toBeCloseTo(3.048, 12);
    // the stored SI value carries no conversion noise into the saved plan (1 ft = 0.3048 m exactly)
    expect(parseInput("length", "10", "imperial")).toBe(3.048);
    expect(parseInput("length", "12.5", "imperial")).toBe(3.81);
    expect(parseInput("velocity", "5000", "imperial")).toBe(1524);
    expect(parseInput("length", " 2.5 ", "metric")).toBe(2.5);
    expect(parseInput("length", "", "metric")).toBeUndefined();
    expect(parseInput("length", "  ", "metric")).toBeUndefined();
    expect(parseInput("velocity", "1,500", "metric")).toBeNaN();
    expect(parseInput("velocity", "fast", "metric")).toBeNaN();
    expect(parseInput("angle", "-4", "metric")).toBe(-4);
    expect(parseInput("time", "0.5", "metric")).toBeCloseTo(0.0005, 12);
  });

  it("fills an input box with a short, exact-looking number", () => {
    expect(formatInput("length", 3.048, "imperial")).toBe("10");
    expect(formatInput("length", 2.5, "metric")).toBe("2.5");
    expect(formatInput("velocity", 1524, "imperial")).toBe("5000");
    expect(formatInput("length", undefined, "metric")).toBe("");
    expect(formatInput("time", 0.0005, "metric")).toBe("0.5");
  });

  it("shows precision fit for the unit in feet (issue 14: 7.87402, 1640.42, 10826.8)", () => {
    // 1 ft = 0.3048 m exactly (1959 international yard and pound agreement).
    expect(formatInput("length", 2.4, "imperial")).toBe("7.87"); // 7.874015… ft
    expect(formatInput("velocity", 500, "imperial")).toBe("1640"); // 1640.42 ft/s
    expect(formatInput("velocity", 3300, "imperial")).toBe("10827"); // 10826.77 ft/s
    expect(formatInput("length", 26.4375, "metric")).toBe("26.438"); // to the millimetre
    expect(formatInput("length", -0.0001, "metric")).toBe("0"); // no "-0"
    // A message keeps the same precision as the boxes: 2.47 m = 8.1037 ft → 8.1 ft.
    expect(localiseMessage("at least 2.47 m", "imperial")).toBe("at least 2.47 m (8.1 ft)");
  });

  it("adds the ms figure to a limit in seconds for every user (times are typed in ms)", () => {
    expect(localiseMessage("pick error must be between 0 and 0.1 s", "metric")).toBe(
      "pick error must be between 0 and 0.1 s (100 ms)",
    );
    expect(localiseMessage("pick error must be between 0 and 0.1 s", "imperial")).toBe(
      "pick error must be between 0 and 0.1 s (100 ms)",
    );
    expect(localiseMessage("at most 10 shots", "metric")).toBe("at most 10 shots");
  });

  it("adds the feet figure to SI limits in messages for an imperial user only", () => {
    expect(localiseMessage("velocity must be at most 10000 m/s", "imperial")).toBe(
      "velocity must be at most 10000 m/s (32808 ft/s)",
    );
    expect(localiseMessage("thickness must be at most 1000 m", "imperial")).toBe(
      "thickness must be at most 1000 m (3280.84 ft)",
    );
    expect(localiseMessage("velocity must be at most 10000 m/s", "metric")).toBe(
      "velocity must be at most 10000 m/s",
    );
    expect(localiseMessage("dip must be between -45 and 45 degrees", "imperial")).toBe(
      "dip must be between -45 and 45 degrees",
    );
  });
});
