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

  it("answers the Field check's questions with plain data that survives a structured clone", () => {
    // Two flat layers, 5 m of 500 m/s over 2500 m/s (invented). Head-wave time from the
    // textbook closed form (Telford, Geldart & Sheriff 1990 §4.3): t = x/v2 + 2h·cos θ/v1.
    const model = {
      name: "flat",
      layers: [{ velocity: 500, thickness: 5 }, { velocity: 2500 }],
    };
    const head = (x: number) => x / 2500 + (2 * 5 * Math.sqrt(1 - (500 / 2500) ** 2)) / 500;
    const picks = [10, 20, 30, 40].map((x) => ({
      sourcePosition: 0,
      receiverPosition: x,
      time: Math.min(x / 500, head(x)),
    }));
    const c = structuredClone(
      field.fieldApi.compareCandidates(picks, [{ name: "flat", model }], null, 0.0005),
    );
    expect(c.best).toBe(0);
    expect(c.fits[0].rms).toBeCloseTo(0, 9);
    const times = structuredClone(field.fieldApi.modelledTimes(model, [[0, 40]]));
    expect(times[0]).toBeCloseTo(head(40), 9);
    // The interface of a flat model lies at its top layer's thickness everywhere.
    const depths = structuredClone(field.fieldApi.candidateDepths([model], 2, [0, 25, 50]));
    expect(depths).toEqual([[5, 5, 5]]);
    expect(field.fieldApi.candidateDepths([model], 3, [0])).toEqual([[null]]);
  });
});
