// Fuzzed SEG-2 input: seeded random truncations and byte flips of files from the independent
// writer. Every case must either parse into a well-formed record or fail with a Seg2Error.
import { describe, expect, it } from "vitest";
import { readSeg2 } from "./seg2-reader";
import { Seg2Error } from "./seg2-error";
import { seededNormal, seededRandom } from "./__fixtures__/random";
import { writeSeg2, type WriterFormat } from "./__fixtures__/seg2-writer";

function baseFiles(): Uint8Array[] {
  const noise = seededNormal(11);
  const files: Uint8Array[] = [];
  for (const byteOrder of ["little", "big"] as const) {
    for (const format of [1, 2, 3, 4, 5] as WriterFormat[]) {
      files.push(
        writeSeg2({
          byteOrder,
          fileStrings: ["ACQUISITION_DATE 12/MAR/2025", "NOTE pilot shot\nline 2"],
          traces: [0, 1, 2].map((k) => ({
            strings: [
              "SAMPLE_INTERVAL 0.00025",
              "DELAY 0",
              `RECEIVER_LOCATION ${k * 2}`,
              "SOURCE_LOCATION -1",
              `CHANNEL_NUMBER ${k + 1}`,
            ],
            format,
            samples: Array.from({ length: 24 }, () => Math.round(noise() * 1000)),
          })),
        }),
      );
    }
  }
  return files;
}

describe("readSeg2 on fuzzed input", () => {
  it("returns a record or throws a Seg2Error for 300 truncated or flipped files", () => {
    const random = seededRandom(20250412);
    const files = baseFiles();
    let parsed = 0;
    let refused = 0;
    for (let c = 0; c < 300; c++) {
      const base = files[Math.floor(random() * files.length)];
      let file = base.slice();
      const mode = random();
      if (mode < 0.4 || mode >= 0.8) file = file.slice(0, Math.floor(random() * file.length));
      if (mode >= 0.4) {
        const flips = 1 + Math.floor(random() * 4);
        for (let f = 0; f < flips && file.length > 0; f++) {
          const at = Math.floor(random() * Math.min(file.length, 400));
          file[at] ^= 1 << Math.floor(random() * 8);
        }
      }
      try {
        const record = readSeg2(file);
        parsed++;
        let total = 0;
        for (const trace of record.traces) {
          expect(trace.sampleInterval).toBeGreaterThan(0);
          expect(Number.isFinite(trace.delay)).toBe(true);
          total += trace.samples.length;
          for (const v of trace.samples) expect(Number.isFinite(v)).toBe(true);
        }
        expect(total).toBeLessThanOrEqual(file.length);
      } catch (e) {
        if (!(e instanceof Seg2Error)) throw new Error(`case ${c}: ${String(e)}`);
        expect(e.message).toMatch(/^byte \d+: expected /);
        expect(e.offset).toBeGreaterThanOrEqual(0);
        refused++;
      }
    }
    // Both outcomes occur, so the fuzzing reaches past the first checks.
    expect(parsed).toBeGreaterThan(0);
    expect(refused).toBeGreaterThan(0);
  });
});
