/**
 * SEG-2 reader (Pullan 1990, "Recommended standard for seismic (/radar) data files in the
 * personal computer environment", Geophysics 55(9)). Reads a whole file held in memory.
 *
 * Layout read here (byte offsets within a block, both byte orders):
 * - File descriptor block: 0–1 id 0x3A55 (its byte order gives the file's), 2–3 revision,
 *   4–5 size M of the trace pointer sub-block, 6–7 number of traces N, 8 size of the string
 *   terminator (1 or 2), 9–10 its characters, 11 size of the line terminator (0–2), 12–13 its
 *   characters, 14–31 reserved, 32…32+M−1 trace pointers (N unsigned 32-bit), then strings.
 * - Trace descriptor block: 0–1 id 0x4422, 2–3 block size X, 4–7 data size Y (bytes), 8–11
 *   number of samples, 12 data format code, 13–31 reserved, 32…X−1 strings, X… data.
 * - Data formats: 1 int16, 2 int32, 3 20-bit floating point (4 samples in 10 bytes), 4 float32,
 *   5 float64.
 *
 * Guarantees: every problem is a `Seg2Error` naming the byte offset; allocations are bounded
 * by the file length (trace blocks may not overlap, so all samples together fit in the file).
 */
import { Seg2Error } from "./seg2-error";
import {
  firstNumber,
  parseDecimal,
  readStringList,
  type Seg2StringEntry,
  type Seg2Terminators,
} from "./seg2-strings";

/** Data format codes of SEG-2: 1 int16, 2 int32, 3 20-bit float, 4 float32, 5 float64. */
export type Seg2Format = 1 | 2 | 3 | 4 | 5;

/** One trace of a SEG-2 record. */
export interface Seg2Trace {
  /** Position of the trace in the file's trace pointer list, from 0. */
  index: number;
  /** All trace descriptor strings, keyword (upper case) → value. */
  strings: Record<string, string>;
  /** SAMPLE_INTERVAL, s. */
  sampleInterval: number;
  /** DELAY (time of the first sample relative to the shot), s; 0 when absent. */
  delay: number;
  /** In-line receiver position (first number of RECEIVER_LOCATION), m; null when absent. */
  receiverPosition: number | null;
  /** In-line source position (first number of SOURCE_LOCATION), m; null when absent. */
  sourcePosition: number | null;
  /** CHANNEL_NUMBER; null when absent. */
  channel: number | null;
  /** Sample values as stored (no descaling applied). */
  samples: Float32Array;
  /** Data format code the samples were stored in. */
  format: Seg2Format;
}

/** A whole SEG-2 file. */
export interface Seg2Record {
  byteOrder: "little" | "big";
  revision: number;
  /** All file descriptor strings, keyword (upper case) → value. */
  strings: Record<string, string>;
  traces: Seg2Trace[];
}

const FILE_ID = 0x3a55;
const TRACE_ID = 0x4422;
const BLOCK_HEADER = 32;

const hex = (v: number) => `0x${v.toString(16).toUpperCase().padStart(4, "0")}`;

function toBytes(input: ArrayBuffer | Uint8Array): Uint8Array {
  if (input instanceof Uint8Array) return input;
  if (input instanceof ArrayBuffer) return new Uint8Array(input);
  throw new Seg2Error(0, "an ArrayBuffer or Uint8Array", typeof input);
}

function dataBytes(format: Seg2Format, samples: number): number {
  switch (format) {
    case 1:
      return samples * 2;
    case 2:
    case 4:
      return samples * 4;
    case 3:
      return Math.ceil(samples / 4) * 10;
    case 5:
      return samples * 8;
  }
}

function toMap(entries: Seg2StringEntry[]): Record<string, string> {
  const map: Record<string, string> = {};
  for (const e of entries) map[e.key] = e.value;
  return map;
}

function lookup(entries: Seg2StringEntry[], key: string): Seg2StringEntry | undefined {
  let found: Seg2StringEntry | undefined;
  for (const e of entries) if (e.key === key) found = e;
  return found;
}

function numberValue(entry: Seg2StringEntry, what: string, first: boolean): number {
  const v = first ? firstNumber(entry.value) : parseDecimal(entry.value);
  if (v === null) throw new Seg2Error(entry.offset, `${what} in ${entry.key}`, `'${entry.value}'`);
  return v;
}

function decodeSamples(
  view: DataView,
  start: number,
  count: number,
  format: Seg2Format,
  le: boolean,
): Float32Array {
  const out = new Float32Array(count);
  switch (format) {
    case 1:
      for (let i = 0; i < count; i++) out[i] = view.getInt16(start + 2 * i, le);
      break;
    case 2:
      for (let i = 0; i < count; i++) out[i] = view.getInt32(start + 4 * i, le);
      break;
    case 3:
      // 20-bit floating point: each group of 4 samples is five 16-bit words in the file's
      // byte order; word 0 holds the four 4-bit exponents (sample 1 in bits 0–3, sample 2 in
      // bits 4–7, …), words 1–4 the 16-bit mantissas in one's complement (a negative value
      // has every bit of its magnitude inverted, so 0xFFFF is −0); value = mantissa · 2^exponent.
      for (let i = 0; i < count; i++) {
        const group = start + Math.floor(i / 4) * 10;
        const k = i % 4;
        const exponent = (view.getUint16(group, le) >> (4 * k)) & 0x0f;
        const word = view.getUint16(group + 2 + 2 * k, le);
        const mantissa = word & 0x8000 ? word - 0xffff : word;
        out[i] = mantissa * 2 ** exponent;
      }
      break;
    case 4:
      for (let i = 0; i < count; i++) out[i] = view.getFloat32(start + 4 * i, le);
      break;
    case 5:
      for (let i = 0; i < count; i++) out[i] = view.getFloat64(start + 8 * i, le);
      break;
  }
  const width = format === 3 ? 2.5 : dataBytes(format, 1);
  for (let i = 0; i < count; i++) {
    if (!Number.isFinite(out[i])) {
      throw new Seg2Error(
        start + Math.floor(i * width),
        `a finite sample value (sample ${i + 1})`,
        String(out[i]),
      );
    }
  }
  return out;
}

interface TraceHeader {
  pointer: number;
  blockSize: number;
  samples: number;
  format: Seg2Format;
  dataStart: number;
  dataLength: number;
}

function readTraceHeader(
  view: DataView,
  length: number,
  pointer: number,
  le: boolean,
): TraceHeader {
  if (pointer + BLOCK_HEADER > length) {
    throw new Seg2Error(
      pointer,
      "a 32-byte trace descriptor block",
      `${Math.max(0, length - pointer)} bytes before the end of the file`,
    );
  }
  const id = view.getUint16(pointer, le);
  if (id !== TRACE_ID) {
    throw new Seg2Error(pointer, `trace descriptor id ${hex(TRACE_ID)}`, hex(id));
  }
  const blockSize = view.getUint16(pointer + 2, le);
  if (blockSize < BLOCK_HEADER || blockSize % 4 !== 0) {
    throw new Seg2Error(
      pointer + 2,
      "a trace descriptor block size that is a multiple of 4 and at least 32",
      String(blockSize),
    );
  }
  if (pointer + blockSize > length) {
    throw new Seg2Error(
      pointer + 2,
      `a trace descriptor block that ends within the file (${length - pointer} bytes left)`,
      `a block size of ${blockSize}`,
    );
  }
  const declaredData = view.getUint32(pointer + 4, le);
  const samples = view.getUint32(pointer + 8, le);
  const code = view.getUint8(pointer + 12);
  if (code < 1 || code > 5) {
    throw new Seg2Error(pointer + 12, "a data format code from 1 to 5", String(code));
  }
  const format = code as Seg2Format;
  const dataStart = pointer + blockSize;
  const available = length - dataStart;
  // Compare sample counts before multiplying, so a huge count cannot overflow the check.
  const perSample = format === 3 ? 2.5 : dataBytes(format, 1);
  if (samples > available / perSample) {
    throw new Seg2Error(
      pointer + 8,
      `at most ${Math.floor(available / perSample)} samples (the data left in the file)`,
      `${samples} samples`,
    );
  }
  const dataLength = dataBytes(format, samples);
  if (dataLength > available) {
    throw new Seg2Error(
      dataStart,
      `${dataLength} bytes of trace data`,
      `${available} bytes before the end of the file`,
    );
  }
  // The data block size must agree with the sample count (a few bytes of padding to a 4-byte
  // boundary are tolerated): a mismatch means the count, the format or the size is wrong.
  if (declaredData < dataLength || declaredData > dataLength + 3) {
    throw new Seg2Error(
      pointer + 4,
      `a data block size consistent with ${samples} samples in format ${format} (${dataLength} bytes)`,
      `${declaredData} bytes`,
    );
  }
  return { pointer, blockSize, samples, format, dataStart, dataLength };
}

/**
 * Reads a SEG-2 file.
 *
 * SAMPLE_INTERVAL is read from the trace strings, or from the file strings when a trace has
 * none (some instruments write it once); a trace with neither is an error. SOURCE_LOCATION
 * falls back to the file strings in the same way; DELAY defaults to 0 s; RECEIVER_LOCATION and
 * CHANNEL_NUMBER are null when absent. Sample values are returned as stored (integer counts for
 * formats 1–3); float64 data are narrowed to float32.
 *
 * @throws Seg2Error for any malformed, truncated or unsupported input.
 */
export function readSeg2(input: ArrayBuffer | Uint8Array): Seg2Record {
  const bytes = toBytes(input);
  const length = bytes.byteLength;
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  if (length < BLOCK_HEADER) {
    throw new Seg2Error(0, "a 32-byte file descriptor block", `a file of ${length} bytes`);
  }

  let le: boolean;
  if (bytes[0] === 0x55 && bytes[1] === 0x3a) le = true;
  else if (bytes[0] === 0x3a && bytes[1] === 0x55) le = false;
  else {
    throw new Seg2Error(
      0,
      `file descriptor id ${hex(FILE_ID)} (bytes 55 3A or 3A 55)`,
      `bytes ${bytes[0].toString(16).padStart(2, "0")} ${bytes[1].toString(16).padStart(2, "0")}`,
    );
  }

  const revision = view.getUint16(2, le);
  if (revision < 1) throw new Seg2Error(2, "a revision number of at least 1", String(revision));
  const pointerBlock = view.getUint16(4, le);
  const traceCount = view.getUint16(6, le);
  if (traceCount === 0) {
    throw new Seg2Error(
      6,
      "at least one trace (a SEG-2 record without traces holds no data)",
      "0 traces",
    );
  }
  if (pointerBlock % 4 !== 0 || pointerBlock < 4 * traceCount) {
    throw new Seg2Error(
      4,
      `a trace pointer sub-block size that is a multiple of 4 and holds ${traceCount} pointers (at least ${4 * traceCount} bytes)`,
      String(pointerBlock),
    );
  }
  if (BLOCK_HEADER + pointerBlock > length) {
    throw new Seg2Error(
      4,
      `a trace pointer sub-block that ends within the file (${length - BLOCK_HEADER} bytes left)`,
      `a size of ${pointerBlock}`,
    );
  }

  const stringSize = bytes[8];
  if (stringSize !== 1 && stringSize !== 2) {
    throw new Seg2Error(8, "a string terminator size of 1 or 2", String(stringSize));
  }
  const lineSize = bytes[11];
  if (lineSize > 2)
    throw new Seg2Error(11, "a line terminator size of 0, 1 or 2", String(lineSize));
  const terminators: Seg2Terminators = {
    string: bytes.slice(9, 9 + stringSize),
    line: bytes.slice(12, 12 + lineSize),
  };

  const pointers: number[] = [];
  for (let i = 0; i < traceCount; i++) {
    const at = BLOCK_HEADER + 4 * i;
    const p = view.getUint32(at, le);
    if (p < BLOCK_HEADER + pointerBlock || p >= length) {
      throw new Seg2Error(
        at,
        `a pointer to trace ${i + 1} between ${BLOCK_HEADER + pointerBlock} and ${length - 1}`,
        String(p),
      );
    }
    pointers.push(p);
  }

  // File strings run from the end of the pointer sub-block to the first trace block.
  const stringsStart = BLOCK_HEADER + pointerBlock;
  const stringsEnd = pointers.reduce((a, b) => Math.min(a, b), length);
  const fileEntries = readStringList(bytes, view, le, stringsStart, stringsEnd, terminators);
  const fileStrings = toMap(fileEntries);

  const headers = pointers.map((p) => readTraceHeader(view, length, p, le));
  const spans = headers
    .map((h, i) => ({ i, from: h.pointer, to: h.dataStart + h.dataLength }))
    .sort((a, b) => a.from - b.from);
  for (let k = 1; k < spans.length; k++) {
    if (spans[k].from < spans[k - 1].to) {
      throw new Seg2Error(
        BLOCK_HEADER + 4 * spans[k].i,
        `trace ${spans[k].i + 1} to start after trace ${spans[k - 1].i + 1} ends (byte ${spans[k - 1].to})`,
        `a pointer to byte ${spans[k].from}`,
      );
    }
  }

  const fileInterval = lookup(fileEntries, "SAMPLE_INTERVAL");
  const fileSource = lookup(fileEntries, "SOURCE_LOCATION");

  const traces = headers.map((h, index): Seg2Trace => {
    const entries = readStringList(
      bytes,
      view,
      le,
      h.pointer + BLOCK_HEADER,
      h.pointer + h.blockSize,
      terminators,
    );
    const intervalEntry = lookup(entries, "SAMPLE_INTERVAL") ?? fileInterval;
    if (!intervalEntry) {
      throw new Seg2Error(
        h.pointer + BLOCK_HEADER,
        `a SAMPLE_INTERVAL string for trace ${index + 1}`,
        "none",
      );
    }
    const sampleInterval = numberValue(intervalEntry, "a sample interval in seconds", false);
    if (!(sampleInterval > 0)) {
      throw new Seg2Error(
        intervalEntry.offset,
        "a SAMPLE_INTERVAL greater than 0 s",
        String(sampleInterval),
      );
    }
    const delayEntry = lookup(entries, "DELAY");
    const receiverEntry = lookup(entries, "RECEIVER_LOCATION");
    const sourceEntry = lookup(entries, "SOURCE_LOCATION") ?? fileSource;
    const channelEntry = lookup(entries, "CHANNEL_NUMBER");
    let channel: number | null = null;
    if (channelEntry) {
      channel = numberValue(channelEntry, "a whole channel number", false);
      if (!Number.isInteger(channel)) {
        throw new Seg2Error(
          channelEntry.offset,
          "a whole channel number",
          `'${channelEntry.value}'`,
        );
      }
    }
    return {
      index,
      strings: toMap(entries),
      sampleInterval,
      delay: delayEntry ? numberValue(delayEntry, "a delay in seconds", false) : 0,
      receiverPosition: receiverEntry
        ? numberValue(receiverEntry, "a position in metres", true)
        : null,
      sourcePosition: sourceEntry ? numberValue(sourceEntry, "a position in metres", true) : null,
      channel,
      samples: decodeSamples(view, h.dataStart, h.samples, h.format, le),
      format: h.format,
    };
  });

  return { byteOrder: le ? "little" : "big", revision, strings: fileStrings, traces };
}
