/**
 * Command line: analyse a plan file and print the analysis as JSON.
 *
 *   npm run --silent analyze -- FILE.json     (FILE "-" reads standard input)
 *   npm run --silent analyze -- --spread 3 FILE.json   (roll-along: spread 3 in detail)
 *
 * Exit 0 with the analysis (exactly analyzePlan's output, the same object the worker
 * returns) on stdout; a roll-along plan adds `rollAlong` (every spread's verdict), and
 * `--spread N` picks the spread whose details `models` give (analyzePlan's `spread` option). Invalid input (unreadable file, bad JSON, a bad field) prints one line
 * per problem naming the field (or the line and column of bad JSON) on stderr and exits 2.
 * An unexpected internal error exits 1.
 */
import { readFileSync } from "node:fs";
import { pathToFileURL } from "node:url";
import { analyzePlan, parsePlan } from "../engine";

/** Where the command reads and writes (replaceable in tests). */
export interface CliIo {
  stdout(text: string): void;
  stderr(text: string): void;
  readFile(path: string): string;
  readStdin(): Promise<string>;
}

const USAGE =
  "usage: npm run --silent analyze -- [--spread N] FILE.json   (FILE - reads standard input; " +
  "--spread N shows spread N of a roll-along line in detail)";

/** Line and column (1-based) of a character offset in a text. */
export function lineColumn(text: string, offset: number): { line: number; column: number } {
  const before = text.slice(0, Math.max(0, Math.min(offset, text.length)));
  const lines = before.split("\n");
  return { line: lines.length, column: lines[lines.length - 1].length + 1 };
}

/**
 * Offset of the first JSON syntax error in `text` (a small strict scanner, so that the
 * position does not depend on the JavaScript engine's error message), or −1 if none.
 */
export function jsonErrorOffset(text: string): number {
  let i = 0;
  const ws = () => {
    while (i < text.length && " \t\n\r".includes(text[i])) i++;
  };
  const fail = (): never => {
    throw i;
  };
  const literal = (word: string) => {
    for (const ch of word) {
      if (text[i] !== ch) fail();
      i++;
    }
  };
  const string = () => {
    i++; // opening quote
    while (i < text.length && text[i] !== '"') {
      const c = text.charCodeAt(i);
      if (c < 0x20) fail();
      if (text[i] === "\\") {
        i++;
        if (text[i] === "u") {
          for (let k = 1; k <= 4; k++) {
            if (!/[0-9a-fA-F]/.test(text[i + k] ?? "")) {
              i += k;
              fail();
            }
          }
          i += 4;
        } else if (!'"\\/bfnrt'.includes(text[i] ?? "x")) fail();
      }
      i++;
    }
    if (i >= text.length) fail();
    i++;
  };
  const number = () => {
    const m = /^-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?/.exec(text.slice(i));
    if (!m) fail();
    i += (m as RegExpExecArray)[0].length;
  };
  const value = (): void => {
    ws();
    const c = text[i];
    if (c === "{") {
      i++;
      ws();
      if (text[i] === "}") return void i++;
      for (;;) {
        ws();
        if (text[i] !== '"') fail();
        string();
        ws();
        if (text[i] !== ":") fail();
        i++;
        value();
        ws();
        if (text[i] === ",") i++;
        else if (text[i] === "}") return void i++;
        else fail();
      }
    } else if (c === "[") {
      i++;
      ws();
      if (text[i] === "]") return void i++;
      for (;;) {
        value();
        ws();
        if (text[i] === ",") i++;
        else if (text[i] === "]") return void i++;
        else fail();
      }
    } else if (c === '"') string();
    else if (c === "t") literal("true");
    else if (c === "f") literal("false");
    else if (c === "n") literal("null");
    else if (c === "-" || (c !== undefined && c >= "0" && c <= "9")) number();
    else fail();
  };
  try {
    value();
    ws();
    if (i < text.length) fail();
    return -1;
  } catch (at) {
    if (typeof at === "number") return at;
    throw at;
  }
}

/** A JSON.parse error described with the line and column where the text stops being JSON. */
export function describeJsonError(text: string, error: unknown): string {
  const message = error instanceof Error ? error.message : String(error);
  const offset = jsonErrorOffset(text);
  if (offset < 0) return `invalid JSON: ${message}`;
  const { line, column } = lineColumn(text, offset);
  const what =
    offset >= text.length
      ? "unexpected end of input"
      : `unexpected ${JSON.stringify(text[offset])}`;
  return `invalid JSON at line ${line}, column ${column}: ${what}`;
}

/** Run the command with its arguments (after `--`); resolves to the exit code. */
export async function runAnalyzeCli(argv: string[], io: CliIo): Promise<number> {
  const args = [...argv];
  let spread: number | undefined;
  const at = args.indexOf("--spread");
  if (at >= 0) {
    const value = args[at + 1] ?? "";
    if (!/^[1-9]\d*$/.test(value)) {
      io.stderr(`--spread: give the spread of the roll-along line as a whole number from 1\n`);
      return 2;
    }
    spread = Number(value);
    args.splice(at, 2);
  }
  if (args.length !== 1 || args[0] === "--help" || args[0] === "-h") {
    io.stderr(`${USAGE}\n`);
    return 2;
  }
  const file = args[0];
  const name = file === "-" ? "stdin" : file;
  let text: string;
  try {
    text = file === "-" ? await io.readStdin() : io.readFile(file);
  } catch (error) {
    const code = (error as { code?: string }).code;
    const why =
      code === "ENOENT" ? "no such file" : code === "EISDIR" ? "is a directory" : String(error);
    io.stderr(`${name}: cannot read the plan (${why})\n`);
    return 2;
  }
  let input: unknown;
  try {
    input = JSON.parse(text);
  } catch (error) {
    io.stderr(`${name}: ${describeJsonError(text, error)}\n`);
    return 2;
  }
  const parsed = parsePlan(input);
  if (!parsed.ok) {
    const n = parsed.issues.length;
    io.stderr(`${name}: the plan has ${n} problem${n === 1 ? "" : "s"}:\n`);
    for (const issue of parsed.issues) io.stderr(`  ${issue}\n`);
    return 2;
  }
  try {
    const analysis = analyzePlan(parsed.plan, spread === undefined ? {} : { spread });
    io.stdout(`${JSON.stringify(analysis, null, 2)}\n`);
    return 0;
  } catch (error) {
    io.stderr(
      `${name}: analysis failed: ${error instanceof Error ? error.message : String(error)}\n`,
    );
    return 1;
  }
}

async function readAll(stream: NodeJS.ReadableStream): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream)
    chunks.push(Buffer.isBuffer(chunk) ? chunk : Buffer.from(chunk));
  return Buffer.concat(chunks).toString("utf8");
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const code = await runAnalyzeCli(process.argv.slice(2), {
    stdout: (t) => process.stdout.write(t),
    stderr: (t) => process.stderr.write(t),
    readFile: (p) => readFileSync(p, "utf8"),
    readStdin: () => readAll(process.stdin),
  });
  process.exitCode = code;
}
