import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import * as Comlink from "comlink";
import { afterEach, describe, expect, it } from "vitest";
import { modellerApi, type ModellerApi } from "./worker-api";
import { analyzePlan } from "./analysis";
import { parsePlan } from "./validate";

const examples = fileURLToPath(new URL("../../docs/examples/", import.meta.url));
const ports: MessagePort[] = [];

function connect(): Comlink.Remote<ModellerApi> {
  const { port1, port2 } = new MessageChannel();
  ports.push(port1, port2);
  Comlink.expose(modellerApi, port1);
  return Comlink.wrap<ModellerApi>(port2);
}

afterEach(() => {
  for (const p of ports.splice(0)) p.close();
});

describe("modeller API over a message channel (as in the worker)", () => {
  it("returns the same analysis as a direct call", async () => {
    const remote = connect();
    const raw = JSON.parse(readFileSync(examples + "thin-blind-layer.json", "utf8"));
    const parsed = await remote.parsePlan(raw);
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    const viaChannel = await remote.analyzePlan(parsed.plan);
    const direct = parsePlan(raw);
    if (!direct.ok) throw new Error("example does not parse");
    expect(viaChannel).toEqual(analyzePlan(direct.plan));
  });

  it("streams sweep progress through a proxied callback", async () => {
    const remote = connect();
    const parsed = parsePlan(JSON.parse(readFileSync(examples + "two-layer-simple.json", "utf8")));
    if (!parsed.ok) throw new Error("example does not parse");
    const seen: number[] = [];
    const result = await remote.runSweep(
      parsed.plan,
      {
        modelIndex: 0,
        axis: "spacing",
        min: 1,
        max: 4,
        steps: 4,
        parameter: { layer: 1, kind: "thickness", min: 2, max: 10, steps: 5 },
      },
      Comlink.proxy((f: number) => {
        seen.push(f);
      }),
    );
    expect(result.status).toBeInstanceOf(Uint8Array);
    expect(result.status).toHaveLength(20);
    await new Promise((r) => setTimeout(r, 20));
    expect(seen.at(-1)).toBe(1);
  });

  it("passes engine errors back as rejections", async () => {
    const remote = connect();
    await expect(
      remote.computeArrivals(
        { layers: [{ velocity: 500 }] },
        { spacing: 1, channels: 2, firstGeophone: 0, shots: [] },
        3,
      ),
    ).rejects.toThrow(/no shot 3/);
  });
});
