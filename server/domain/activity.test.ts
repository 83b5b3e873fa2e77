import { describe, expect, it } from "vitest";
import Papa from "papaparse";
import { csvCell, toCsv } from "./activity";

// RFC 4180 §2: fields with commas, quotes or line breaks are quoted; quotes are doubled.
describe("CSV", () => {
  it("leaves plain text alone and quotes what RFC 4180 says to quote", () => {
    expect(csvCell("plan.save")).toBe("plan.save");
    expect(csvCell("a,b")).toBe('"a,b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell("two\nlines")).toBe('"two\nlines"');
    expect(csvCell(null)).toBe("");
  });

  it("defuses cells a spreadsheet would run as formulas (OWASP CSV injection)", () => {
    expect(csvCell("=1+1")).toBe("'=1+1");
    expect(csvCell("@SUM(A1)")).toBe("'@SUM(A1)");
    expect(csvCell("-2")).toBe("'-2");
    expect(csvCell("+a,b")).toBe(`"'+a,b"`);
  });

  it("round-trips through a CSV parser with a header row", () => {
    const rows = [
      ["x", 'q"uote', "comma, here"],
      ["multi\r\nline", "", "ok"],
    ];
    const csv = toCsv(["a", "b", "c"], rows);
    expect(csv.endsWith("\r\n")).toBe(true);
    const parsed = Papa.parse<string[]>(csv.trimEnd(), { newline: "\r\n" });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data).toEqual([["a", "b", "c"], ...rows]);
  });
});
