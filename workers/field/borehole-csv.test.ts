// Borehole-log vocabulary (issue 14, item 8). Expected velocities are the material table's
// ranges, whose sources the engine names (Kearey, Brooks & Hill 2002 Table 3.1 and Burger,
// Sheehan & Jones 2006 Table 3.1, from memory; common practice, from memory).
import { describe, expect, it } from "vitest";
import { findMaterial } from "@engine";
import { boreholeModelName, parseBoreholeCsv } from "./borehole-csv";

const typical = (key: string) => findMaterial(key)!.typical;

describe("borehole log words", () => {
  it("finds materials behind the qualifiers a log writes (soft clay, dense sandy gravel …)", () => {
    const text = [
      "depth_from,depth_to,material",
      "0,0.3,Dark brown TOPSOIL",
      "0.3,1.2,MADE GROUND (brick rubble)",
      "1.2,2.5,Soft grey clay",
      "2.5,4,Dense sandy GRAVEL",
      "4,6,dry glacial till",
      "6,9,Highly weathered sandstone",
      "9,12,sandstone",
    ].join("\n");
    const result = parseBoreholeCsv(text);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.model.layers.map((l) => [l.name, l.material, l.velocity])).toEqual([
      ["Dark brown TOPSOIL", "topsoil", typical("topsoil")],
      ["MADE GROUND (brick rubble)", "fill", typical("fill")],
      ["Soft grey clay", "clay", typical("clay")],
      ["Dense sandy GRAVEL", "gravel", typical("gravel")],
      ["dry glacial till", "dry-till", typical("dry-till")],
      ["Highly weathered sandstone", "weathered-rock", typical("weathered-rock")],
      ["sandstone", "sandstone", typical("sandstone")],
    ]);
    // The layer name keeps what the log says; only the material key and velocity come from
    // the table. Weathered rock is slower than fresh sandstone (common practice).
    expect(typical("weathered-rock")).toBeLessThan(typical("sandstone"));
  });

  it("still refuses a material the table does not hold, naming the line", () => {
    const result = parseBoreholeCsv("from,to,material\n0,2,fibrous peat\n2,5,granite\n");
    expect(!result.ok && result.errors.map((e) => e.message)).toEqual([
      "line 2, column material: 'fibrous peat' is not in the material table and no velocity is given",
    ]);
  });

  it.each([
    ["borehole.csv", "Borehole log"],
    ["Borehole_log.CSV", "Borehole log"],
    ["BH-3 Harwick lane.csv", "BH-3 Harwick lane"],
    ["borehole_7.csv", "borehole 7"],
    ["Harwick lane 3.csv", "Borehole log Harwick lane 3"],
    ["C:\\logs\\pit-2.csv", "Borehole log pit-2"],
  ])("names the model after %j as %j (never 'Borehole log borehole')", (file, name) => {
    expect(boreholeModelName(file)).toBe(name);
  });
});
