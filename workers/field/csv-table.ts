/**
 * Shared reading of small CSV uploads: papaparse splits the text (it runs in a browser worker
 * and in Node), and this module keeps each record's line number in the file, normalises header
 * names and parses numbers, so that every problem can name its line and column.
 */
import Papa from "papaparse";

/** One problem with an uploaded CSV, already phrased for the user. */
export interface CsvIssue {
  /** Line in the file, from 1 (the header is line 1 unless comment lines precede it). */
  line: number;
  /** Column name as written in the header, when the problem sits in one cell. */
  column?: string;
  /** Full message, e.g. "line 7, column time_ms: 'abc' is not a number". */
  message: string;
}

/** A CSV split into a header and data records, each with its line number. */
export interface CsvTable {
  /** Header cells as written (trimmed). */
  header: string[];
  /** Line of the header. */
  headerLine: number;
  rows: { line: number; cells: string[] }[];
  /** Delimiter found: "," ";" "\t" or "|". */
  delimiter: string;
}

/** Builds a `CsvIssue` with the standard message form. */
export function csvIssue(line: number, column: string | undefined, text: string): CsvIssue {
  return {
    line,
    ...(column === undefined ? {} : { column }),
    message:
      column === undefined ? `line ${line}: ${text}` : `line ${line}, column ${column}: ${text}`,
  };
}

/** Most problems reported for one file; the rest are counted in a final message. */
export const MAX_ISSUES = 50;

/** Truncates a list of issues to `MAX_ISSUES`, adding a line that counts the rest. */
export function capIssues(issues: CsvIssue[]): CsvIssue[] {
  if (issues.length <= MAX_ISSUES) return issues;
  const last = issues[MAX_ISSUES - 1];
  return [
    ...issues.slice(0, MAX_ISSUES),
    { line: last.line, message: `… and ${issues.length - MAX_ISSUES} more problems` },
  ];
}

/**
 * Header name in a comparable form: lower case, units in brackets joined with "_", runs of
 * blanks, dashes, dots and slashes as one "_". "Time (ms)" → "time_ms", "Velocity [m/s]" →
 * "velocity_m_s", "Shot position" → "shot_position".
 */
export function normalizeHeader(name: string): string {
  return name
    .replace(/^\uFEFF/, "")
    .trim()
    .toLowerCase()
    .replace(/[([{]/g, "_")
    .replace(/[)\]}]/g, "")
    .replace(/[\s\-./\\]+/g, "_")
    .replace(/_+/g, "_")
    .replace(/^_|_$/g, "");
}

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/**
 * Parses a decimal number. A decimal comma is accepted when the file is not comma-delimited
 * (e.g. "12,5" in a semicolon-delimited file). Returns null for anything else.
 */
export function parseCsvNumber(cell: string, delimiter: string): number | null {
  let t = cell.trim();
  if (delimiter !== "," && /^[+-]?\d*,\d+$/.test(t)) t = t.replace(",", ".");
  if (!NUMBER.test(t)) return null;
  const v = Number(t);
  return Number.isFinite(v) ? v : null;
}

/**
 * Splits CSV text. Blank lines and lines whose first cell starts with "#" are skipped; the
 * first remaining record is the header. Returns issues for an empty file or broken quoting.
 */
export function readCsvTable(text: string): CsvTable | CsvIssue[] {
  const clean = text.replace(/^\uFEFF/, "").replace(/\r\n?/g, "\n");
  const lineStarts: number[] = [0];
  for (let i = 0; i < clean.length; i++) if (clean[i] === "\n") lineStarts.push(i + 1);
  const lineOf = (offset: number) => {
    let lo = 0;
    let hi = lineStarts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (lineStarts[mid] <= offset) lo = mid;
      else hi = mid - 1;
    }
    return lo + 1;
  };

  const records: { line: number; cells: string[] }[] = [];
  const issues: CsvIssue[] = [];
  let start = 0;
  let delimiter = ",";
  Papa.parse<string[]>(clean, {
    delimitersToGuess: [",", ";", "\t", "|"],
    step: (result) => {
      const line = lineOf(start);
      start = result.meta.cursor;
      delimiter = result.meta.delimiter || delimiter;
      for (const e of result.errors) {
        if (e.type === "Delimiter") continue;
        issues.push(csvIssue(line, undefined, `the CSV is malformed (${e.message.toLowerCase()})`));
      }
      const cells = result.data.map((c) => c.trim());
      if (cells.every((c) => c === "")) return;
      if (cells[0].startsWith("#")) return;
      records.push({ line, cells });
    },
  });
  if (issues.length > 0) return capIssues(issues);
  if (records.length === 0) return [csvIssue(1, undefined, "the file holds no header and no data")];
  const [head, ...rows] = records;
  return { header: head.cells, headerLine: head.line, rows, delimiter };
}

/**
 * Finds the column whose normalised header is one of `names`; returns its index or -1.
 * The first match in header order wins.
 */
export function findColumn(header: string[], names: readonly string[]): number {
  return header.findIndex((h) => names.includes(normalizeHeader(h)));
}

/** Each name bare and with a `_m` (metres) suffix. */
export function withMetreSuffix(names: readonly string[]): string[] {
  return names.flatMap((n) => [n, `${n}_m`]);
}

/**
 * Reads the number in one cell of a record. An empty cell is an issue when `required` (null
 * returned) and `undefined` otherwise; a cell that is not a number is an issue (null returned).
 */
export function numberCell(
  record: { line: number; cells: string[] },
  table: Pick<CsvTable, "header" | "delimiter">,
  column: number,
  issues: CsvIssue[],
  required = true,
): number | null | undefined {
  const name = table.header[column];
  const cell = record.cells[column] ?? "";
  if (cell === "") {
    if (!required) return undefined;
    issues.push(csvIssue(record.line, name, "value is missing"));
    return null;
  }
  const v = parseCsvNumber(cell, table.delimiter);
  if (v === null) issues.push(csvIssue(record.line, name, `'${cell}' is not a number`));
  return v;
}
