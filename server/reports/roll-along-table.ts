/**
 * The roll-along table of the plan report: for a line laid out as several spreads
 * (`spread.rollAlong`, workers/engine/roll-along.ts), one row per spread with its stations, the
 * positions of its first and last geophone, the shots it records (label at position) and its
 * verdict from the engine's analysis. Pure functions of data plus a drawing step on the report
 * writer. Positions are stored in m and shown in the reader's units.
 */
import { rollAlongLayout, type Plan, type PlanAnalysis, type Status } from "@engine";
import { unitLabel, type UnitSystem } from "@/lib/units";
import { ink, reportUnits, type Cell, type ReportWriter } from "./layout";

/** The roll-along part of the analysis (PlanAnalysis.rollAlong). */
export type RollAlongAnalysis = NonNullable<PlanAnalysis["rollAlong"]>;

/** One spread as the table shows it; `worstStatus` is null when the plan was not analysed. */
export interface RollAlongTableSpread {
  index: number;
  firstStation: number;
  lastStation: number;
  firstGeophone: number;
  lastGeophone: number;
  shots: { label: string; position: number }[];
  worstStatus: Status | null;
}

const VERDICT_COLOURS: Record<Status, string> = {
  resolved: ink.moss,
  "under-sampled": ink.ochre,
  blind: ink.brick,
  inverted: ink.brick,
};

/** A length (m) in the reader's units to 2 decimals, trailing zeros trimmed, as the report writes lengths. */
export function reportLength(metres: number, units: UnitSystem): string {
  return reportUnits(units).len(metres, 2);
}

/**
 * The spreads of the line: from the analysis when it has them (with verdicts), else from the
 * plan's layout (verdicts null). Empty for a plan without roll-along.
 */
export function rollAlongSpreads(
  document: Plan,
  analysis: PlanAnalysis | null,
): RollAlongTableSpread[] {
  if (!document.spread.rollAlong) return [];
  if (analysis?.rollAlong) {
    return analysis.rollAlong.spreads.map((s) => ({ ...s, worstStatus: s.worstStatus }));
  }
  return rollAlongLayout(document.spread).spreads.map((s) => ({
    index: s.index,
    firstStation: s.firstStation,
    lastStation: s.lastStation,
    firstGeophone: s.firstGeophone,
    lastGeophone: s.lastGeophone,
    shots: s.shots,
    worstStatus: null,
  }));
}

/** The table's header in the reader's units. */
export function rollAlongColumns(units: UnitSystem) {
  const unit = unitLabel("length", units);
  return [
    { header: "Spread", width: 62 },
    { header: "Stations", width: 56 },
    { header: `Geophones from–to (${unit})`, width: 100, align: "right" as const },
    { header: `Shots (label at position, ${unit})`, width: 214 },
    { header: "Verdict", width: 80 },
  ];
}

/** One table row per spread: number, stations, first–last geophone, shots, verdict. */
export function rollAlongTableRows(
  spreads: RollAlongTableSpread[],
  units: UnitSystem,
  shown: number | null = null,
): (string | Cell)[][] {
  return spreads.map((s) => [
    shown === s.index ? { text: `${s.index} (detailed)`, bold: true } : String(s.index),
    `${s.firstStation}–${s.lastStation}`,
    `${reportLength(s.firstGeophone, units)} – ${reportLength(s.lastGeophone, units)}`,
    s.shots.length === 0
      ? "none recorded"
      : s.shots.map((x) => `${x.label} at ${reportLength(x.position, units)}`).join("; "),
    s.worstStatus === null
      ? "–"
      : { text: s.worstStatus, color: VERDICT_COLOURS[s.worstStatus], bold: true },
  ]);
}

/**
 * Draws the roll-along subsection (a short explanation and the table) under the Spread section;
 * draws nothing for a plan without roll-along. `analysis` is the engine's analysis of
 * `document`, or null when there is none.
 */
export function drawRollAlongTable(
  w: ReportWriter,
  document: Plan,
  analysis: PlanAnalysis | null,
  units: UnitSystem,
): void {
  const roll = document.spread.rollAlong;
  if (!roll) return;
  const spreads = rollAlongSpreads(document, analysis);
  const stations = spreads[spreads.length - 1].lastStation;
  const unit = unitLabel("length", units);
  w.subheading("Roll-along", 80);
  w.paragraph(
    `The line is laid out as ${spreads.length} spreads of ${document.spread.channels} geophones, ` +
      `each moved on by ${document.spread.channels - roll.overlap} stations ` +
      (roll.overlap === 0
        ? "(end to end, sharing no station)"
        : `so that neighbours share ${roll.overlap}`) +
      `: ${stations} stations numbered 1–${stations} along the line, from ` +
      `${reportLength(spreads[0].firstGeophone, units)} to ` +
      `${reportLength(spreads[spreads.length - 1].lastGeophone, units)} ${unit}. Shots anchored to ` +
      "the spread are fired on every spread; a fixed shot is recorded by the spread whose centre is " +
      "nearest. Each spread is judged with its own shots; the plan's verdict is the worst of them.",
    { color: ink.soft },
  );
  w.table(rollAlongColumns(units), rollAlongTableRows(spreads, units, analysis?.rollAlong?.shown));
  if (analysis?.rollAlong) {
    w.paragraph(
      `Resolvability and the per-model recommendation below give spread ${analysis.rollAlong.shown} in detail; the Arrivals and Section figures draw the plan's first spread.`,
      { color: ink.soft, size: 8.5 },
    );
  }
}
