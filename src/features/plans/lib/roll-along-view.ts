/**
 * What the designer shows of a roll-along line (workers/engine/roll-along.ts): the line the
 * roll-along boxes describe as typed, the spreads of an analysed plan, and the plan as the
 * charts draw it (the spread whose detailed analysis the result carries).
 */
import { lineStations, rollAlongLayout, type RollAlong } from "@engine";
import { parseInput, type UnitSystem } from "@/lib/units";
import type { Plan, PlanAnalysis, Status } from "./engine";
import type { PlanForm } from "./plan-form";

/** The line of a roll-along as typed: station count and extent (m). */
export interface RollAlongLine {
  spreads: number;
  overlap: number;
  /** Geophone stations on the whole line, numbered 1..stations. */
  stations: number;
  /** Stations each spread moves on from the one before (channels − overlap). */
  step: number;
  /** Line length from the first to the last station, m. */
  length: number;
  firstGeophone: number;
  lastGeophone: number;
}

/**
 * The line the form's roll-along boxes describe, or null while they are off or any box does
 * not hold a value the plan schema accepts (its messages then name the box).
 */
export function typedRollAlongLine(
  spread: PlanForm["spread"] | undefined,
  units: UnitSystem,
): RollAlongLine | null {
  const roll = spread?.rollAlong;
  if (!spread || !roll?.on) return null;
  const spacing = parseInput("length", spread.spacing, units);
  const channels = parseInput("count", spread.channels, units);
  const first = parseInput("length", spread.firstGeophone, units);
  const spreads = parseInput("count", roll.spreads, units);
  const overlap = parseInput("count", roll.overlap, units);
  if (
    spacing === undefined ||
    !(spacing > 0) ||
    channels === undefined ||
    !Number.isInteger(channels) ||
    channels < 2 ||
    first === undefined ||
    !Number.isFinite(first) ||
    spreads === undefined ||
    !Number.isInteger(spreads) ||
    spreads < 2 ||
    overlap === undefined ||
    !Number.isInteger(overlap) ||
    overlap < 0 ||
    overlap >= channels
  )
    return null;
  const rollAlong: RollAlong = { spreads, overlap };
  const stations = lineStations(channels, rollAlong);
  const length = (stations - 1) * spacing;
  return {
    spreads,
    overlap,
    stations,
    step: channels - overlap,
    length,
    firstGeophone: first,
    lastGeophone: first + length,
  };
}

/** One spread of the line as the roll-along table lists it. */
export interface RollAlongRow {
  index: number;
  firstStation: number;
  lastStation: number;
  /** m */
  firstGeophone: number;
  /** m */
  lastGeophone: number;
  shots: { planShot: number; label: string; position: number }[];
  /** Present when the analysis judged the spreads. */
  worstStatus?: Status;
}

/** The analysis' roll-along part (PlanAnalysis.rollAlong), when the plan rolls along. */
export type AnalysisRollAlong = NonNullable<PlanAnalysis["rollAlong"]>;

/**
 * The spreads of `plan`'s line: from the analysis when it carries them (with verdicts),
 * otherwise laid out from the plan alone (no verdicts). Empty without roll-along.
 */
export function rollAlongRows(plan: Plan, analysis: PlanAnalysis | null): RollAlongRow[] {
  if (!plan.spread.rollAlong) return [];
  if (analysis?.rollAlong) return analysis.rollAlong.spreads.map((s) => ({ ...s }));
  return rollAlongLayout(plan.spread).spreads.map((s) => ({
    index: s.index,
    firstStation: s.firstStation,
    lastStation: s.lastStation,
    firstGeophone: s.firstGeophone,
    lastGeophone: s.lastGeophone,
    shots: s.shots,
  }));
}

/**
 * The plan as the Arrivals and Section charts draw it: for a roll-along plan, the spread whose
 * detailed analysis the result carries (`rollAlong.shown`), with that spread's geophones and
 * the shots it records (the result's shot indexes point into them); otherwise the plan itself.
 */
export function chartPlan(plan: Plan, analysis: PlanAnalysis | null): Plan {
  const shown = analysis?.rollAlong?.shown;
  if (!plan.spread.rollAlong || shown === undefined) return plan;
  const layout = rollAlongLayout(plan.spread);
  const part = layout.spreads[shown - 1];
  if (!part) return plan;
  const { rollAlong: _roll, ...rest } = plan.spread;
  void _roll;
  return {
    ...plan,
    spread: {
      ...rest,
      firstGeophone: part.firstGeophone,
      shots: part.shots.map((s) => ({ ...plan.spread.shots[s.planShot], position: s.position })),
    },
  };
}

/** The URL parameter holding the spread the charts show (1-based); absent = the worst spread. */
export const SHOWN_SPREAD_PARAM = "spread";

/** The spread asked for in the URL, or undefined (the analysis then shows the worst spread). */
export function shownSpreadParam(search: URLSearchParams): number | undefined {
  const n = Number(search.get(SHOWN_SPREAD_PARAM));
  return Number.isInteger(n) && n >= 1 ? n : undefined;
}
