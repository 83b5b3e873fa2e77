// The worker API returns plain data that survives the structured clone a worker message uses.
import { describe, expect, it } from "vitest";
import * as field from "./index";
import { writeSeg2 } from "./__fixtures__/seg2-writer";
import { syntheticTrace } from "./__fixtures__/synthetic-trace";

describe("fieldApi", () => {
  it("reads a record and picks it, with results that survive a structured clone", () => {
    const tr = syntheticTrace({ seed: 4, snr: 20, onset: 0.05 });
    const file = writeSeg2({
      byteOrder: "little",
      traces: [
        {
          strings: [
            "SAMPLE_INTERVAL 0.00025",
            "RECEIVER_LOCATION 10",
            "SOURCE_LOCATION 0",
            "CHANNEL_NUMBER 1",
          ],
          format: 4,
          samples: tr.samples,
        },
      ],
    });
    const record = structuredClone(field.fieldApi.readSeg2(file));
    expect(record.traces[0].samples).toBeInstanceOf(Float32Array);
    const picks = structuredClone(
      field.fieldApi.pickRecord(record, { method: "sta-lta", options: { refine: "aic" } }),
    );
    expect(picks).toHaveLength(1);
    expect(picks[0]).toMatchObject({ channel: 1, receiverPosition: 10, sourcePosition: 0 });
    expect(Math.abs((picks[0].time ?? Number.NaN) - 0.05)).toBeLessThanOrEqual(0.002);
  });

  it("offers the reader's error type from the index", () => {
    expect(() => field.readSeg2(new Uint8Array(40))).toThrow(field.Seg2Error);
  });
});
