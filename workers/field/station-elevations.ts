/**
 * Station elevations along the line: from a CSV of (position, elevation) or from the surface of
 * a plan's section model, as a profile that interpolates linearly between stations and holds
 * the end values beyond them. Elevations in m (up), positions in m.
 */
import {
  capIssues,
  csvIssue,
  findColumn,
  numberCell,
  readCsvTable,
  withMetreSuffix,
  type CsvIssue,
} from "./csv-table";

/** One surveyed station. */
export interface ElevationPoint {
  /** Position along the line, m. */
  position: number;
  /** Ground elevation, m. */
  elevation: number;
}

/** Elevation of the ground at a position, m. */
export type ElevationProfile = (position: number) => number;

/** Result of reading an elevation CSV: all points, or every problem found. */
export type ElevationCsvResult =
  { ok: true; points: ElevationPoint[] } | { ok: false; errors: CsvIssue[] };

const POSITION_NAMES = withMetreSuffix(["position", "station", "x", "distance", "chainage"]);
const ELEVATION_NAMES = withMetreSuffix(["elevation", "elev", "z", "height", "altitude"]);

/**
 * Reads station elevations from CSV text with a header holding a position column (position,
 * station, x, distance or chainage, optionally with `_m`) and an elevation column (elevation,
 * elev, z, height or altitude, optionally with `_m`). Positions must be distinct.
 */
export function parseElevationCsv(text: string): ElevationCsvResult {
  const table = readCsvTable(text);
  if (Array.isArray(table)) return { ok: false, errors: table };
  const errors: CsvIssue[] = [];
  const pos = findColumn(table.header, POSITION_NAMES);
  const elev = findColumn(table.header, ELEVATION_NAMES);
  if (pos < 0)
    errors.push(csvIssue(table.headerLine, undefined, "no position column (e.g. position_m)"));
  if (elev < 0) {
    errors.push(csvIssue(table.headerLine, undefined, "no elevation column (e.g. elevation_m)"));
  }
  if (errors.length) return { ok: false, errors };
  const points: ElevationPoint[] = [];
  for (const row of table.rows) {
    const p = numberCell(row, table, pos, errors) ?? null;
    const e = numberCell(row, table, elev, errors) ?? null;
    if (p === null || e === null) continue;
    if (points.some((q) => Math.abs(q.position - p) < 0.001)) {
      errors.push(csvIssue(row.line, table.header[pos], `position ${p} m appears twice`));
      continue;
    }
    points.push({ position: p, elevation: e });
  }
  if (errors.length) return { ok: false, errors: capIssues(errors) };
  if (points.length === 0) {
    return {
      ok: false,
      errors: [csvIssue(table.headerLine, undefined, "the file holds a header but no stations")],
    };
  }
  return { ok: true, points: points.sort((a, b) => a.position - b.position) };
}

/** A profile through the points (linear between them, constant beyond the ends). */
export function elevationProfile(points: readonly ElevationPoint[]): ElevationProfile {
  const sorted = [...points].sort((a, b) => a.position - b.position);
  if (sorted.length === 0) return () => 0;
  return (x) => {
    if (x <= sorted[0].position) return sorted[0].elevation;
    const last = sorted[sorted.length - 1];
    if (x >= last.position) return last.elevation;
    let i = 1;
    while (sorted[i].position < x) i++;
    const a = sorted[i - 1];
    const b = sorted[i];
    return (
      a.elevation + ((b.elevation - a.elevation) * (x - a.position)) / (b.position - a.position)
    );
  };
}

/**
 * The ground surface of a plan's first section model (`kind: "section"`, `surface` as
 * `[position, elevation]` pairs), or null when the plan holds none. The hook through which
 * interpretations take their elevations from the plan.
 */
export function surfaceFromModels(models: readonly unknown[]): ElevationPoint[] | null {
  for (const m of models) {
    if (!m || typeof m !== "object") continue;
    const model = m as { kind?: unknown; surface?: unknown };
    if (model.kind !== "section" || !Array.isArray(model.surface)) continue;
    const points: ElevationPoint[] = [];
    for (const p of model.surface) {
      if (Array.isArray(p) && Number.isFinite(p[0]) && Number.isFinite(p[1])) {
        points.push({ position: p[0] as number, elevation: p[1] as number });
      }
    }
    if (points.length >= 2) return points;
  }
  return null;
}
