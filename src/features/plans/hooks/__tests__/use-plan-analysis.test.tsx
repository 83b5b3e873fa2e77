import { afterEach, describe, expect, it } from "vitest";
import { act, render, screen } from "@testing-library/react";
import type { Plan, PlanAnalysis } from "../../lib/engine";
import { directModeller, setModeller, type ModellerClient } from "../../lib/modeller-client";
import { usePlanAnalysis } from "../use-plan-analysis";
import { threeLayerPlan } from "../../__tests__/fixtures";

afterEach(() => {
  setModeller(directModeller);
});

/** A modeller whose answers arrive only when the test says so, in any order. */
function deferredModeller() {
  const pending: Array<{ plan: Plan; resolve: (a: PlanAnalysis) => void }> = [];
  const client: ModellerClient = {
    ...directModeller,
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

  it("does not ask again when the plan is re-created with the same content", async () => {
    const { client, pending } = deferredModeller();
    setModeller(client);
    const { rerender } = render(<Probe plan={withName("same")} />);
    rerender(<Probe plan={withName("same")} />);
    expect(pending).toHaveLength(1);
  });
});
