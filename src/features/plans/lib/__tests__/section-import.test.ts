import { describe, expect, it } from "vitest";
import {
  ImportProblem,
  basesFromBoreholes,
  parseBoreholeCsv,
  parseSurfaceCsv,
  projectOntoLine,
} from "../section-import";

describe("projectOntoLine", () => {
  it("projects a map point onto the line as a hand computation gives", () => {
    // Hand computation (written here, not by the code): A = (1000, 2000), B = (1030, 2040),
    // so AB = (30, 40), |AB| = 50, u = (0.6, 0.8). P = (1012, 2009): AP = (12, 9);
    // along = AP·u = 7.2 + 7.2 = 14.4 m; left offset = u × AP = 0.6·9 − 0.8·12 = −4.2 m
    // (P lies 4.2 m to the right). Check: 14.4² + 4.2² = 207.36 + 17.64 = 225 = |AP|².
    const r = projectOntoLine(
      { easting: 1012, northing: 2009 },
      { easting: 1000, northing: 2000 },
      { easting: 1030, northing: 2040 },
    );
    expect(r.position).toBeCloseTo(14.4, 9);
    expect(r.offset).toBeCloseTo(-4.2, 9);
  });

  it("adds the start position of the line's first point", () => {
    const r = projectOntoLine(
      { easting: 3, northing: 4 },
      { easting: 0, northing: 0 },
      { easting: 10, northing: 0 },
      -20,
    );
    expect(r.position).toBeCloseTo(-17, 9);
    expect(r.offset).toBeCloseTo(4, 9);
  });

  it("throws when the two line points coincide", () => {
    const a = { easting: 5, northing: 5 };
    expect(() => projectOntoLine(a, a, a)).toThrow(ImportProblem);
  });
});

describe("parseSurfaceCsv", () => {
  it("reads position,elevation with a header and sorts by position", () => {
    const s = parseSurfaceCsv("position,elevation\n60,99.5\n0,102\n120,97\n");
    expect(s.mode).toBe("along");
    expect(s.points).toEqual([
      [0, 102],
      [60, 99.5],
      [120, 97],
    ]);
  });

  it("reads a headerless two-column file in feet as metres (1 ft = 0.3048 m, exact by definition)", () => {
    const s = parseSurfaceCsv("0,100\n100,90\n", { scale: 0.3048 });
    expect(s.points[1][0]).toBeCloseTo(30.48, 6);
    expect(s.points[1][1]).toBeCloseTo(27.432, 6);
  });

  it("projects easting,northing,elevation onto the line through the first and last points", () => {
    // Points on the 3-4-5 line of the hand computation above, one 4.2 m off it.
    const csv = "easting,northing,elevation\n1000,2000,50\n1012,2009,49\n1030,2040,47\n";
    const s = parseSurfaceCsv(csv);
    expect(s.mode).toBe("projected");
    expect(s.line).toBe("first-last");
    expect(s.points.map((p) => p[0])).toEqual([0, 14.4, 50]);
    expect(s.largestOffset).toBeCloseTo(4.2, 6);
  });

  it("uses two points the user gives for the line", () => {
    const csv = "1,0,10\n5,2,11\n";
    const s = parseSurfaceCsv(csv, {
      line: { a: { easting: 0, northing: 0 }, b: { easting: 0, northing: 10 } },
    });
    expect(s.line).toBe("given");
    expect(s.points).toEqual([
      [0, 10],
      [2, 11],
    ]);
    expect(s.largestOffset).toBeCloseTo(5, 9);
  });

  it("names the line of a value that is not a number", () => {
    expect(() => parseSurfaceCsv("position,elevation\n0,100\n10,abc\n")).toThrow(
      /line 3: elevation "abc" is not a number/,
    );
  });

  it("refuses two points at the same position, naming both lines", () => {
    expect(() => parseSurfaceCsv("0,100\n10,99\n10,98\n")).toThrow(/lines 2 and 3/);
  });

  it("refuses a file with a single point", () => {
    expect(() => parseSurfaceCsv("0,100\n")).toThrow(/at least two points/);
  });
});

describe("boreholes", () => {
  const csv = "borehole,position,depth1,depth2\nBH1,20,3,6\nBH2,80,5,\n";

  it("reads one row per borehole; an empty depth is an absent layer", () => {
    const b = parseBoreholeCsv(csv);
    expect(b).toEqual([
      { name: "BH1", position: 20, depths: [3, 6] },
      { name: "BH2", position: 80, depths: [5, null] },
    ]);
  });

  it("refuses a depth above the base over it, naming the line", () => {
    expect(() => parseBoreholeCsv("BH1,20,6,3\n")).toThrow(/line 1: depth 2/);
  });

  it("interpolates bases linearly between boreholes and keeps them level beyond", () => {
    // Flat ground at 100 m: layer 1 base at 97 (BH1) and 95 (BH2); at 50 m, halfway,
    // linear interpolation gives 96 m (hand computation). Layer 2 is absent at BH2, so
    // its base meets layer 1's there (a pinch-out).
    const bases = basesFromBoreholes(parseBoreholeCsv(csv), () => 100, 0, 120);
    expect(bases[0]).toEqual([
      [0, 97],
      [20, 97],
      [80, 95],
      [120, 95],
    ]);
    expect(bases[1]).toEqual([
      [0, 94],
      [20, 94],
      [80, 95],
      [120, 95],
    ]);
  });
});
