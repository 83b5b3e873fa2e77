import * as Comlink from "comlink";
import { afterEach, describe, expect, it } from "vitest";
import {
  analyzePlan,
  layeredModel,
  modellerApi,
  parsePlan,
  type Plan,
  type SweepSpec,
} from "@engine";
import { createModeller, isModellerCancelled, type Modeller, type WorkerLike } from "./modeller";
import simple from "../../docs/examples/two-layer-simple.json";
import blind from "../../docs/examples/thin-blind-layer.json";

function plan(input: unknown): Plan {
  const r = parsePlan(input);
  if (!r.ok) throw new Error(r.issues.join("\n"));
  return r.plan;
}

const bigSweep: SweepSpec = {
  modelIndex: 0,
  axis: "spacing",
  min: 0.5,
  max: 5,
  steps: 60,
  parameter: { layer: 1, kind: "thickness", min: 1, max: 20, steps: 120 },
};

/** A stand-in for the module worker: the engine exposed over a MessageChannel, as in the worker. */
function fakeWorkerFactory() {
  const made: { terminated: boolean }[] = [];
  const factory = (): WorkerLike => {
    const { port1, port2 } = new MessageChannel();
    Comlink.expose(modellerApi, port1);
    const state = { terminated: false };
    made.push(state);
    return Object.assign(port2, {
      terminate() {
        state.terminated = true;
        port1.close();
        port2.close();
      },
    });
  };
  return { factory, made };
}

const modellers: Modeller[] = [];
function track(m: Modeller): Modeller {
  modellers.push(m);
  return m;
}
afterEach(() => {
  for (const m of modellers.splice(0)) m.dispose();
});

describe("modeller facade without a Worker (jsdom)", () => {
  it("runs the engine directly and gives the engine's numbers", async () => {
    expect(typeof Worker).toBe("undefined");
    const m = track(createModeller());
    const p = plan(blind);
    expect(await m.analyze(p)).toEqual(analyzePlan(p));
  });

  it("discards a stale analysis when a newer one is requested", async () => {
    const m = track(createModeller());
    const first = m.analyze(plan(simple));
    const second = m.analyze(plan(blind));
    await expect(first).rejects.toSatisfy(isModellerCancelled);
    expect((await second).plan).toBe("Coldwater Lane footbridge, east abutment");
  });

  it("reports sweep progress and returns the grid", async () => {
    const m = track(createModeller());
    const seen: number[] = [];
    const r = await m.sweep(
      plan(simple),
      { ...bigSweep, steps: 5, parameter: { ...bigSweep.parameter, steps: 9 } },
      {
        onProgress: (f) => seen.push(f),
      },
    );
    expect(r.rows * r.cols).toBe(45);
    expect(seen.at(-1)).toBe(1);
    expect(seen.every((f, i) => i === 0 || f > seen[i - 1])).toBe(true);
  });

  it("cancels a running sweep through its AbortSignal", async () => {
    const m = track(createModeller({ rowsPerSlice: 1 }));
    const controller = new AbortController();
    let calls = 0;
    const run = m.sweep(plan(simple), bigSweep, {
      signal: controller.signal,
      onProgress: () => {
        if (++calls === 3) controller.abort();
      },
    });
    await expect(run).rejects.toMatchObject({
      name: "ModellerCancelledError",
      reason: "cancelled",
    });
    expect(calls).toBeLessThan(10);
  });

  it("lets a new sweep supersede a running one", async () => {
    const m = track(createModeller({ rowsPerSlice: 1 }));
    const old = m.sweep(plan(simple), bigSweep);
    const fresh = m.sweep(plan(simple), {
      ...bigSweep,
      steps: 2,
      parameter: { ...bigSweep.parameter, steps: 2 },
    });
    await expect(old).rejects.toMatchObject({ reason: "superseded" });
    expect((await fresh).status).toHaveLength(4);
  });

  it("passes engine errors through", async () => {
    const m = track(createModeller());
    await expect(
      m.arrivals({ name: "x", layers: [{ velocity: 500 }] }, plan(simple).spread, 9),
    ).rejects.toThrow(RangeError);
  });
});

describe("modeller facade with a worker", () => {
  it("gives the same analysis through the worker as on this thread", async () => {
    const { factory } = fakeWorkerFactory();
    const m = track(createModeller({ createWorker: factory }));
    const p = plan(blind);
    expect(await m.analyze(p)).toEqual(analyzePlan(p));
    const curves = await m.curves(layeredModel(p.models[0]), -1, 0, 60, 31);
    expect(Object.prototype.toString.call(curves.first.times)).toBe("[object Float64Array]");
    expect(curves.first.times).toHaveLength(31);
  });

  it("streams progress through a comlink proxy", async () => {
    const { factory } = fakeWorkerFactory();
    const m = track(createModeller({ createWorker: factory }));
    const seen: number[] = [];
    const r = await m.sweep(
      plan(simple),
      { ...bigSweep, steps: 4, parameter: { ...bigSweep.parameter, steps: 6 } },
      {
        onProgress: (f) => seen.push(f),
      },
    );
    expect(r.status).toHaveLength(24);
    await new Promise((resolve) => setTimeout(resolve, 20));
    expect(seen.at(-1)).toBe(1);
  });

  it("cancels a sweep by ending its worker, and later sweeps start a fresh one", async () => {
    const { factory, made } = fakeWorkerFactory();
    const m = track(createModeller({ createWorker: factory }));
    const run = m.sweep(plan(simple), bigSweep);
    m.cancelSweep();
    await expect(run).rejects.toMatchObject({ reason: "cancelled" });
    expect(made.some((w) => w.terminated)).toBe(true);
    const again = await m.sweep(plan(simple), {
      ...bigSweep,
      steps: 2,
      parameter: { ...bigSweep.parameter, steps: 3 },
    });
    expect(again.status).toHaveLength(6);
  });

  it("discards a stale worker result", async () => {
    const { factory } = fakeWorkerFactory();
    const m = track(createModeller({ createWorker: factory }));
    const first = m.analyze(plan(simple));
    const second = m.analyze(plan(blind));
    await expect(first).rejects.toMatchObject({ reason: "superseded" });
    expect((await second).models).toHaveLength(2);
  });
});
