import { afterEach, describe, expect, it } from "vitest";
import { act, render, screen, waitFor } from "@testing-library/react";
import * as Comlink from "comlink";
import { modellerApi } from "@engine";
import type { WorkerLike } from "@/lib/modeller";
import type { Plan, PlanAnalysis } from "../../lib/engine";
import { createModeller } from "@/lib/modeller";
import { setModeller, type ModellerClient } from "../../lib/modeller-client";
import { usePlanAnalysis } from "../use-plan-analysis";
import { threeLayerPlan } from "../../__tests__/fixtures";

afterEach(() => {
  setModeller(null);
});

/** A modeller whose answers arrive only when the test says so, in any order. */
function deferredModeller() {
  const pending: Array<{ plan: Plan; resolve: (a: PlanAnalysis) => void }> = [];
  const client: ModellerClient = {
    ...createModeller({ createWorker: null }),
    analyze: (plan) => new Promise((resolve) => pending.push({ plan, resolve })),
  };
  return { client, pending };
}

const fakeAnalysis = (name: string) => ({ plan: name }) as unknown as PlanAnalysis;

function Probe({ plan }: { plan: Plan | null }) {
  const state = usePlanAnalysis(plan);
  return (
    <p data-testid="probe">
      {state.result ? (state.result as unknown as { plan: string }).plan : "none"}|
      {state.current ? "current" : "not-current"}|{state.pending ? "pending" : "idle"}
    </p>
  );
}

const withName = (name: string): Plan => ({ ...threeLayerPlan(), name });

describe("usePlanAnalysis", () => {
  it("drops an answer that arrives after a newer edit was sent", async () => {
    const { client, pending } = deferredModeller();
    setModeller(client);
    const { rerender } = render(<Probe plan={withName("first")} />);
    rerender(<Probe plan={withName("second")} />);
    expect(pending.map((p) => p.plan.name)).toEqual(["first", "second"]);

    // The newer edit answers first, then the stale one arrives late.
    await act(async () => pending[1].resolve(fakeAnalysis("second")));
    expect(screen.getByTestId("probe")).toHaveTextContent("second|current|idle");
    await act(async () => pending[0].resolve(fakeAnalysis("first")));
    expect(screen.getByTestId("probe")).toHaveTextContent("second|current|idle");
  });

  it("never shows an older answer as current while the newest is still computing", async () => {
    const { client, pending } = deferredModeller();
    setModeller(client);
    const { rerender } = render(<Probe plan={withName("first")} />);
    await act(async () => pending[0].resolve(fakeAnalysis("first")));
    expect(screen.getByTestId("probe")).toHaveTextContent("first|current|idle");
    rerender(<Probe plan={withName("second")} />);
    expect(screen.getByTestId("probe")).toHaveTextContent("first|not-current|pending");
    await act(async () => pending[1].resolve(fakeAnalysis("second")));
    expect(screen.getByTestId("probe")).toHaveTextContent("second|current|idle");
  });

  it("runs nothing for an invalid form and marks the last answer as not current", async () => {
    const { client, pending } = deferredModeller();
    setModeller(client);
    const { rerender } = render(<Probe plan={withName("first")} />);
    await act(async () => pending[0].resolve(fakeAnalysis("first")));
    rerender(<Probe plan={null} />);
    expect(pending).toHaveLength(1);
    expect(screen.getByTestId("probe")).toHaveTextContent("first|not-current|idle");
  });

  it("through the worker facade, shows only the newest of a burst of edits", async () => {
    // The engine behind comlink over a MessageChannel, as in the module worker.
    const facade = createModeller({
      createWorker: (): WorkerLike => {
        const { port1, port2 } = new MessageChannel();
        Comlink.expose(modellerApi, port1);
        return Object.assign(port2, {
          terminate() {
            port1.close();
            port2.close();
          },
        });
      },
    });
    setModeller(facade);
    const seen: string[] = [];
    function Recorder({ plan }: { plan: Plan }) {
      const state = usePlanAnalysis(plan);
      if (state.result && state.current) seen.push(state.result.plan);
      return <p data-testid="rec">{state.current ? state.result?.plan : "…"}</p>;
    }
    try {
      const { rerender } = render(<Recorder plan={withName("edit 1")} />);
      rerender(<Recorder plan={withName("edit 2")} />);
      rerender(<Recorder plan={withName("edit 3")} />);
      await waitFor(() => expect(screen.getByTestId("rec")).toHaveTextContent("edit 3"), {
        timeout: 5000,
      });
      expect(new Set(seen)).toEqual(new Set(["edit 3"]));
    } finally {
      facade.dispose();
    }
  });

  it("does not ask again when the plan is re-created with the same content", async () => {
    const { client, pending } = deferredModeller();
    setModeller(client);
    const { rerender } = render(<Probe plan={withName("same")} />);
    rerender(<Probe plan={withName("same")} />);
    expect(pending).toHaveLength(1);
  });
});
