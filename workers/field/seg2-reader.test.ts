// Byte layout checked against: Pullan (1990), "Recommended standard for seismic (/radar) data
// files in the personal computer environment", Geophysics 55(9) (the SEG-2 standard). Test
// files come from the independent writer in __fixtures__/seg2-writer.ts.
import { describe, expect, it } from "vitest";
import { readSeg2 } from "./seg2-reader";
import { Seg2Error } from "./seg2-error";
import {
  onesComplementWord,
  writeSeg2,
  type WriterFormat,
  type WriterTrace,
} from "./__fixtures__/seg2-writer";

const orders = ["little", "big"] as const;

const standardStrings = (channel: number, receiver: number) => [
  "SAMPLE_INTERVAL 0.00025",
  "DELAY -0.002",
  `RECEIVER_LOCATION ${receiver} 0 0`,
  "SOURCE_LOCATION -2.5 0.0 0.0",
  `CHANNEL_NUMBER ${channel}`,
];

const valuesFor: Record<WriterFormat, number[]> = {
  1: [0, 1, -1, 32767, -32768, 1234, -4321],
  2: [0, 1, -1, 16777216, -16777216, -2147483648, 65536],
  // 20-bit values: mantissa · 2^exponent with |mantissa| ≤ 32767 and exponent 0–15.
  3: [0, 1, -1, 32767, -32768, 65534, -40000, 3 * 2 ** 20, -5 * 2 ** 15],
  4: [0, 0.5, -0.25, 1e-6, -3.5e4, 123.456],
  5: [0, 0.5, -0.25, 1e-6, -3.5e4, 123.456],
};

function errorOf(fn: () => unknown): Seg2Error {
  try {
    fn();
  } catch (e) {
    if (e instanceof Seg2Error) return e;
    throw new Error(`expected a Seg2Error, got ${String(e)}`);
  }
  throw new Error("expected a Seg2Error, but the call succeeded");
}

describe("readSeg2", () => {
  for (const byteOrder of orders) {
    for (const format of [1, 2, 3, 4, 5] as const) {
      it(`reads data format ${format} in ${byteOrder}-endian files`, () => {
        const samples = valuesFor[format];
        const file = writeSeg2({
          byteOrder,
          fileStrings: ["ACQUISITION_DATE 03/APR/2025", "INSTRUMENT invented test writer"],
          traces: [
            { strings: standardStrings(1, 0), format, samples },
            { strings: standardStrings(2, 5), format, samples: [...samples].reverse() },
          ],
        });
        const record = readSeg2(file);
        expect(record.byteOrder).toBe(byteOrder);
        expect(record.revision).toBe(1);
        expect(record.strings.INSTRUMENT).toBe("invented test writer");
        expect(record.traces).toHaveLength(2);
        const [a, b] = record.traces;
        expect(a.format).toBe(format);
        expect(a.samples).toBeInstanceOf(Float32Array);
        expect(Array.from(a.samples)).toHaveLength(samples.length);
        samples.forEach((v, i) => {
          expect(a.samples[i]).toBeCloseTo(Math.fround(v), 6);
          expect(b.samples[samples.length - 1 - i]).toBeCloseTo(Math.fround(v), 6);
        });
      });
    }

    it(`parses the standard strings of a ${byteOrder}-endian trace`, () => {
      const file = writeSeg2({
        byteOrder,
        traces: [{ strings: standardStrings(7, 12.5), format: 4, samples: [1, 2, 3] }],
      });
      const [trace] = readSeg2(file).traces;
      expect(trace.index).toBe(0);
      expect(trace.sampleInterval).toBeCloseTo(0.00025, 12);
      expect(trace.delay).toBeCloseTo(-0.002, 12);
      expect(trace.receiverPosition).toBe(12.5);
      expect(trace.sourcePosition).toBe(-2.5);
      expect(trace.channel).toBe(7);
      expect(trace.strings).toEqual({
        SAMPLE_INTERVAL: "0.00025",
        DELAY: "-0.002",
        RECEIVER_LOCATION: "12.5 0 0",
        SOURCE_LOCATION: "-2.5 0.0 0.0",
        CHANNEL_NUMBER: "7",
      });
    });
  }

  it("decodes a hand-made 20-bit group: exponents in one word, then four one's-complement mantissas", () => {
    // Pullan (1990), data format code 3: per group of four samples one word of four 4-bit
    // exponents, then four 16-bit mantissas in one's complement; value = mantissa · 2^exponent.
    // Exponent word 0x3210: sample 1 exponent 0, sample 2 → 1, sample 3 → 2, sample 4 → 3.
    // Mantissa words 0x0064 (+100), 0xFF9B (one's complement of 100 → −100), 0x0007 (+7) and
    // 0xFFFF (one's complement of 0, "minus zero") → values 100, −200, 28, 0.
    const le = writeSeg2({
      byteOrder: "little",
      traces: [{ strings: ["SAMPLE_INTERVAL 0.001"], format: 3, samples: [0, 0, 0, 0] }],
    });
    const group = [0x10, 0x32, 100, 0x00, 0x9b, 0xff, 0x07, 0x00, 0xff, 0xff];
    le.set(group, le.length - 10);
    expect(Array.from(readSeg2(le).traces[0].samples)).toEqual([100, -200, 28, 0]);

    const be = writeSeg2({
      byteOrder: "big",
      traces: [{ strings: ["SAMPLE_INTERVAL 0.001"], format: 3, samples: [0, 0, 0, 0] }],
    });
    be.set([0x32, 0x10, 0x00, 100, 0xff, 0x9b, 0x00, 0x07, 0xff, 0xff], be.length - 10);
    expect(Array.from(readSeg2(be).traces[0].samples)).toEqual([100, -200, 28, 0]);
  });

  it("reads 0xFF9C as −99 and 0x8000 as −32767 (one's complement, not two's)", () => {
    // One's complement (Pullan 1990, format 3): 0xFF9C inverts to 0x0063 = 99; 0x8000 inverts
    // to 0x7FFF = 32767. A two's-complement reading would give −100 and −32768.
    const file = writeSeg2({
      byteOrder: "little",
      traces: [{ strings: ["SAMPLE_INTERVAL 0.001"], format: 3, samples: [0, 0, 0, 0] }],
    });
    file.set([0x00, 0x00, 0x9c, 0xff, 0x00, 0x80, 0x01, 0x00, 0xfe, 0xff], file.length - 10);
    expect(Array.from(readSeg2(file).traces[0].samples)).toEqual([-99, -32767, 1, -1]);
  });

  it("the test writer's one's-complement words follow the standard's wording", () => {
    // Inverting every bit of the magnitude (Pullan 1990): −1 → 0xFFFE, −100 → 0xFF9B,
    // −32767 → 0x8000; positive values unchanged.
    expect(onesComplementWord(-1)).toBe(0xfffe);
    expect(onesComplementWord(-100)).toBe(0xff9b);
    expect(onesComplementWord(-32767)).toBe(0x8000);
    expect(onesComplementWord(32767)).toBe(0x7fff);
    expect(() => onesComplementWord(-32768)).toThrow(RangeError);
  });

  it("reads a 20-bit trace whose sample count is not a multiple of four", () => {
    const file = writeSeg2({
      byteOrder: "little",
      traces: [
        { strings: ["SAMPLE_INTERVAL 0.001"], format: 3, samples: [5, -6, 70000, 8, 9, -10] },
      ],
    });
    expect(Array.from(readSeg2(file).traces[0].samples)).toEqual([5, -6, 70000, 8, 9, -10]);
  });

  it("gives null positions, no channel and zero delay when the optional strings are missing", () => {
    const file = writeSeg2({
      byteOrder: "little",
      traces: [{ strings: ["SAMPLE_INTERVAL 0.0005"], format: 1, samples: [1, 2] }],
    });
    const [trace] = readSeg2(file).traces;
    expect(trace.delay).toBe(0);
    expect(trace.receiverPosition).toBeNull();
    expect(trace.sourcePosition).toBeNull();
    expect(trace.channel).toBeNull();
    expect(trace.strings).toEqual({ SAMPLE_INTERVAL: "0.0005" });
  });

  it("skips empty strings and keeps a keyword without a value", () => {
    const file = writeSeg2({
      byteOrder: "big",
      fileStrings: ["", "NOTE", "", "COMPANY Ostrava Tarn Surveys"],
      traces: [{ strings: ["", "SAMPLE_INTERVAL 0.001", ""], format: 2, samples: [3] }],
    });
    const record = readSeg2(file);
    expect(record.strings).toEqual({ NOTE: "", COMPANY: "Ostrava Tarn Surveys" });
    expect(record.traces[0].strings).toEqual({ SAMPLE_INTERVAL: "0.001" });
  });

  it("reads a file without any strings apart from the sample interval in the file block", () => {
    const file = writeSeg2({
      byteOrder: "little",
      fileStrings: ["SAMPLE_INTERVAL 0.000125", "SOURCE_LOCATION 30"],
      traces: [
        { strings: [], format: 4, samples: [0.5] },
        { strings: ["SOURCE_LOCATION 31"], format: 4, samples: [0.25] },
      ],
    });
    const [a, b] = readSeg2(file).traces;
    expect(a.sampleInterval).toBeCloseTo(0.000125, 12);
    expect(a.sourcePosition).toBe(30);
    expect(b.sourcePosition).toBe(31);
  });

  it("honours two-byte string terminators and turns line terminators into new lines", () => {
    const file = writeSeg2({
      byteOrder: "little",
      stringTerminator: [0x00, 0x00],
      lineTerminator: [0x0d, 0x0a],
      fileStrings: ["NOTE first line\r\nsecond line"],
      traces: [{ strings: ["SAMPLE_INTERVAL 0.001", "CHANNEL_NUMBER 3"], format: 1, samples: [9] }],
    });
    const record = readSeg2(file);
    expect(record.strings.NOTE).toBe("first line\nsecond line");
    expect(record.traces[0].channel).toBe(3);
  });

  it("accepts spare trace pointer slots, an ArrayBuffer and a Uint8Array view with an offset", () => {
    const file = writeSeg2({
      byteOrder: "big",
      spareSlots: 5,
      traces: [{ strings: ["SAMPLE_INTERVAL 0.001"], format: 1, samples: [4, 5] }],
    });
    expect(Array.from(readSeg2(file.buffer as ArrayBuffer).traces[0].samples)).toEqual([4, 5]);
    const padded = new Uint8Array(file.length + 7);
    padded.set(file, 7);
    expect(Array.from(readSeg2(padded.subarray(7)).traces[0].samples)).toEqual([4, 5]);
  });

  it("refuses a file with no traces, saying so", () => {
    const e = errorOf(() =>
      readSeg2(writeSeg2({ byteOrder: "little", fileStrings: ["NOTE empty"], traces: [] })),
    );
    expect(e.offset).toBe(6);
    expect(e.message).toMatch(/at least one trace.*found 0 traces/);
  });

  describe("errors", () => {
    const good = (traces?: WriterTrace[]) =>
      writeSeg2({
        byteOrder: "little",
        traces: traces ?? [
          { strings: ["SAMPLE_INTERVAL 0.001"], format: 1, samples: [1, 2, 3, 4] },
        ],
      });

    it("names the file descriptor id when the first bytes are wrong", () => {
      const file = good();
      file[0] = 0x12;
      file[1] = 0x34;
      const e = errorOf(() => readSeg2(file));
      expect(e.offset).toBe(0);
      expect(e.message).toBe(
        "byte 0: expected file descriptor id 0x3A55 (bytes 55 3A or 3A 55), found bytes 12 34",
      );
    });

    it("names the trace descriptor id and its offset when a trace block id is wrong", () => {
      const file = good([
        { strings: ["SAMPLE_INTERVAL 0.001"], format: 1, samples: [1], blockId: 0x1234 },
      ]);
      const pointer = new DataView(file.buffer).getUint32(32, true);
      const e = errorOf(() => readSeg2(file));
      expect(e.message).toBe(`byte ${pointer}: expected trace descriptor id 0x4422, found 0x1234`);
    });

    it("refuses a file shorter than a descriptor block", () => {
      expect(errorOf(() => readSeg2(new Uint8Array(10))).message).toMatch(
        /^byte 0: expected a 32-byte/,
      );
    });

    it("refuses a truncated data block", () => {
      const file = good();
      const e = errorOf(() => readSeg2(file.subarray(0, file.length - 1)));
      expect(e.expected).toMatch(/samples|bytes of trace data/);
    });

    it("refuses an unknown data format code", () => {
      const file = good();
      const pointer = new DataView(file.buffer).getUint32(32, true);
      file[pointer + 12] = 7;
      const e = errorOf(() => readSeg2(file));
      expect(e.offset).toBe(pointer + 12);
      expect(e.message).toContain("data format code from 1 to 5, found 7");
    });

    it("refuses a huge sample count without allocating it", () => {
      const file = good([
        {
          strings: ["SAMPLE_INTERVAL 0.001"],
          format: 5,
          samples: [1],
          declaredSamples: 0xffffffff,
        },
      ]);
      const e = errorOf(() => readSeg2(file));
      expect(e.found).toBe("4294967295 samples");
    });

    it("refuses a data block size smaller than the samples need", () => {
      const file = good([
        { strings: ["SAMPLE_INTERVAL 0.001"], format: 2, samples: [1, 2], declaredDataSize: 4 },
      ]);
      expect(errorOf(() => readSeg2(file)).expected).toMatch(
        /data block size consistent with 2 samples in format 2 \(8 bytes\)/,
      );
    });

    it("refuses a data block size larger than the samples fill", () => {
      const file = good([
        { strings: ["SAMPLE_INTERVAL 0.001"], format: 1, samples: [1, 2], declaredDataSize: 40 },
      ]);
      const e = errorOf(() => readSeg2(file));
      expect(e.message).toMatch(
        /consistent with 2 samples in format 1 \(4 bytes\), found 40 bytes/,
      );
    });

    it("refuses a sample interval that is not a number, naming the string's offset", () => {
      const file = good([{ strings: ["SAMPLE_INTERVAL abc"], format: 1, samples: [1] }]);
      const e = errorOf(() => readSeg2(file));
      expect(e.message).toMatch(
        /expected a sample interval in seconds in SAMPLE_INTERVAL, found 'abc'$/,
      );
      expect(file[e.offset + 2]).toBe("S".charCodeAt(0));
    });

    it("refuses a trace without any sample interval", () => {
      const file = good([{ strings: ["DELAY 0"], format: 1, samples: [1] }]);
      expect(errorOf(() => readSeg2(file)).expected).toBe("a SAMPLE_INTERVAL string for trace 1");
    });

    it("refuses a non-numeric receiver location", () => {
      const file = good([
        { strings: ["SAMPLE_INTERVAL 0.001", "RECEIVER_LOCATION north"], format: 1, samples: [1] },
      ]);
      expect(errorOf(() => readSeg2(file)).message).toMatch(/RECEIVER_LOCATION, found 'north'/);
    });

    it("refuses trace pointers that make two traces share bytes", () => {
      const file = writeSeg2({
        byteOrder: "big",
        traces: [
          { strings: ["SAMPLE_INTERVAL 0.001"], format: 1, samples: [1, 2] },
          { strings: ["SAMPLE_INTERVAL 0.001"], format: 1, samples: [3, 4] },
        ],
      });
      const view = new DataView(file.buffer);
      view.setUint32(36, view.getUint32(32, false), false);
      expect(errorOf(() => readSeg2(file)).expected).toMatch(/trace 2 to start after trace 1 ends/);
    });

    it("refuses a trace pointer outside the file", () => {
      const file = good();
      new DataView(file.buffer).setUint32(32, file.length + 100, true);
      const e = errorOf(() => readSeg2(file));
      expect(e.offset).toBe(32);
    });

    it("refuses a pointer sub-block too small for the number of traces", () => {
      const file = good();
      new DataView(file.buffer).setUint16(6, 3, true);
      expect(errorOf(() => readSeg2(file)).offset).toBe(4);
    });

    it("refuses a string offset running past its block", () => {
      const file = good();
      const pointer = new DataView(file.buffer).getUint32(32, true);
      new DataView(file.buffer).setUint16(pointer + 32, 4000, true);
      const e = errorOf(() => readSeg2(file));
      expect(e.offset).toBe(pointer + 32);
      expect(e.found).toBe("a string offset of 4000");
    });

    it("refuses non-finite floating-point samples", () => {
      const file = good([
        { strings: ["SAMPLE_INTERVAL 0.001"], format: 4, samples: [1, Number.NaN] },
      ]);
      expect(errorOf(() => readSeg2(file)).expected).toBe("a finite sample value (sample 2)");
    });

    it("refuses a bad string terminator size", () => {
      const file = good();
      file[8] = 3;
      expect(errorOf(() => readSeg2(file)).message).toBe(
        "byte 8: expected a string terminator size of 1 or 2, found 3",
      );
    });
  });
});
