/**
 * Borehole or probe logs uploaded as CSV: depth_from, depth_to (m), material and an optional
 * velocity (m/s). The intervals must run from the ground surface without gaps or overlaps;
 * they become a candidate ground model in the plan schema's form (workers/engine/plan-schema.ts),
 * the deepest interval taken as the half-space. Missing velocities come from a material table:
 * the engine's `MATERIALS` unless the caller passes another (see material-lookup.ts).
 *
 * Header names are matched after normalisation (see `normalizeHeader`). Accepted names:
 * - top: depth_from, from, top, depth_top, top_depth, from_depth — each also with `_m`;
 * - base: depth_to, to, bottom, base, depth_bottom, depth_base, bottom_depth, to_depth — also `_m`;
 * - material: material, soil, lithology, description, layer, stratum;
 * - velocity (optional): velocity, vp, v, p_velocity, p_wave_velocity, bare or with `_m_s` or
 *   `_ms` (m/s), or with `_km_s` (km/s, converted).
 */
import { groundModelSchema, MATERIALS, MAX_LAYERS, type GroundModel, type Layer } from "@engine";
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
import { materialLookup, materialName, type MaterialTable } from "./material-lookup";

/** One interval of the log as read. */
export interface LogRow {
  line: number;
  /** Top of the interval, m below ground. */
  depthFrom: number;
  /** Base of the interval, m below ground. */
  depthTo: number;
  /** Material as written. */
  material: string;
  /** Velocity used, m/s: from the file, or from the material table. */
  velocity: number;
  /** Where the velocity came from. */
  velocitySource: "file" | "table";
  /** Table key of the material, when it was found in the table. */
  materialKey?: string;
}

/** Result of reading a log: the rows and the ground model, or every problem (never both). */
export type BoreholeCsvResult =
  { ok: true; rows: LogRow[]; model: GroundModel } | { ok: false; errors: CsvIssue[] };

const FROM_NAMES = withMetreSuffix([
  "depth_from",
  "from",
  "top",
  "depth_top",
  "top_depth",
  "from_depth",
]);
const TO_NAMES = withMetreSuffix([
  "depth_to",
  "to",
  "bottom",
  "base",
  "depth_bottom",
  "depth_base",
  "bottom_depth",
  "to_depth",
]);
const MATERIAL_NAMES = ["material", "soil", "lithology", "description", "layer", "stratum"];
const VELOCITY_BASES = ["velocity", "vp", "v", "p_velocity", "p_wave_velocity"];

function velocityColumn(header: string[]): { index: number; scale: number } {
  for (let i = 0; i < header.length; i++) {
    const h = normalizeHeader(header[i]);
    for (const base of VELOCITY_BASES) {
      if (h === base || h === `${base}_m_s` || h === `${base}_ms`) return { index: i, scale: 1 };
      if (h === `${base}_km_s`) return { index: i, scale: 1000 };
    }
  }
  return { index: -1, scale: 1 };
}

/** File-name words that say "this is a log" (and BH, BH3, …). */
const LOG_WORDS = new Set(["borehole", "boreholes", "bore", "hole", "log", "logs", "probe"]);
/** File-name words that name nothing. */
const FILLER_WORDS = new Set(["data", "export", "csv", "file", "new", "copy"]);
const saysLog = (word: string) => LOG_WORDS.has(word) || /^bh\d*$/.test(word);

/**
 * A ground model's name for a borehole log uploaded as `fileName`: "Harwick lane 3.csv" →
 * "Borehole log Harwick lane 3"; a name that already says it is a log ("BH-3 Harwick
 * lane.csv", "borehole_7.csv") is kept as written ("BH-3 Harwick lane", "borehole 7"); a name
 * with nothing but such words ("borehole.csv", "log data.csv") gives "Borehole log" — never
 * "Borehole log borehole". At most 80 characters.
 */
export function boreholeModelName(fileName: string): string {
  const stem = fileName
    .replace(/^.*[\\/]/, "")
    .replace(/\.[^.]*$/, "")
    .replace(/_+/g, " ")
    .replace(/\s+/g, " ")
    .trim();
  const words = stem
    .toLowerCase()
    .split(/[^a-z0-9]+/)
    .filter(Boolean);
  if (words.every((w) => saysLog(w) || FILLER_WORDS.has(w))) return "Borehole log";
  return (words.some(saysLog) ? stem : `Borehole log ${stem}`).slice(0, 80);
}

/** Depth difference below which two interval ends count as the same depth, m. */
const DEPTH_TOLERANCE = 0.005;
const MAX_VELOCITY = 10000;

/**
 * Reads a borehole or probe log and builds a ground model from it.
 * @param text the file's text
 * @param materialTable velocities by material, used where the log gives none (default: the
 *   engine's `MATERIALS`, typical velocity = middle of the range)
 * @param options.name model name (default "Borehole log")
 * @param options.mergeEqualNeighbours join adjacent intervals of the same material and
 *   velocity into one layer (default true)
 */
export function parseBoreholeCsv(
  text: string,
  materialTable: MaterialTable = MATERIALS,
  options: { name?: string; mergeEqualNeighbours?: boolean } = {},
): BoreholeCsvResult {
  const table = readCsvTable(text);
  if (Array.isArray(table)) return { ok: false, errors: table };
  const { header, headerLine } = table;
  const errors: CsvIssue[] = [];
  const fromAt = findColumn(header, FROM_NAMES);
  const toAt = findColumn(header, TO_NAMES);
  const materialAt = findColumn(header, MATERIAL_NAMES);
  const velocity = velocityColumn(header);
  if (fromAt < 0) errors.push(csvIssue(headerLine, undefined, "no depth_from column"));
  if (toAt < 0) errors.push(csvIssue(headerLine, undefined, "no depth_to column"));
  if (materialAt < 0) errors.push(csvIssue(headerLine, undefined, "no material column"));
  if (errors.length > 0) return { ok: false, errors };
  if (table.rows.length === 0) {
    return {
      ok: false,
      errors: [csvIssue(headerLine, undefined, "the file holds a header but no intervals")],
    };
  }

  const lookup = materialLookup(materialTable);
  const rows: LogRow[] = [];
  let previous: { line: number; depthTo: number } | null = null;
  for (const [index, record] of table.rows.entries()) {
    const { line, cells } = record;
    const number = (column: number, required: boolean) =>
      numberCell(record, table, column, errors, required);
    const from = number(fromAt, true);
    const to = number(toAt, true);
    const rawVelocity = velocity.index >= 0 ? number(velocity.index, false) : undefined;
    const material = cells[materialAt] ?? "";
    if (
      from === null ||
      from === undefined ||
      to === null ||
      to === undefined ||
      rawVelocity === null
    ) {
      previous = null;
      continue;
    }
    let ok = true;
    if (from < 0) {
      errors.push(csvIssue(line, header[fromAt], `${from} m is above the ground surface`));
      ok = false;
    }
    if (to <= from) {
      errors.push(csvIssue(line, header[toAt], `${to} m is not below depth_from ${from} m`));
      ok = false;
    }
    if (index === 0 && from > DEPTH_TOLERANCE) {
      errors.push(
        csvIssue(
          line,
          header[fromAt],
          `the log starts at ${from} m; it must start at the ground surface (0 m)`,
        ),
      );
      ok = false;
    }
    if (previous !== null) {
      const gap = from - previous.depthTo;
      if (gap > DEPTH_TOLERANCE) {
        errors.push(
          csvIssue(
            line,
            undefined,
            `gap from ${previous.depthTo} m to ${from} m after the interval on line ${previous.line}`,
          ),
        );
        ok = false;
      } else if (gap < -DEPTH_TOLERANCE) {
        errors.push(
          csvIssue(
            line,
            undefined,
            `overlaps the interval on line ${previous.line} (starts at ${from} m, above its base at ${previous.depthTo} m)`,
          ),
        );
        ok = false;
      }
    }
    previous = { line, depthTo: to };

    let v: number | undefined;
    let source: "file" | "table" = "file";
    let key: string | undefined;
    const match = material ? lookup(material) : null;
    if (match) key = match.key;
    if (rawVelocity !== undefined) {
      v = rawVelocity * velocity.scale;
      if (!(v > 0) || v > MAX_VELOCITY) {
        errors.push(
          csvIssue(line, header[velocity.index], `${rawVelocity} is outside 0–${MAX_VELOCITY} m/s`),
        );
        ok = false;
      }
    } else if (!material) {
      errors.push(
        csvIssue(line, header[materialAt], "material is missing and no velocity is given"),
      );
      ok = false;
    } else if (!match) {
      errors.push(
        csvIssue(
          line,
          header[materialAt],
          `'${material}' is not in the material table and no velocity is given`,
        ),
      );
      ok = false;
    } else {
      v = match.velocity;
      source = "table";
    }
    if (ok && v !== undefined) {
      rows.push({
        line,
        depthFrom: from,
        depthTo: to,
        material,
        velocity: v,
        velocitySource: source,
        ...(key ? { materialKey: key } : {}),
      });
    }
  }
  if (errors.length > 0) return { ok: false, errors: capIssues(errors) };

  // Adjacent intervals of the same material and velocity are one layer.
  const groups: { rows: LogRow[] }[] = [];
  for (const row of rows) {
    const last = groups[groups.length - 1];
    const head = last?.rows[0];
    if (
      options.mergeEqualNeighbours !== false &&
      head &&
      materialName(head.material) === materialName(row.material) &&
      head.velocity === row.velocity
    ) {
      last.rows.push(row);
    } else {
      groups.push({ rows: [row] });
    }
  }
  if (groups.length > MAX_LAYERS) {
    return {
      ok: false,
      errors: [
        csvIssue(
          groups[MAX_LAYERS].rows[0].line,
          undefined,
          `the log makes ${groups.length} layers; a ground model holds at most ${MAX_LAYERS}`,
        ),
      ],
    };
  }
  const layers: Layer[] = groups.map((g, i) => {
    const first = g.rows[0];
    const last = g.rows[g.rows.length - 1];
    const layer: Layer = {
      name: first.material || `layer ${i + 1}`,
      velocity: first.velocity,
      ...(first.materialKey ? { material: first.materialKey } : {}),
    };
    if (i < groups.length - 1)
      layer.thickness = Number((last.depthTo - first.depthFrom).toFixed(6));
    return layer;
  });
  const model = { name: options.name ?? "Borehole log", layers };
  const checked = groundModelSchema.safeParse(model);
  if (!checked.success) {
    return {
      ok: false,
      errors: checked.error.issues.map((issue) => {
        const layerIndex = typeof issue.path[1] === "number" ? issue.path[1] : 0;
        const line = groups[layerIndex]?.rows[0].line ?? headerLine;
        return csvIssue(line, undefined, issue.message);
      }),
    };
  }
  return { ok: true, rows, model: checked.data };
}
