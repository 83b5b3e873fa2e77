// Station CSV of a roll-along line (station-csv.ts), checked against a layout worked by hand
// (common practice: channel c of spread k stands on station (k − 1)·(N − overlap) + c, and
// stations follow at the spacing from the first geophone).
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import type { Spread } from "@engine";
import { stationLayout, stationLayoutCsv } from "./station-csv";

// 4 geophones at 2 m from 0 m, 2 spreads sharing 1 station: step 3, stations 1–4 and 4–7,
// 7 stations at 0, 2, …, 12 m. End shots 1 m off each end of each spread: spread 1 at −1 and
// 7 m, spread 2 (6…12 m) at 5 and 13 m.
const rolled: Spread = {
  spacing: 2,
  channels: 4,
  firstGeophone: 0,
  shots: [
    { position: -1, anchor: { to: "start", offset: -1 } },
    { position: 7, label: "east", anchor: { to: "end", offset: 1 } },
  ],
  rollAlong: { spreads: 2, overlap: 1 },
};

describe("stationLayoutCsv with roll-along", () => {
  it("writes one row per line station and per spread's shot, with spread and channel last", () => {
    expect(stationLayoutCsv(rolled).split("\r\n")).toEqual([
      "kind,number,label,position_m,spread,channel",
      "geophone,1,G1,0,1,1",
      "geophone,2,G2,2,1,2",
      "geophone,3,G3,4,1,3",
      "geophone,4,G4,6,1;2,4;1",
      "geophone,5,G5,8,2,2",
      "geophone,6,G6,10,2,3",
      "geophone,7,G7,12,2,4",
      "shot,1,S1,-1,1,",
      "shot,2,east,7,1,",
      "shot,1,S1,5,2,",
      "shot,2,east,13,2,",
      "",
    ]);
  });

  it("lists a fixed shot once, on the spread nearest to it", () => {
    // centres 3 m and 9 m: a fixed shot at 10.5 m is recorded by spread 2 only
    const rows = stationLayout({ ...rolled, shots: [{ position: 10.5, label: "mid 2" }] });
    expect(rows.filter((r) => r.kind === "shot")).toEqual([
      { kind: "shot", number: 1, label: "mid 2", position: 10.5, spreads: [2], channels: [] },
    ]);
  });

  it("shares `overlap` stations between neighbours: 3 spreads of 24 sharing 12", () => {
    const rows = stationLayout({
      ...rolled,
      channels: 24,
      rollAlong: { spreads: 3, overlap: 12 },
    }).filter((r) => r.kind === "geophone");
    expect(rows).toHaveLength(24 + 2 * 12);
    // station 13 is channel 13 of spread 1 and channel 1 of spread 2; 25 is 13 of 2, 1 of 3
    expect([rows[12].spreads, rows[12].channels]).toEqual([
      [1, 2],
      [13, 1],
    ]);
    expect([rows[24].spreads, rows[24].channels]).toEqual([
      [2, 3],
      [13, 1],
    ]);
    expect(rows[47]).toMatchObject({ number: 48, position: 94, spreads: [3], channels: [24] });
  });

  it("reads back with a CSV parser to the same rows", () => {
    const back = Papa.parse<string[]>(stationLayoutCsv(rolled).trim()).data;
    expect(back[4]).toEqual(["geophone", "4", "G4", "6", "1;2", "4;1"]);
    expect(back).toHaveLength(1 + 7 + 4);
  });

  it("keeps the four-column layout, byte for byte, without roll-along", () => {
    const { rollAlong: _roll, ...single } = rolled;
    expect(stationLayoutCsv(single)).toBe(
      "kind,number,label,position_m\r\n" +
        "geophone,1,G1,0\r\ngeophone,2,G2,2\r\ngeophone,3,G3,4\r\ngeophone,4,G4,6\r\n" +
        "shot,1,S1,-1\r\nshot,2,east,7\r\n",
    );
    expect(stationLayout(single).every((r) => !("spreads" in r))).toBe(true);
  });

  it("throws a RangeError naming the field for an overlap not below the channels", () => {
    expect(() => stationLayout({ ...rolled, rollAlong: { spreads: 2, overlap: 4 } })).toThrow(
      /rollAlong\.overlap/,
    );
  });
});
