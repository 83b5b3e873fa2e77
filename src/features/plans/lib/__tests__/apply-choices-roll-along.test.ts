import { describe, expect, it } from "vitest";
import { act, renderHook } from "@testing-library/react";
import { useForm } from "react-hook-form";
import { applyChoices, appliedFormSpread } from "../apply-choices";
import { parsePlanForm, planToForm, type PlanForm } from "../plan-form";
import { usePlanHistory } from "../../hooks/use-plan-history";
import { threeLayerPlan } from "../../__tests__/fixtures";
import type { Spread } from "../engine";

// Geometry by hand: N channels at Δx span (N − 1)·Δx; a roll-along of k spreads of c channels
// sharing o stations has c + (k − 1)(c − o) stations (common practice).
const spread = (spacing: number, channels: number, rollAlong?: Spread["rollAlong"]): Spread => ({
  spacing,
  channels,
  firstGeophone: 0,
  shots: [
    { position: -spacing / 2, anchor: { to: "start", offset: -spacing / 2 } },
    {
      position: (channels - 1) * spacing + spacing / 2,
      anchor: { to: "end", offset: spacing / 2 },
    },
  ],
  ...(rollAlong ? { rollAlong } : {}),
});

const byChoice = (options: ReturnType<typeof applyChoices>) =>
  Object.fromEntries(options.map((o) => [o.choice, o]));

describe("applyChoices as roll-along", () => {
  it("offers an option beyond the seismograph's channels as spreads of its channel count", () => {
    const o = byChoice(
      applyChoices(spread(3, 24), { maxSpacing: 5, spreadLength: 405 }, "metric", 48),
    );
    // 405 m at 3 m = 135 intervals = 136 channels (by hand), more than 48.
    const keep = o["keep-spacing"];
    expect(keep.channels).toBe(136);
    expect(keep.rollAlong).toBeNull();
    expect(keep.flags.join(" ")).toMatch(/lay it as roll-along \(3 spreads, below\)/);
    const roll = keep.asRollAlong!;
    // Spreads of 48 moving on 46 stations: 1 + ⌈(136 − 48)/46⌉ = 3 spreads, 48 + 2·46 = 140
    // stations over 139 · 3 = 417 m (by hand); overlap 2 is the stated default.
    expect(roll.channels).toBe(48);
    expect(roll.spacing).toBe(3);
    expect(roll.rollAlong).toEqual({ spreads: 3, overlap: 2 });
    expect(roll.consequence).toMatch(
      /^3 spreads of 48 channels, overlapping by 2, 140 stations over 417\.00 m\./,
    );
    // Shots are recorded one spread at a time: 47 · 3 = 141 m of offsets, not 405 m.
    expect(roll.consequence).toMatch(/offsets reach 141\.00 m, short of the 405\.00 m needed/);
    expect(roll.flags.join(" ")).not.toMatch(/more than the seismograph/);
    // The end shot follows the first spread's end: 47 · 3 + 1.5 m.
    expect(roll.shots).toEqual([-1.5, 142.5]);
  });

  it("offers no roll-along when the option fits the seismograph", () => {
    const o = byChoice(
      applyChoices(spread(3, 24), { maxSpacing: 5, spreadLength: 100 }, "metric", 48),
    );
    for (const option of Object.values(o)) expect(option.asRollAlong).toBeUndefined();
  });

  it("counts a roll-along plan's whole line and keeps its overlap", () => {
    // 3 spreads of 24 sharing 4: 24 + 2 · 20 = 64 stations (by hand).
    const o = byChoice(
      applyChoices(
        spread(2, 24, { spreads: 3, overlap: 4 }),
        { maxSpacing: 3, spreadLength: 60 },
        "metric",
        24,
      ),
    );
    const keep = o["keep-channels"];
    expect(keep.channels).toBe(64);
    // The same line again: 1 + ⌈(64 − 24)/20⌉ = 3 spreads, nothing to change.
    expect(keep.asRollAlong!.rollAlong).toEqual({ spreads: 3, overlap: 4 });
    expect(keep.asRollAlong!.unchanged).toBe(true);
    expect(keep.unchanged).toBe(false);
  });

  it("removes the roll-along when the line fits one spread of the seismograph", () => {
    const o = byChoice(
      applyChoices(
        spread(2, 24, { spreads: 3, overlap: 4 }),
        { maxSpacing: 3, spreadLength: 60 },
        "metric",
        96,
      ),
    );
    const keep = o["keep-channels"];
    expect(keep.channels).toBe(64);
    expect(keep.rollAlong).toBeNull();
    expect(keep.asRollAlong).toBeUndefined();
    expect(keep.consequence).toMatch(/One spread: the roll-along of 3 spreads is removed\.$/);
  });
});

describe("appliedFormSpread", () => {
  const form = (): PlanForm => planToForm(threeLayerPlan(), "metric");

  it("sets spacing, channels, shots and the roll-along in the user's units; it round-trips", () => {
    const next = appliedFormSpread(
      form().spread,
      { spacing: 3, channels: 48, shots: [-1.5, 142.5], rollAlong: { spreads: 3, overlap: 2 } },
      "metric",
    );
    expect(next.spacing).toBe("3");
    expect(next.channels).toBe("48");
    expect(next.shots.map((s) => s.position)).toEqual(["-1.5", "142.5"]);
    expect(next.rollAlong).toEqual({ on: true, spreads: "3", overlap: "2" });
    const plan = parsePlanForm({ ...form(), spread: next }, "metric", "x")!;
    expect(plan.spread.rollAlong).toEqual({ spreads: 3, overlap: 2 });
    expect(planToForm(plan, "metric").spread.rollAlong).toEqual(next.rollAlong);
  });

  it("switches a roll-along off for a one-spread option, keeping what was typed", () => {
    const rolled = { ...form().spread, rollAlong: { on: true, spreads: "3", overlap: "2" } };
    const next = appliedFormSpread(
      rolled,
      { spacing: 5, channels: 30, shots: [-2.5, 147.5], rollAlong: null },
      "metric",
    );
    expect(next.rollAlong).toEqual({ on: false, spreads: "3", overlap: "2" });
    expect(parsePlanForm({ ...form(), spread: next }, "metric", "x")!.spread.rollAlong).toBe(
      undefined,
    );
  });

  it("is one undo step when set as one value", () => {
    const { result } = renderHook(() => {
      const f = useForm<PlanForm>({ defaultValues: form() });
      const history = usePlanHistory(f, true);
      return { f, history };
    });
    const before = JSON.stringify(result.current.f.getValues());
    act(() => {
      const { f } = result.current;
      f.setValue(
        "spread",
        appliedFormSpread(
          f.getValues("spread"),
          { spacing: 3, channels: 48, shots: [-1.5, 142.5], rollAlong: { spreads: 3, overlap: 2 } },
          "metric",
        ),
        { shouldDirty: true },
      );
    });
    expect(result.current.f.getValues("spread.rollAlong")).toEqual({
      on: true,
      spreads: "3",
      overlap: "2",
    });
    act(() => void result.current.history.undo());
    expect(JSON.stringify(result.current.f.getValues())).toBe(before);
    expect(result.current.history.getState().canUndo).toBe(false);
  });
});
