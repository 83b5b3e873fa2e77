/**
 * The free-format string sub-blocks of SEG-2 (Pullan 1990, Geophysics 55(9), §III.B and
 * §III.C): a list of `KEYWORD value` strings, each preceded by a 2-byte unsigned offset from
 * the start of that string (offset field included) to the start of the next, and closed by
 * the file's string terminator. An offset of 0 ends the list.
 */
import { Seg2Error } from "./seg2-error";

/** One `KEYWORD value` string and the byte offset of its 2-byte length field. */
export interface Seg2StringEntry {
  /** Keyword, upper case. */
  key: string;
  /** Value with surrounding blanks removed; line terminators become "\n". */
  value: string;
  /** Byte offset of the string's 2-byte offset field in the file. */
  offset: number;
}

/** String and line terminator byte sequences declared in the file descriptor block. */
export interface Seg2Terminators {
  /** 1 or 2 bytes. */
  string: Uint8Array;
  /** 0, 1 or 2 bytes. */
  line: Uint8Array;
}

function indexOfSequence(bytes: Uint8Array, from: number, to: number, seq: Uint8Array): number {
  if (seq.length === 0) return -1;
  for (let i = from; i + seq.length <= to; i++) {
    let hit = true;
    for (let j = 0; j < seq.length; j++) {
      if (bytes[i + j] !== seq[j]) {
        hit = false;
        break;
      }
    }
    if (hit) return i;
  }
  return -1;
}

function decodeText(bytes: Uint8Array, from: number, to: number, line: Uint8Array): string {
  let out = "";
  for (let i = from; i < to; i++) {
    if (line.length > 0 && indexOfSequence(bytes, i, Math.min(to, i + line.length), line) === i) {
      out += "\n";
      i += line.length - 1;
      continue;
    }
    const c = bytes[i];
    // Printable ASCII and Latin-1 only: instruments pad with NULs and other control bytes.
    if (c === 0x09) out += " ";
    else if (c === 0x0a) out += "\n";
    else if ((c >= 0x20 && c < 0x7f) || c >= 0xa0) out += String.fromCharCode(c);
  }
  return out;
}

/**
 * Reads the string list in `[start, end)`. Stops at an offset of 0 or when fewer than two
 * bytes remain. Throws a `Seg2Error` when a string's offset runs past `end`.
 */
export function readStringList(
  bytes: Uint8Array,
  view: DataView,
  littleEndian: boolean,
  start: number,
  end: number,
  terminators: Seg2Terminators,
): Seg2StringEntry[] {
  const entries: Seg2StringEntry[] = [];
  let pos = start;
  while (pos + 2 <= end) {
    const next = view.getUint16(pos, littleEndian);
    if (next === 0) break;
    if (next < 2) {
      throw new Seg2Error(pos, "a string offset of 0 (end of list) or at least 2", String(next));
    }
    if (pos + next > end) {
      throw new Seg2Error(
        pos,
        `a string that ends within its block (at most ${end - pos} bytes)`,
        `a string offset of ${next}`,
      );
    }
    const textEnd = indexOfSequence(bytes, pos + 2, pos + next, terminators.string);
    const text = decodeText(bytes, pos + 2, textEnd < 0 ? pos + next : textEnd, terminators.line);
    const trimmed = text.trim();
    if (trimmed.length > 0) {
      const split = trimmed.search(/\s/);
      const key = (split < 0 ? trimmed : trimmed.slice(0, split)).toUpperCase();
      const value = split < 0 ? "" : trimmed.slice(split).trim();
      entries.push({ key, value, offset: pos });
    }
    pos += next;
  }
  return entries;
}

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** Parses one decimal number written the way SEG-2 strings write them; null if it is not one. */
export function parseDecimal(text: string): number | null {
  const t = text.trim();
  if (!NUMBER.test(t)) return null;
  const v = Number(t);
  return Number.isFinite(v) ? v : null;
}

/** The first of a blank- or comma-separated list of numbers, e.g. "12.5 0.0 0.0" → 12.5. */
export function firstNumber(text: string): number | null {
  const first = text.trim().split(/[\s,]+/)[0] ?? "";
  return parseDecimal(first);
}
