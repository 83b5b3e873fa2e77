/**
 * First-break picks uploaded as CSV: one pick per line with the shot position (m), the
 * geophone position (m) and the first-break time. The time unit comes from the header
 * (`time_ms` or `time_s`), or from the caller for a bare `time` column (chosen on upload).
 *
 * Header names are matched after normalisation (see `normalizeHeader`), so case, blanks and
 * bracketed units do not matter. Accepted names:
 * - shot position: shot, shot_position, shot_pos, shot_x, shotpoint, shot_point, sp, source,
 *   source_position, source_pos, source_x, source_location — each also with a `_m` suffix;
 * - geophone position: geophone, geophone_position, geophone_pos, geophone_x, receiver,
 *   receiver_position, receiver_pos, receiver_x, receiver_location, station, station_position
 *   — each also with a `_m` suffix;
 * - time: time, t, pick, first_break, fb, arrival, arrival_time, travel_time, traveltime, each
 *   bare or with a `_ms` or `_s` suffix (e.g. "Time (ms)", "time_s", "first break [ms]").
 * A unit in the header wins over the unit chosen on upload.
 */
import {
  capIssues,
  csvIssue,
  findColumn,
  normalizeHeader,
  numberCell,
  readCsvTable,
  withMetreSuffix,
  type CsvIssue,
} from "./csv-table";

/** One first-break pick read from a CSV line. */
export interface PickRow {
  /** Line in the file. */
  line: number;
  /** Shot position along the line, m. */
  shotPosition: number;
  /** Geophone position along the line, m. */
  geophonePosition: number;
  /** First-break time, s. */
  time: number;
}

/** Result of reading a picks CSV: all rows, or every problem found (never both). */
export type PicksCsvResult =
  { ok: true; rows: PickRow[]; timeUnit: "ms" | "s" } | { ok: false; errors: CsvIssue[] };

const SHOT_NAMES = withMetreSuffix([
  "shot",
  "shot_position",
  "shot_pos",
  "shot_x",
  "shotpoint",
  "shot_point",
  "sp",
  "source",
  "source_position",
  "source_pos",
  "source_x",
  "source_location",
]);
const GEOPHONE_NAMES = withMetreSuffix([
  "geophone",
  "geophone_position",
  "geophone_pos",
  "geophone_x",
  "receiver",
  "receiver_position",
  "receiver_pos",
  "receiver_x",
  "receiver_location",
  "station",
  "station_position",
]);
const TIME_BASES = [
  "time",
  "t",
  "pick",
  "first_break",
  "fb",
  "arrival",
  "arrival_time",
  "travel_time",
  "traveltime",
];

function timeColumn(header: string[]): { index: number; unit: "ms" | "s" | null } {
  for (let i = 0; i < header.length; i++) {
    const h = normalizeHeader(header[i]);
    for (const base of TIME_BASES) {
      if (h === base) return { index: i, unit: null };
      if (h === `${base}_ms`) return { index: i, unit: "ms" };
      if (h === `${base}_s` || h === `${base}_sec`) return { index: i, unit: "s" };
    }
  }
  return { index: -1, unit: null };
}

/** Largest first-break time accepted, s: far beyond any shallow refraction record. */
const MAX_TIME = 10;

/**
 * Reads a first-break picks CSV.
 * @param text the file's text
 * @param options.timeUnit unit of a bare `time` column, as chosen on upload
 */
export function parsePicksCsv(
  text: string,
  options: { timeUnit?: "ms" | "s" } = {},
): PicksCsvResult {
  const table = readCsvTable(text);
  if (Array.isArray(table)) return { ok: false, errors: table };
  const { header, headerLine } = table;
  const errors: CsvIssue[] = [];

  const shotAt = findColumn(header, SHOT_NAMES);
  const geophoneAt = findColumn(header, GEOPHONE_NAMES);
  const time = timeColumn(header);
  if (shotAt < 0)
    errors.push(csvIssue(headerLine, undefined, "no shot position column (e.g. shot_m)"));
  if (geophoneAt < 0) {
    errors.push(csvIssue(headerLine, undefined, "no geophone position column (e.g. geophone_m)"));
  }
  if (time.index < 0) {
    errors.push(
      csvIssue(
        headerLine,
        undefined,
        "no time column (time_ms, time_s, or time with a unit chosen on upload)",
      ),
    );
  }
  const unit = time.unit ?? options.timeUnit ?? null;
  if (time.index >= 0 && unit === null) {
    errors.push(
      csvIssue(
        headerLine,
        header[time.index],
        "the time unit is not stated: name the column time_ms or time_s, or choose ms or s on upload",
      ),
    );
  }
  if (errors.length > 0 || unit === null) return { ok: false, errors };
  if (table.rows.length === 0) {
    return {
      ok: false,
      errors: [csvIssue(headerLine, undefined, "the file holds a header but no picks")],
    };
  }

  const divisor = unit === "ms" ? 1000 : 1;
  const rows: PickRow[] = [];
  const seen = new Map<string, number>();
  for (const record of table.rows) {
    const { line } = record;
    const read = (column: number) => numberCell(record, table, column, errors) ?? null;
    const shot = read(shotAt);
    const geophone = read(geophoneAt);
    const raw = read(time.index);
    if (shot === null || geophone === null || raw === null) continue;
    const t = raw / divisor;
    const timeColumnName = header[time.index];
    if (t < 0) {
      errors.push(
        csvIssue(
          line,
          timeColumnName,
          `${raw} is negative; first-break times are counted from the shot`,
        ),
      );
      continue;
    }
    if (t > MAX_TIME) {
      errors.push(
        csvIssue(
          line,
          timeColumnName,
          `${raw} ${unit} is beyond ${MAX_TIME} s; is the unit right?`,
        ),
      );
      continue;
    }
    const key = `${shot}|${geophone}`;
    const first = seen.get(key);
    if (first !== undefined) {
      errors.push(
        csvIssue(
          line,
          undefined,
          `a second pick for shot ${shot} m and geophone ${geophone} m (the first is on line ${first})`,
        ),
      );
      continue;
    }
    seen.set(key, line);
    rows.push({ line, shotPosition: shot, geophonePosition: geophone, time: t });
  }
  if (errors.length > 0) return { ok: false, errors: capIssues(errors) };
  return { ok: true, rows, timeUnit: unit };
}
