/**
 * The interpreted section under the line in the plan report and its CSV export: pure functions
 * of data. `interpretationSummary` runs the same interpretation as the Field check screen and
 * the `interpret` command (workers/field/plan-interpretation.ts) with the choices stored with
 * the picks (method, GRM XY, datum, assignment, station elevations) or, for what was not
 * chosen, its defaults (picks assigned as the best-fitting candidate suggests, plus-minus
 * method, the plan's pick error, elevations from the plan's section surface or flat, datum the
 * lowest station); `drawInterpretation` draws it with the report writer, naming the method and
 * datum and whether they were chosen; `interpretationCsv` writes one row per refractor and
 * geophone.
 * Units: m, m/s, s; the PDF prints lengths and velocities in the reader's units (`ReportUnits`)
 * and times in ms; the CSV stays SI.
 */
import Papa from "papaparse";
import type { InterpretationChoices } from "@/contracts/field";
import {
  interpretPlanPicks,
  LINE_METHODS,
  type LineMethod,
  type ObservedPick,
  type PlanForInterpretation,
} from "../../workers/field/index";
import { ink, reportUnits, type ReportUnits, type ReportWriter } from "./layout";

/** What the report and the CSV show of the interpretation. */
export type ReportInterpretation =
  | {
      ok: true;
      method: LineMethod;
      /** Whether the method, datum and XY were chosen on the Field check (else defaults). */
      methodChosen: boolean;
      datumChosen: boolean;
      suggestedFrom: string | null;
      elevationSource: "csv" | "plan" | "flat";
      datum: number;
      topVelocity: number;
      refractors: {
        layer: number;
        shots: [number, number];
        meanVelocity: number;
        /** GRM: XY used and the two-layer estimate, m; whether the user fixed it. */
        xy: { used: number; expected: number; fixed: boolean } | null;
        rows: {
          position: number;
          depth: number;
          elevation: number;
          sigma: number;
          velocity: number | null;
          phantom: boolean;
        }[];
        notes: string[];
      }[];
      reciprocal: {
        shots: [number, number];
        difference: number;
        tolerance: number;
        agrees: boolean;
      }[];
      misfits: { name: string; layers: { layer: number; rms: number | null }[] }[];
      notes: string[];
    }
  | { ok: false; reason: string };

/**
 * Interprets saved picks with the stored choices (`choices`; null or absent: the defaults).
 * Null when there are no picks.
 */
export function interpretationSummary(
  picks: readonly ObservedPick[],
  plan: PlanForInterpretation,
  choices?: InterpretationChoices | null,
): ReportInterpretation | null {
  if (picks.length === 0) return null;
  try {
    const xy = choices?.method === "grm" ? (choices.xy ?? null) : null;
    const r = interpretPlanPicks(plan, picks, {
      method: choices?.method,
      datum: choices?.datum ?? null,
      xy,
      assignments: choices?.assignments ?? null,
      elevations: choices?.elevations ?? null,
    });
    return {
      ok: true,
      method: r.result.method,
      methodChosen: Boolean(choices),
      datumChosen: choices?.datum !== undefined && choices.datum !== null,
      suggestedFrom: r.suggestedFrom,
      elevationSource: r.elevationSource,
      datum: r.result.datum,
      topVelocity: r.result.topVelocity,
      refractors: r.result.refractors.map((ref) => ({
        layer: ref.layer,
        shots: ref.shots,
        meanVelocity: ref.meanVelocity,
        xy: ref.xy ? { used: ref.xy.used, expected: ref.xy.expected, fixed: xy !== null } : null,
        rows: ref.depth.map((d) => ({
          position: d.position,
          depth: d.depth,
          elevation: d.elevation,
          sigma: d.sigma,
          velocity:
            ref.velocity.find((v) => Math.abs(v.position - d.position) < 0.001)?.value ?? null,
          phantom: d.phantom,
        })),
        notes: ref.notes,
      })),
      reciprocal: r.result.reciprocal.map((c) => ({
        shots: c.shots,
        difference: c.difference,
        tolerance: c.tolerance,
        agrees: c.agrees,
      })),
      misfits: r.misfits,
      notes: r.result.notes,
    };
  } catch (error) {
    return { ok: false, reason: error instanceof Error ? error.message : String(error) };
  }
}

const num = (v: number | null, digits: number) =>
  v === null || !Number.isFinite(v)
    ? "–"
    : (Object.is(Number(v.toFixed(digits)), -0) ? 0 : v).toFixed(digits);

/**
 * Draws the interpreted section: method, per-refractor table, reciprocal checks, misfits;
 * lengths and velocities in `u` (metric by default).
 */
export function drawInterpretation(
  w: Pick<ReportWriter, "subheading" | "paragraph" | "table" | "callout">,
  data: ReportInterpretation | null | undefined,
  u: ReportUnits = reportUnits(),
): void {
  if (!data) return;
  w.subheading("Interpreted section under the line");
  if (!data.ok) {
    w.paragraph(`No interpretation: ${u.text(data.reason)}`, { color: ink.soft });
    return;
  }
  w.paragraph(
    `Method: ${LINE_METHODS[data.method]} (${data.methodChosen ? "as chosen on the Field check" : "the default; no choice was saved on the Field check"}), picks assigned to refractors ${data.suggestedFrom ? `as “${data.suggestedFrom}” (the best-fitting candidate) suggests` : "by the user"}; top-layer velocity ${u.velU(data.topVelocity)}; elevations ${data.elevationSource === "csv" ? "from the station CSV" : data.elevationSource === "plan" ? "from the plan's section surface" : `taken as flat at 0 ${u.length}`}; datum ${u.lenU(data.datum)} (${data.datumChosen ? "chosen" : "the lowest station"}). Depths are below the ground, ± one standard error from the pick error.`,
  );
  for (const ref of data.refractors) {
    const xy = ref.xy
      ? ` XY ${u.lenU(ref.xy.used)} (${ref.xy.fixed ? "fixed on the Field check" : "the optimum of the search"}; two-layer estimate ${u.lenU(ref.xy.expected)}).`
      : "";
    w.paragraph(
      `Top of layer ${ref.layer}, from the shots at ${u.len(ref.shots[0])} and ${u.lenU(ref.shots[1])}: mean velocity ${u.velU(ref.meanVelocity)}.${xy}`,
    );
    w.table(
      [
        { header: `Geophone (${u.length})`, width: 80, align: "right" },
        { header: `Depth (${u.length})`, width: 80, align: "right" },
        { header: `± (${u.length})`, width: 60, align: "right" },
        { header: `Elevation (${u.length})`, width: 90, align: "right" },
        { header: `Velocity (${u.velocity})`, width: 90, align: "right" },
        { header: "", width: 80 },
      ],
      ref.rows.map((r) => [
        u.len(r.position),
        u.len(r.depth),
        u.len(r.sigma),
        u.len(r.elevation),
        u.vel(r.velocity),
        r.phantom ? "phantomed" : "",
      ]),
    );
    for (const note of ref.notes) w.callout(u.text(note), "plain");
  }
  if (data.reciprocal.length) {
    w.table(
      [
        { header: `Reciprocal pair (${u.length})`, width: 140 },
        { header: "Difference (ms)", width: 100, align: "right" },
        { header: "Allowed (ms)", width: 90, align: "right" },
        { header: "", width: 120 },
      ],
      data.reciprocal.map((c) => [
        `${u.len(c.shots[0])} and ${u.len(c.shots[1])}`,
        num(c.difference * 1000, 2),
        num(c.tolerance * 1000, 1),
        c.agrees ? "agree" : { text: "disagree: check picks", bold: true },
      ]),
    );
  }
  if (data.misfits.length && data.refractors.length) {
    w.table(
      [
        { header: "Candidate model", width: 220 },
        ...data.refractors.map((r) => ({
          header: `Layer ${r.layer} RMS depth misfit (${u.length})`,
          width: 130,
          align: "right" as const,
        })),
      ],
      data.misfits.map((m) => [
        m.name,
        ...data.refractors.map((r) =>
          u.len(m.layers.find((l) => l.layer === r.layer)?.rms ?? null),
        ),
      ]),
    );
  }
  for (const note of data.notes) w.callout(u.text(note), "caution");
}

/**
 * One CSV row per refractor and geophone: layer, method, position_m, depth_m, elevation_m,
 * sigma_m, velocity_m_s, phantom, datum_m (RFC 4180, CRLF). Empty (header only) without an
 * interpretation.
 */
export function interpretationCsv(data: ReportInterpretation | null): string {
  const fields = [
    "layer",
    "method",
    "position_m",
    "depth_m",
    "elevation_m",
    "sigma_m",
    "velocity_m_s",
    "phantom",
    "datum_m",
  ];
  const rows: (string | number)[][] = [];
  if (data?.ok) {
    for (const ref of data.refractors) {
      for (const r of ref.rows) {
        rows.push([
          ref.layer,
          data.method,
          Number(r.position.toFixed(3)),
          Number(r.depth.toFixed(3)),
          Number(r.elevation.toFixed(3)),
          Number(r.sigma.toFixed(3)),
          r.velocity === null ? "" : Number(r.velocity.toFixed(1)),
          r.phantom ? "yes" : "no",
          Number(data.datum.toFixed(3)),
        ]);
      }
    }
  }
  return Papa.unparse({ fields, data: rows }, { newline: "\r\n", escapeFormulae: true }) + "\r\n";
}
