import { describe, expect, it } from "vitest";
import type { FirstBreakPick } from "@/contracts/field";
import {
  adjustPick,
  countByOrigin,
  findPick,
  mergePicks,
  nearestShot,
  pickKey,
  placeTraces,
  removePick,
  samePicks,
  shotPositions,
} from "../picks";

const auto = (s: number, r: number, t: number): FirstBreakPick => ({
  sourcePosition: s,
  receiverPosition: r,
  time: t,
  origin: "auto",
});

describe("pick editing", () => {
  const picks = [auto(0, 4, 0.008), auto(0, 2, 0.004), auto(46, 44, 0.004)];

  it("adjusts one pick and marks it as adjusted, leaving the others", () => {
    const next = adjustPick(picks, 0, 4, 0.0091);
    expect(findPick(next, 0, 4)).toEqual({
      sourcePosition: 0,
      receiverPosition: 4,
      time: 0.0091,
      origin: "adjusted",
    });
    expect(findPick(next, 0, 2)).toEqual(picks[1]);
    expect(next).toHaveLength(3);
    // The input is not changed.
    expect(findPick(picks, 0, 4)?.time).toBe(0.008);
  });

  it("adds a pick for a trace that had none", () => {
    expect(adjustPick(picks, 0, 6, 0.011)).toHaveLength(4);
  });

  it("refuses a negative time", () => {
    expect(() => adjustPick(picks, 0, 4, -0.001)).toThrow(RangeError);
  });

  it("merges by shot and geophone to the millimetre, sorted by shot then geophone", () => {
    const merged = mergePicks(picks, [auto(0.0004, 2, 0.005), auto(46, 40, 0.01)]);
    expect(merged.map((p) => [p.sourcePosition, p.receiverPosition])).toEqual(
      [
        [0, 4],
        [0.0004, 2],
        [46, 40],
        [46, 44],
      ].sort((a, b) => a[0] - b[0] || a[1] - b[1]),
    );
    expect(merged).toHaveLength(4);
    expect(pickKey(0.0004, 2)).toBe(pickKey(0, 2));
  });

  it("removes, counts and compares picks", () => {
    expect(removePick(picks, 0, 2)).toHaveLength(2);
    expect(countByOrigin(adjustPick(picks, 0, 2, 0.0045))).toEqual({
      auto: 2,
      adjusted: 1,
      csv: 0,
    });
    expect(shotPositions(picks)).toEqual([0, 46]);
    expect(samePicks(picks, [...picks].reverse())).toBe(true);
    expect(samePicks(picks, adjustPick(picks, 0, 2, 0.004))).toBe(false);
  });
});

describe("placing the traces of a record", () => {
  it("uses RECEIVER_LOCATION when given and the plan's geophone of the channel otherwise", () => {
    const placed = placeTraces(
      [
        { index: 0, channel: 1, receiverPosition: 0.5 },
        { index: 1, channel: 7, receiverPosition: null },
        { index: 2, channel: null, receiverPosition: null },
      ],
      { firstGeophone: 10, spacing: 2 },
      -1,
    );
    expect(placed).toEqual([
      { receiverPosition: 0.5, sourcePosition: -1, receiverFrom: "record" },
      { receiverPosition: 22, sourcePosition: -1, receiverFrom: "plan" },
      { receiverPosition: 14, sourcePosition: -1, receiverFrom: "plan" },
    ]);
  });

  it("chooses the plan shot nearest to the recorded source", () => {
    const shots = [{ position: -1 }, { position: 23 }, { position: 47 }];
    expect(nearestShot(shots, 46)).toBe(2);
    expect(nearestShot(shots, 20)).toBe(1);
    expect(nearestShot(shots, null)).toBe(0);
  });
});
