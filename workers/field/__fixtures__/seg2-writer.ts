/**
 * An independent SEG-2 writer for the tests, written from the byte layout of the standard
 * (Pullan 1990, Geophysics 55(9)) and sharing no code with the reader:
 *
 *   File descriptor block
 *     0–1   block id 3A55 hex, written in the file's byte order
 *     2–3   revision number
 *     4–5   M, size of the trace pointer sub-block in bytes
 *     6–7   N, number of traces
 *     8     size of the string terminator (1 or 2), 9–10 its characters
 *     11    size of the line terminator (0, 1 or 2), 12–13 its characters
 *     14–31 reserved (zero)
 *     32…   trace pointer sub-block: N unsigned 32-bit byte offsets of the trace blocks,
 *           the rest of the M bytes zero
 *     then  strings, each: 2-byte offset to the next string (counted from this string's
 *           offset field), the text, the string terminator; a zero offset ends the list
 *   Trace descriptor block
 *     0–1   block id 4422 hex; 2–3 X, size of this block; 4–7 Y, size of the data block;
 *     8–11  number of samples; 12 data format code; 13–31 reserved; 32…X−1 strings
 *   Data block: the samples in the format given by the code.
 */
export type WriterFormat = 1 | 2 | 3 | 4 | 5;

export interface WriterTrace {
  /** Raw strings, e.g. "SAMPLE_INTERVAL 0.00025"; "" writes an empty string. */
  strings: string[];
  format: WriterFormat;
  samples: ArrayLike<number>;
  /** Overrides the number of samples written in the descriptor (for corrupt files). */
  declaredSamples?: number;
  /** Overrides the data block size Y in the descriptor. */
  declaredDataSize?: number;
  /** Overrides the block id (for corrupt files). */
  blockId?: number;
}

export interface WriterOptions {
  byteOrder: "little" | "big";
  revision?: number;
  fileStrings?: string[];
  traces: WriterTrace[];
  /** 1 or 2 bytes; default a single NUL. */
  stringTerminator?: number[];
  /** 0–2 bytes; default a single line feed. */
  lineTerminator?: number[];
  /** Unused pointer slots after the N pointers (M grows by 4 per slot). */
  spareSlots?: number;
}

class ByteSink {
  private bytes: number[] = [];
  constructor(private readonly littleEndian: boolean) {}
  get length(): number {
    return this.bytes.length;
  }
  u8(v: number): void {
    this.bytes.push(v & 0xff);
  }
  u16(v: number): void {
    const lo = v & 0xff;
    const hi = (v >>> 8) & 0xff;
    if (this.littleEndian) this.bytes.push(lo, hi);
    else this.bytes.push(hi, lo);
  }
  u32(v: number): void {
    const b = [v & 0xff, (v >>> 8) & 0xff, (v >>> 16) & 0xff, (v >>> 24) & 0xff];
    this.raw(this.littleEndian ? b : b.reverse());
  }
  raw(values: ArrayLike<number>): void {
    for (let i = 0; i < values.length; i++) this.bytes.push(values[i] & 0xff);
  }
  zeros(n: number): void {
    for (let i = 0; i < n; i++) this.bytes.push(0);
  }
  set32(at: number, v: number): void {
    const b = [v & 0xff, (v >>> 8) & 0xff, (v >>> 16) & 0xff, (v >>> 24) & 0xff];
    const ordered = this.littleEndian ? b : b.reverse();
    for (let i = 0; i < 4; i++) this.bytes[at + i] = ordered[i];
  }
  set16(at: number, v: number): void {
    const lo = v & 0xff;
    const hi = (v >>> 8) & 0xff;
    this.bytes[at] = this.littleEndian ? lo : hi;
    this.bytes[at + 1] = this.littleEndian ? hi : lo;
  }
  toUint8Array(): Uint8Array {
    return Uint8Array.from(this.bytes);
  }
}

function writeStrings(sink: ByteSink, strings: string[], terminator: number[]): void {
  for (const s of strings) {
    const text = Array.from(s, (c) => c.charCodeAt(0));
    sink.u16(2 + text.length + terminator.length);
    sink.raw(text);
    sink.raw(terminator);
  }
  sink.u16(0);
}

/**
 * Splits a value into a 4-bit exponent and a 16-bit mantissa, value = mantissa · 2^exponent.
 * The mantissa is a one's-complement number (Pullan 1990, data format code 3), so its range is
 * −32767…32767 (one's complement has no −32768).
 */
export function encode20Bit(value: number): { exponent: number; mantissa: number } {
  for (let e = 0; e < 16; e++) {
    const m = value / 2 ** e;
    if (Number.isInteger(m) && m >= -32767 && m <= 32767) return { exponent: e, mantissa: m };
  }
  throw new RangeError(`${value} has no exact 20-bit SEG-2 form`);
}

/**
 * The 16-bit one's-complement word of a mantissa, written from the standard's wording (Pullan
 * 1990, format code 3: "mantissas in one's complement"): a positive mantissa is its binary
 * value; a negative one is its magnitude with every one of the 16 bits inverted. Shares nothing
 * with the reader.
 */
export function onesComplementWord(mantissa: number): number {
  if (!Number.isInteger(mantissa) || Math.abs(mantissa) > 32767) {
    throw new RangeError(`${mantissa} is not a 16-bit one's-complement mantissa`);
  }
  if (mantissa >= 0) return mantissa;
  let word = 0;
  const magnitude = -mantissa;
  for (let bit = 0; bit < 16; bit++) {
    const set = Math.floor(magnitude / 2 ** bit) % 2 === 1;
    if (!set) word += 2 ** bit; // invert every bit of the magnitude
  }
  return word;
}

function writeSamples(
  sink: ByteSink,
  format: WriterFormat,
  samples: ArrayLike<number>,
  le: boolean,
) {
  const scratch = new DataView(new ArrayBuffer(8));
  const put = (n: number) => {
    for (let i = 0; i < n; i++) sink.u8(scratch.getUint8(i));
  };
  if (format === 3) {
    for (let g = 0; g < samples.length; g += 4) {
      const group = [0, 1, 2, 3].map((k) =>
        encode20Bit(g + k < samples.length ? samples[g + k] : 0),
      );
      // Exponent of the first sample of the group in the lowest four bits of the first word.
      sink.u16(group.reduce((w, s, k) => w | (s.exponent << (4 * k)), 0));
      for (const s of group) sink.u16(onesComplementWord(s.mantissa));
    }
    return;
  }
  for (let i = 0; i < samples.length; i++) {
    const v = samples[i];
    if (format === 1) {
      scratch.setInt16(0, v, le);
      put(2);
    } else if (format === 2) {
      scratch.setInt32(0, v, le);
      put(4);
    } else if (format === 4) {
      scratch.setFloat32(0, v, le);
      put(4);
    } else {
      scratch.setFloat64(0, v, le);
      put(8);
    }
  }
}

/** Writes a SEG-2 file from the description. */
export function writeSeg2(options: WriterOptions): Uint8Array {
  const le = options.byteOrder === "little";
  const sink = new ByteSink(le);
  const stringTerminator = options.stringTerminator ?? [0];
  const lineTerminator = options.lineTerminator ?? [0x0a];
  const n = options.traces.length;
  const m = 4 * (n + (options.spareSlots ?? 0));

  sink.u16(0x3a55);
  sink.u16(options.revision ?? 1);
  sink.u16(m);
  sink.u16(n);
  sink.u8(stringTerminator.length);
  sink.u8(stringTerminator[0] ?? 0);
  sink.u8(stringTerminator[1] ?? 0);
  sink.u8(lineTerminator.length);
  sink.u8(lineTerminator[0] ?? 0);
  sink.u8(lineTerminator[1] ?? 0);
  sink.zeros(18);
  const pointerAt = sink.length;
  sink.zeros(m);
  writeStrings(sink, options.fileStrings ?? [], stringTerminator);
  while (sink.length % 4 !== 0) sink.u8(0);

  options.traces.forEach((trace, i) => {
    const start = sink.length;
    sink.set32(pointerAt + 4 * i, start);
    sink.u16(trace.blockId ?? 0x4422);
    sink.u16(0); // block size X, patched below
    sink.u32(0); // data size Y, patched below
    sink.u32(trace.declaredSamples ?? trace.samples.length);
    sink.u8(trace.format);
    sink.zeros(19);
    writeStrings(sink, trace.strings, stringTerminator);
    while ((sink.length - start) % 4 !== 0) sink.u8(0);
    sink.set16(start + 2, sink.length - start);
    const dataStart = sink.length;
    writeSamples(sink, trace.format, trace.samples, le);
    sink.set32(start + 4, trace.declaredDataSize ?? sink.length - dataStart);
  });
  return sink.toUint8Array();
}
