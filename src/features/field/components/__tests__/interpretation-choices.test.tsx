import { afterEach, describe, expect, it, vi } from "vitest";
import { act, fireEvent, render, screen } from "@testing-library/react";
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import type { InterpretationChoices, PickSetView } from "@/contracts/field";
import { stubFetch } from "@/testing/render";
import { fieldKeys } from "../../api/field-keys";
import { InterpretationPanel } from "../interpretation-panel";

// The "Under the line" card restores the choices saved with the picks and keeps new ones.
// The interpretation itself is the field worker's (tested there): here it is a stub that
// records what it was asked.
const interpret = vi.fn((..._args: unknown[]) => new Promise<never>(() => undefined));
vi.mock("../../lib/field-worker", () => ({
  fieldWorker: () => ({ interpret: (...args: unknown[]) => interpret(...args) }),
}));

const planId = "22222222-2222-4222-8222-222222222222";
const stored: InterpretationChoices = {
  method: "grm",
  xy: 4,
  datum: -3,
  assignments: [
    { shot: -1, layer: 1, from: 0, to: 10 },
    { shot: -1, layer: 2, from: 12, to: 46 },
  ],
  elevations: null,
};
const pickSet = (interpretation: InterpretationChoices | null): PickSetView => ({
  planId,
  revision: 3,
  picks: [{ sourcePosition: -1, receiverPosition: 0, time: 0.002, origin: "auto" }],
  attachmentId: null,
  picker: "sta-lta",
  interpretation,
  updatedBy: { id: "00000000-0000-4000-8000-000000000001", name: "Test Lead" },
  updatedAt: "2026-11-02T10:00:00.000Z",
});

function renderPanel(view: PickSetView, units: "metric" | "imperial" = "metric") {
  const queryClient = new QueryClient({
    defaultOptions: { queries: { retry: false, staleTime: Infinity }, mutations: { retry: false } },
  });
  queryClient.setQueryData(fieldKeys.picks(planId), view);
  render(
    <QueryClientProvider client={queryClient}>
      <InterpretationPanel
        planId={planId}
        canSave
        picks={view.picks}
        models={[]}
        candidates={[]}
        pickError={0.0005}
        units={units}
      />
    </QueryClientProvider>,
  );
  return queryClient;
}

afterEach(() => {
  interpret.mockClear();
  vi.useRealTimers();
});

describe("InterpretationPanel choices", () => {
  it("restores the saved method, XY, datum and assignment and interprets with them", () => {
    stubFetch({});
    renderPanel(pickSet(stored));
    expect(screen.getByLabelText("Method")).toHaveValue("grm");
    expect(screen.getByLabelText("XY distance (m)")).toHaveValue("4");
    expect(screen.getByLabelText("Datum elevation (m)")).toHaveValue("-3");
    expect(screen.getByLabelText("Segment 2 layer")).toHaveValue("2");
    expect(screen.getByText("Your assignment.", { exact: false })).toBeInTheDocument();
    const options = interpret.mock.calls.at(-1)?.[2];
    expect(options).toMatchObject({
      method: "grm",
      xy: 4,
      datum: -3,
      assignments: stored.assignments,
    });
    expect(screen.getByRole("status")).toHaveTextContent("kept with the picks");
    // The CSV that follows these choices is one click away.
    expect(
      screen.getByRole("link", { name: "Download the interpreted section (CSV)" }),
    ).toHaveAttribute("href", `/api/plans/${planId}/interpretation.csv`);
  });

  it("shows the saved metres in feet (1 ft = 0.3048 m) and does not save them back unchanged", async () => {
    vi.useFakeTimers();
    const calls = stubFetch({});
    renderPanel(pickSet({ method: "grm", xy: 3.048, datum: -2 }), "imperial");
    expect(screen.getByLabelText("XY distance (ft)")).toHaveValue("10");
    // −2 m is −6.5617 ft, shown to 0.01 ft; reading it back would move the datum by 0.5 mm
    expect(screen.getByLabelText("Datum elevation (ft)")).toHaveValue("-6.56");
    await act(async () => {
      vi.advanceTimersByTime(2000);
    });
    expect(calls).toHaveLength(0);
  });

  it("keeps a changed choice with the picks a moment later, and nothing before", async () => {
    vi.useFakeTimers();
    const calls = stubFetch({
      [`PUT /api/plans/${planId}/picks/interpretation`]: (body) => ({
        status: 200,
        body: pickSet((body as { interpretation: InterpretationChoices }).interpretation),
      }),
    });
    renderPanel(pickSet(null));
    expect(screen.getByLabelText("Method")).toHaveValue("plus-minus");
    fireEvent.change(screen.getByLabelText("Method"), { target: { value: "delay-time" } });
    await act(async () => {
      vi.advanceTimersByTime(300);
    });
    expect(calls).toHaveLength(0);
    await act(async () => {
      vi.advanceTimersByTime(500);
    });
    expect(calls).toHaveLength(1);
    expect(calls[0].body).toEqual({
      interpretation: {
        method: "delay-time",
        datum: null,
        xy: null,
        assignments: null,
        elevations: null,
      },
    });
  });
});
