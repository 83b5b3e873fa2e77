// CSV uploads and exports. Line and column naming is our own contract (issue 6: "a malformed
// CSV names the line and column"); the materials table below is an invented test table.
import { describe, expect, it } from "vitest";
import Papa from "papaparse";
import { parsePicksCsv } from "./picks-csv";
import { parseBoreholeCsv } from "./borehole-csv";
import { materialLookup } from "./material-lookup";
import { stationLayout, stationLayoutCsv } from "./station-csv";
import { normalizeHeader, readCsvTable } from "./csv-table";
import { findMaterial } from "@engine";

const materials = [
  { key: "dry-sand", name: "Dry sand", velocityRange: [200, 1000] as const },
  { key: "clay", name: "Clay", velocity: 1800, aliases: ["stiff clay"] },
  { key: "granite", name: "Granite", velocity: 5700 },
];

describe("normalizeHeader", () => {
  it("folds case, blanks and bracketed units", () => {
    expect(normalizeHeader(" Time (ms) ")).toBe("time_ms");
    expect(normalizeHeader("\uFEFFVelocity [m/s]")).toBe("velocity_m_s");
    expect(normalizeHeader("Shot-Position")).toBe("shot_position");
  });
});

describe("readCsvTable", () => {
  it("keeps file line numbers across blank lines, comments and quoted line breaks", () => {
    const table = readCsvTable(
      '# picks from the pilot shot\nshot,geophone,note\n\n0,2,"two\nlines"\n0,4,x\n',
    );
    if (Array.isArray(table)) throw new Error(table[0].message);
    expect(table.headerLine).toBe(2);
    expect(table.rows.map((r) => r.line)).toEqual([4, 6]);
  });
});

describe("parsePicksCsv", () => {
  it("reads times in ms from the header and converts them to seconds", () => {
    const result = parsePicksCsv("shot_m,geophone_m,time_ms\n0,2,4.5\n0,4,9\r\n-2,4,12.25\n");
    expect(result).toEqual({
      ok: true,
      timeUnit: "ms",
      rows: [
        { line: 2, shotPosition: 0, geophonePosition: 2, time: 0.0045 },
        { line: 3, shotPosition: 0, geophonePosition: 4, time: 0.009 },
        { line: 4, shotPosition: -2, geophonePosition: 4, time: 0.01225 },
      ],
    });
  });

  it("accepts other header spellings, semicolons and decimal commas", () => {
    const result = parsePicksCsv("Source position (m);Receiver;First break [s]\n0;2,5;0,0045\n");
    expect(result.ok).toBe(true);
    if (result.ok) expect(result.rows[0]).toMatchObject({ geophonePosition: 2.5, time: 0.0045 });
  });

  it("uses the unit chosen on upload for a bare time column, and asks for one otherwise", () => {
    const text = "shot,geophone,time\n0,2,0.004\n";
    const chosen = parsePicksCsv(text, { timeUnit: "s" });
    expect(chosen.ok && chosen.rows[0].time).toBe(0.004);
    const missing = parsePicksCsv(text);
    expect(missing.ok).toBe(false);
    if (!missing.ok)
      expect(missing.errors[0].message).toMatch(
        /^line 1, column time: the time unit is not stated/,
      );
  });

  it("names the line and column of a value that is not a number", () => {
    const lines = [
      "shot_m,geophone_m,time_ms",
      "0,2,4",
      "0,4,5",
      "0,6,6",
      "0,8,7",
      "0,10,8",
      "0,12,abc",
    ];
    const result = parsePicksCsv(lines.join("\n"));
    expect(result).toEqual({
      ok: false,
      errors: [
        { line: 7, column: "time_ms", message: "line 7, column time_ms: 'abc' is not a number" },
      ],
    });
  });

  it("reports missing values, negative times, duplicates and missing columns", () => {
    const bad = parsePicksCsv("shot_m,geophone_m,time_ms\n0,,4\n0,4,-1\n0,6,3\n0,6,3.5\n");
    expect(bad.ok).toBe(false);
    if (!bad.ok) {
      expect(bad.errors.map((e) => e.message)).toEqual([
        "line 2, column geophone_m: value is missing",
        "line 3, column time_ms: -1 is negative; first-break times are counted from the shot",
        "line 5: a second pick for shot 0 m and geophone 6 m (the first is on line 4)",
      ]);
    }
    const noShot = parsePicksCsv("geophone_m,time_ms\n2,4\n");
    expect(!noShot.ok && noShot.errors[0].message).toBe(
      "line 1: no shot position column (e.g. shot_m)",
    );
  });

  it("refuses an empty file and a header without picks", () => {
    expect(parsePicksCsv("").ok).toBe(false);
    const headerOnly = parsePicksCsv("shot_m,geophone_m,time_ms\n");
    expect(!headerOnly.ok && headerOnly.errors[0].message).toBe(
      "line 1: the file holds a header but no picks",
    );
  });

  it("caps a long list of problems with a count of the rest", () => {
    const text = [
      "shot_m,geophone_m,time_ms",
      ...Array.from({ length: 80 }, (_, i) => `0,${i},x`),
    ].join("\n");
    const result = parsePicksCsv(text);
    expect(!result.ok && result.errors.length).toBe(51);
    expect(!result.ok && result.errors[50].message).toBe("… and 30 more problems");
  });
});

describe("materialLookup", () => {
  it("matches keys, names and aliases loosely and takes a range's midpoint", () => {
    const lookup = materialLookup(materials);
    expect(lookup("DRY SAND")).toEqual({ key: "dry-sand", velocity: 600 });
    expect(lookup("stiff  clay")).toEqual({ key: "clay", velocity: 1800 });
    expect(lookup("peat")).toBeNull();
    expect(materialLookup({ till: { velocityRange: [1500, 2500] }, water: 1480 })("Water")).toEqual(
      {
        key: "water",
        velocity: 1480,
      },
    );
  });
});

describe("parseBoreholeCsv", () => {
  it("builds a ground model, filling velocities from the table and ending in a half-space", () => {
    const text = [
      "depth_from,depth_to,material,velocity_m_s",
      "0,1.5,Dry sand,",
      "1.5,4,clay,1650",
      "4,6.5,clay,1650",
      "6.5,8,granite,",
    ].join("\n");
    const result = parseBoreholeCsv(text, materials, { name: "BH-3 Harwick lane" });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.model).toEqual({
      name: "BH-3 Harwick lane",
      layers: [
        { name: "Dry sand", material: "dry-sand", velocity: 600, thickness: 1.5 },
        { name: "clay", material: "clay", velocity: 1650, thickness: 5 },
        { name: "granite", material: "granite", velocity: 5700 },
      ],
    });
    expect(result.rows.map((r) => r.velocitySource)).toEqual(["table", "file", "file", "table"]);
  });

  it("keeps equal neighbours apart when asked", () => {
    const text = "from,to,soil\n0,1,clay\n1,2,clay\n2,3,granite\n";
    const result = parseBoreholeCsv(text, materials, { mergeEqualNeighbours: false });
    expect(result.ok && result.model.layers.map((l) => l.thickness)).toEqual([1, 1, undefined]);
  });

  it("names gaps and overlaps by line", () => {
    const text = "depth_from,depth_to,material\n0,1,clay\n1.2,2,clay\n1.8,3,granite\n";
    const result = parseBoreholeCsv(text, materials);
    expect(!result.ok && result.errors.map((e) => e.message)).toEqual([
      "line 3: gap from 1 m to 1.2 m after the interval on line 2",
      "line 4: overlaps the interval on line 3 (starts at 1.8 m, above its base at 2 m)",
    ]);
  });

  it("names an unknown material without a velocity, a log not starting at 0 m and a reversed interval", () => {
    const text = "top_m,bottom_m,lithology,vp\n0.5,1,peat,\n1,0.8,clay,\n";
    const result = parseBoreholeCsv(text, materials);
    expect(!result.ok && result.errors.map((e) => e.message)).toEqual([
      "line 2, column top_m: the log starts at 0.5 m; it must start at the ground surface (0 m)",
      "line 2, column lithology: 'peat' is not in the material table and no velocity is given",
      "line 3, column bottom_m: 0.8 m is not below depth_from 1 m",
    ]);
  });

  it("converts km/s and refuses velocities outside the schema's range", () => {
    const ok = parseBoreholeCsv("from,to,material,Vp (km/s)\n0,2,fill,0.45\n2,5,rock,4.2\n", []);
    expect(ok.ok && ok.model.layers.map((l) => l.velocity)).toEqual([450, 4200]);
    const bad = parseBoreholeCsv("from,to,material,velocity\n0,2,fill,-3\n", []);
    expect(!bad.ok && bad.errors[0].message).toBe(
      "line 2, column velocity: -3 is outside 0–10000 m/s",
    );
  });

  it("fills velocities from the engine's material table by default", () => {
    const result = parseBoreholeCsv("from,to,material\n0,3,dry sand\n3,9,granite\n");
    expect(result.ok && result.model.layers).toEqual([
      {
        name: "dry sand",
        material: "dry-sand",
        velocity: findMaterial("dry-sand")?.typical,
        thickness: 3,
      },
      { name: "granite", material: "granite", velocity: findMaterial("granite")?.typical },
    ]);
  });

  it("refuses a log with more layers than a ground model holds", () => {
    const rows = Array.from({ length: 13 }, (_, i) => `${i},${i + 1},m${i},${300 + 100 * i}`);
    const result = parseBoreholeCsv(["from,to,material,velocity", ...rows].join("\n"), []);
    expect(!result.ok && result.errors[0].message).toBe(
      "line 14: the log makes 13 layers; a ground model holds at most 12",
    );
  });
});

describe("station layout", () => {
  const spread = {
    spacing: 2.5,
    channels: 4,
    firstGeophone: 0,
    shots: [{ position: -1.25, label: "off-end" }, { position: 3.75 }],
  };

  it("lists geophones at equal spacing from the first one, then the shots", () => {
    expect(stationLayout(spread)).toEqual([
      { kind: "geophone", number: 1, label: "G1", position: 0 },
      { kind: "geophone", number: 2, label: "G2", position: 2.5 },
      { kind: "geophone", number: 3, label: "G3", position: 5 },
      { kind: "geophone", number: 4, label: "G4", position: 7.5 },
      { kind: "shot", number: 1, label: "off-end", position: -1.25 },
      { kind: "shot", number: 2, label: "S2", position: 3.75 },
    ]);
  });

  it("writes CSV with a header that reads back to the same stations", () => {
    const csv = stationLayoutCsv({ ...spread, shots: [{ position: 10, label: 'far, "east"' }] });
    expect(csv.split("\r\n")[0]).toBe("kind,number,label,position_m");
    const back = Papa.parse<string[]>(csv.trim()).data;
    expect(back).toHaveLength(6);
    expect(back[5]).toEqual(["shot", "1", 'far, "east"', "10"]);
  });

  it("throws a RangeError for a spread that breaks the plan schema", () => {
    expect(() => stationLayout({ ...spread, spacing: -1 })).toThrow(RangeError);
  });
});
