/**
 * Command line: interpret a plan's field picks under the line and print the result as JSON.
 *
 *   npm run --silent interpret -- PLAN.json PICKS.csv [--method plus-minus|delay-time|grm]
 *                                 [--elevations STATIONS.csv] [--datum METRES] [--xy METRES]
 *
 * PICKS.csv is the picks file the upload takes (shot_m, geophone_m, time_ms; the same header
 * names and units are accepted). Picks are assigned to refractors as the best-fitting candidate
 * model of the plan suggests; elevations come from STATIONS.csv (position_m, elevation_m), else
 * from the plan's section surface, else flat. Prints
 *   { refractors: [{ layer, method, velocity: [{ position, value }],
 *                    depth: [{ position, depth, elevation, sigma }] }],
 *     reciprocal: [{ shots: [a, b], forward, reverse, difference }] }
 * in SI units (m, m/s, s) — the same function and numbers as the Field check screen.
 * Exit 0 on success; 2 for bad input (each problem named on stderr); 1 for an internal error.
 */
import { readFileSync } from "node:fs";
import { pathToFileURL } from "node:url";
import { parsePlan } from "../engine";
import {
  interpretationJson,
  interpretPlanPicks,
  parseElevationCsv,
  parsePicksCsv,
  type LineMethod,
} from "../field";
import { describeJsonError, type CliIo } from "./analyze";

const USAGE =
  "usage: npm run --silent interpret -- PLAN.json PICKS.csv [--method plus-minus|delay-time|grm] [--elevations STATIONS.csv] [--datum METRES] [--xy METRES]";

const METHODS: LineMethod[] = ["plus-minus", "delay-time", "grm"];

function readText(io: CliIo, path: string, what: string): string | { error: string } {
  try {
    return io.readFile(path);
  } catch (error) {
    const code = (error as { code?: string }).code;
    const why =
      code === "ENOENT" ? "no such file" : code === "EISDIR" ? "is a directory" : String(error);
    return { error: `${path}: cannot read the ${what} (${why})` };
  }
}

/** Run the command with its arguments (after `--`); resolves to the exit code. */
export async function runInterpretCli(args: string[], io: CliIo): Promise<number> {
  const positional: string[] = [];
  const flags: Record<string, string> = {};
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    if (a === "--help" || a === "-h") {
      io.stderr(`${USAGE}\n`);
      return 2;
    }
    if (a.startsWith("--")) {
      const [key, inline] = a.slice(2).split("=", 2);
      const value = inline ?? args[++i];
      if (!["method", "elevations", "datum", "xy"].includes(key) || value === undefined) {
        io.stderr(`unknown or incomplete option ${a}\n${USAGE}\n`);
        return 2;
      }
      flags[key] = value;
    } else positional.push(a);
  }
  if (positional.length !== 2) {
    io.stderr(`${USAGE}\n`);
    return 2;
  }
  const [planFile, picksFile] = positional;
  const method = (flags.method ?? "plus-minus") as LineMethod;
  if (!METHODS.includes(method)) {
    io.stderr(`--method must be one of ${METHODS.join(", ")}, not '${flags.method}'\n`);
    return 2;
  }
  const number = (key: string): number | null | { error: string } => {
    if (flags[key] === undefined) return null;
    const v = Number(flags[key]);
    return Number.isFinite(v)
      ? v
      : { error: `--${key} must be a number of metres, not '${flags[key]}'` };
  };
  const datum = number("datum");
  const xy = number("xy");
  for (const v of [datum, xy]) {
    if (v !== null && typeof v === "object") {
      io.stderr(`${v.error}\n`);
      return 2;
    }
  }

  const planText = readText(io, planFile, "plan");
  if (typeof planText !== "string") {
    io.stderr(`${planText.error}\n`);
    return 2;
  }
  let planJson: unknown;
  try {
    planJson = JSON.parse(planText);
  } catch (error) {
    io.stderr(`${planFile}: ${describeJsonError(planText, error)}\n`);
    return 2;
  }
  const parsed = parsePlan(planJson);
  if (!parsed.ok) {
    const n = parsed.issues.length;
    io.stderr(`${planFile}: the plan has ${n} problem${n === 1 ? "" : "s"}:\n`);
    for (const issue of parsed.issues) io.stderr(`  ${issue}\n`);
    return 2;
  }

  const picksText = readText(io, picksFile, "picks");
  if (typeof picksText !== "string") {
    io.stderr(`${picksText.error}\n`);
    return 2;
  }
  const picks = parsePicksCsv(picksText, { timeUnit: "ms" });
  if (!picks.ok) {
    io.stderr(`${picksFile}: ${picks.errors.length} problem(s):\n`);
    for (const e of picks.errors) io.stderr(`  ${e.message}\n`);
    return 2;
  }

  let elevations = null;
  if (flags.elevations !== undefined) {
    const text = readText(io, flags.elevations, "station elevations");
    if (typeof text !== "string") {
      io.stderr(`${text.error}\n`);
      return 2;
    }
    const read = parseElevationCsv(text);
    if (!read.ok) {
      io.stderr(`${flags.elevations}: ${read.errors.length} problem(s):\n`);
      for (const e of read.errors) io.stderr(`  ${e.message}\n`);
      return 2;
    }
    elevations = read.points;
  }

  let out: ReturnType<typeof interpretationJson>;
  try {
    const r = interpretPlanPicks(
      parsed.plan,
      picks.rows.map((p) => ({
        sourcePosition: p.shotPosition,
        receiverPosition: p.geophonePosition,
        time: p.time,
      })),
      { method, elevations, datum: datum as number | null, xy: xy as number | null },
    );
    out = interpretationJson(r.result);
    for (const note of [...r.result.notes, ...r.result.refractors.flatMap((x) => x.notes)]) {
      io.stderr(`note: ${note}\n`);
    }
  } catch (error) {
    if (error instanceof RangeError) {
      io.stderr(`${picksFile}: ${error.message}\n`);
      return 2;
    }
    io.stderr(`interpretation failed: ${error instanceof Error ? error.message : String(error)}\n`);
    return 1;
  }
  io.stdout(`${JSON.stringify(out, null, 2)}\n`);
  return 0;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const code = await runInterpretCli(process.argv.slice(2), {
    stdout: (t) => process.stdout.write(t),
    stderr: (t) => process.stderr.write(t),
    readFile: (p) => readFileSync(p, "utf8"),
    readStdin: async () => "",
  });
  process.exitCode = code;
}
