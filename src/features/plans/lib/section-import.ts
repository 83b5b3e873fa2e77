/**
 * Importing a section's geometry from survey files, as pure functions (no DOM):
 *
 * - the ground surface from a levelling or GNSS CSV, either `position,elevation` (already
 *   along the line) or `easting,northing,elevation` projected onto the survey line, which is
 *   given by two points (the file's first and last points unless the user gives two);
 * - the layer bases from several boreholes along the line (`borehole,position,depth1,…`,
 *   depth of the base of each layer below the ground), interpolated linearly between the
 *   boreholes and kept level beyond the outermost ones.
 *
 * Every length is in the unit the caller says the file uses (`scale` = metres per file
 * unit); results are SI (m). Bad input throws an ImportProblem naming the line.
 */
import Papa from "papaparse";

/** A problem with an imported file, naming the line (1-based, as a text editor counts). */
export class ImportProblem extends Error {
  constructor(message: string) {
    super(message);
    this.name = "ImportProblem";
  }
}

type Row = { line: number; cells: string[] };

/** Rows of a CSV; the first is a header when a cell of `numericColumns` is not a number. */
function rowsOf(text: string, numericColumns?: number[]): { header: string[] | null; rows: Row[] } {
  const parsed = Papa.parse<string[]>(text.trim(), { skipEmptyLines: "greedy" });
  const all: Row[] = parsed.data.map((cells, i) => ({
    line: i + 1,
    cells: cells.map((c) => c.trim()),
  }));
  // papaparse counts data rows only when lines are skipped; recount from the raw text
  const lines = text.trim().split(/\r\n|\n|\r/);
  let cursor = 0;
  for (const row of all) {
    while (cursor < lines.length && lines[cursor].trim() === "") cursor++;
    row.line = cursor + 1;
    cursor++;
  }
  if (all.length === 0) throw new ImportProblem("the file is empty");
  const first = all[0].cells;
  const checked = numericColumns ? first.filter((_, i) => numericColumns.includes(i)) : first;
  const header = checked.some((c) => c !== "" && !Number.isFinite(Number(c)))
    ? first.map((c) => c.toLowerCase())
    : null;
  return { header, rows: header ? all.slice(1) : all };
}

function numberAt(row: Row, index: number, label: string): number {
  const text = row.cells[index];
  if (text === undefined || text === "")
    throw new ImportProblem(`line ${row.line}: ${label} is missing`);
  const value = Number(text);
  if (!Number.isFinite(value))
    throw new ImportProblem(`line ${row.line}: ${label} "${text}" is not a number`);
  return value;
}

function column(header: string[] | null, names: RegExp, fallback: number): number {
  if (!header) return fallback;
  const i = header.findIndex((h) => names.test(h));
  return i >= 0 ? i : -1;
}

const POSITION = /^(position|distance|chainage|station|pos|x along|along)\b/;
const ELEVATION = /^(elevation|elev|height|z|rl|level|altitude)\b/;
const EASTING = /^(easting|east|e|x)$/;
const NORTHING = /^(northing|north|n|y)$/;

/** A survey point in map coordinates (easting, northing), m. */
export interface MapPoint {
  easting: number;
  northing: number;
}

/**
 * Where a map point falls on the line from `a` to `b`: `position` along the line measured
 * from `a` (plus `start`), and `offset`, its signed distance to the left of the line (m).
 * The orthogonal projection onto the line through a and b.
 */
export function projectOntoLine(
  p: MapPoint,
  a: MapPoint,
  b: MapPoint,
  start = 0,
): { position: number; offset: number } {
  const dx = b.easting - a.easting;
  const dy = b.northing - a.northing;
  const length = Math.hypot(dx, dy);
  if (!(length > 0)) throw new ImportProblem("the two points defining the line are the same");
  const ux = dx / length;
  const uy = dy / length;
  const px = p.easting - a.easting;
  const py = p.northing - a.northing;
  return { position: start + px * ux + py * uy, offset: ux * py - uy * px };
}

/** An imported surface: polyline points (m), how the file was read, and what to tell the user. */
export interface ImportedSurface {
  points: [number, number][];
  /** "along" for position,elevation files; "projected" for easting,northing,elevation. */
  mode: "along" | "projected";
  /** Which line the points were projected onto (projected files). */
  line: "first-last" | "given" | null;
  /** Largest distance of a point from the line, m (projected files; 0 otherwise). */
  largestOffset: number;
}

export interface SurfaceImportOptions {
  /** Metres per file unit (1 for metres, 0.3048 for feet). */
  scale?: number;
  /** The line's two points for projected files; default: the file's first and last points. */
  line?: { a: MapPoint; b: MapPoint } | null;
  /** Position of the line's first point, m (default 0). */
  start?: number;
}

/**
 * Read a levelling or GNSS CSV into a surface polyline. Two numeric columns (or a header
 * naming position and elevation) are read as position,elevation; three (or a header naming
 * easting, northing and elevation) as map points, projected onto the line. Points are sorted
 * by position; two points at the same position are refused (naming both lines).
 */
export function parseSurfaceCsv(text: string, options: SurfaceImportOptions = {}): ImportedSurface {
  const scale = options.scale ?? 1;
  const { header, rows } = rowsOf(text);
  if (rows.length < 2) throw new ImportProblem("the file needs at least two points");
  const width = header ? header.length : rows[0].cells.length;
  const projected = header
    ? column(header, EASTING, -1) >= 0 && column(header, NORTHING, -1) >= 0
    : width >= 3;
  const found: Array<{ position: number; elevation: number; line: number; offset: number }> = [];
  let lineKind: ImportedSurface["line"] = null;
  if (!projected) {
    const pi = column(header, POSITION, 0);
    const ei = column(header, ELEVATION, 1);
    if (pi < 0) throw new ImportProblem("no position column (name it position or chainage)");
    if (ei < 0) throw new ImportProblem("no elevation column (name it elevation)");
    for (const row of rows)
      found.push({
        position: numberAt(row, pi, "position") * scale,
        elevation: numberAt(row, ei, "elevation") * scale,
        line: row.line,
        offset: 0,
      });
  } else {
    const xi = column(header, EASTING, 0);
    const yi = column(header, NORTHING, 1);
    const zi = column(header, ELEVATION, 2);
    if (zi < 0) throw new ImportProblem("no elevation column (name it elevation)");
    const map = rows.map((row) => ({
      easting: numberAt(row, xi, "easting") * scale,
      northing: numberAt(row, yi, "northing") * scale,
      elevation: numberAt(row, zi, "elevation") * scale,
      line: row.line,
    }));
    const a = options.line?.a ?? map[0];
    const b = options.line?.b ?? map[map.length - 1];
    lineKind = options.line ? "given" : "first-last";
    for (const p of map) {
      const { position, offset } = projectOntoLine(p, a, b, options.start ?? 0);
      found.push({ position, elevation: p.elevation, line: p.line, offset });
    }
  }
  found.sort((p, q) => p.position - q.position);
  for (let i = 1; i < found.length; i++) {
    if (Math.abs(found[i].position - found[i - 1].position) < 1e-6)
      throw new ImportProblem(
        `lines ${Math.min(found[i - 1].line, found[i].line)} and ${Math.max(found[i - 1].line, found[i].line)} fall at the same position along the line`,
      );
  }
  return {
    points: found.map((p) => [round(p.position), round(p.elevation)]),
    mode: projected ? "projected" : "along",
    line: lineKind,
    largestOffset: Math.max(0, ...found.map((p) => Math.abs(p.offset))),
  };
}

const round = (v: number) => Math.round(v * 1000) / 1000;

/** One borehole: where it stands and the depth of each layer's base below the ground (m). */
export interface Borehole {
  name: string;
  position: number;
  /** Depth of the base of layer 1, 2, … below the ground, m; null where the log does not reach or the layer is absent. */
  depths: Array<number | null>;
}

/**
 * Read a borehole CSV: `borehole,position,depth1,depth2,…` (a header row is optional), one
 * row per borehole, depths of the bases of layers 1, 2, … below the ground. An empty depth
 * means the layer is absent there (it pinches out onto the one above).
 */
export function parseBoreholeCsv(text: string, scale = 1): Borehole[] {
  const { rows } = rowsOf(text, [1]);
  if (rows.length === 0) throw new ImportProblem("the file has no boreholes");
  const boreholes = rows.map((row) => {
    const name = row.cells[0] || `borehole on line ${row.line}`;
    const position = numberAt(row, 1, "position") * scale;
    const depths: Array<number | null> = [];
    for (let k = 2; k < row.cells.length; k++) {
      if (row.cells[k] === "") {
        depths.push(null);
        continue;
      }
      const d = numberAt(row, k, `depth ${k - 1}`) * scale;
      if (d < 0) throw new ImportProblem(`line ${row.line}: depth ${k - 1} must not be negative`);
      const previous = depths.filter((x): x is number => x !== null).at(-1) ?? 0;
      if (d < previous)
        throw new ImportProblem(
          `line ${row.line}: depth ${k - 1} (${d} m) is above the base of the layer over it`,
        );
      depths.push(d);
    }
    if (depths.every((d) => d === null))
      throw new ImportProblem(`line ${row.line}: no depths given`);
    return { name, position, depths };
  });
  boreholes.sort((a, b) => a.position - b.position);
  for (let i = 1; i < boreholes.length; i++)
    if (boreholes[i].position === boreholes[i - 1].position)
      throw new ImportProblem(
        `boreholes ${boreholes[i - 1].name} and ${boreholes[i].name} stand at the same position`,
      );
  return boreholes;
}

/**
 * Layer bases (elevation polylines, m) from boreholes: at each borehole the base of layer k
 * lies `depths[k]` below the surface there (`surfaceAt`), an absent layer takes the base above
 * it; between boreholes the bases are straight, beyond the outermost they stay level, and
 * each base is drawn over [from, to]. Returns one polyline per layer that any borehole logs.
 */
export function basesFromBoreholes(
  boreholes: Borehole[],
  surfaceAt: (position: number) => number,
  from: number,
  to: number,
): [number, number][][] {
  if (boreholes.length === 0) return [];
  const count = Math.max(...boreholes.map((b) => b.depths.length));
  const bases: [number, number][][] = [];
  for (let k = 0; k < count; k++) {
    const at = boreholes.map((b) => {
      const ground = surfaceAt(b.position);
      let depth = 0;
      for (let j = 0; j <= k; j++) depth = b.depths[j] ?? depth;
      return [b.position, round(ground - depth)] as [number, number];
    });
    const line: [number, number][] = [];
    if (from < at[0][0]) line.push([from, at[0][1]]);
    line.push(...at);
    if (to > at[at.length - 1][0]) line.push([to, at[at.length - 1][1]]);
    bases.push(line);
  }
  return bases;
}
