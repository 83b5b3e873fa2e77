import type { ReactElement } from "react";
import { describe, expect, it, vi } from "vitest";
import { screen, waitFor } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { renderWithApp, stubFetch, testMe } from "@/testing/render";
import { ApplyChoicesPanel } from "../apply-choices-panel";

/** The panel reads the team's seismograph channel count (48 here); an admin may change it. */
function renderPanel(panel: ReactElement, role: "admin" | "lead" = "admin") {
  stubFetch({
    "GET /api/team/settings": () => ({ status: 200, body: { seismographChannels: 48 } }),
    "PATCH /api/team/settings": (body) => ({ status: 200, body }),
  });
  return renderWithApp(panel, { me: testMe({ role }) });
}

const spread = {
  spacing: 3,
  channels: 24,
  firstGeophone: 0,
  shots: [
    { position: -1.5, anchor: { to: "start" as const, offset: -1.5 } },
    { position: 70.5, anchor: { to: "end" as const, offset: 1.5 } },
  ],
};

describe("ApplyChoicesPanel", () => {
  it("offers three ways with their consequences and applies the one chosen", async () => {
    const onApply = vi.fn();
    renderPanel(
      <ApplyChoicesPanel
        spread={spread}
        recommendation={{ maxSpacing: 5, spreadLength: 100 }}
        units="metric"
        current
        onApply={onApply}
      />,
    );
    // 100 m at 3 m = 34 intervals (33.3 rounded up) = 35 channels (by hand).
    const keep = await screen.findByRole("button", {
      name: /^Keep spacing \(add channels\): 3\.00 m × 35/,
    });
    expect(keep).toHaveAccessibleDescription(
      "11 more channels: 35 at 3.00 m span 102.00 m (100.00 m needed).",
    );
    expect(
      screen.getByRole("button", { name: /^Keep spread length: 3\.00 m × 24/ }),
    ).toBeDisabled();
    await userEvent.click(keep);
    // The end shot follows: 34 × 3 + 1.5 = 103.5 m.
    // One spread: any roll-along is removed (rollAlong null).
    expect(onApply).toHaveBeenCalledWith({
      spacing: 3,
      channels: 35,
      shots: [-1.5, 103.5],
      rollAlong: null,
    });
  });

  it("flags more channels than the team's seismograph and takes a new channel count", async () => {
    renderPanel(
      <ApplyChoicesPanel
        spread={spread}
        recommendation={{ maxSpacing: 5, spreadLength: 200 }}
        units="metric"
        current
        onApply={() => {}}
      />,
    );
    // 200 m at 3 m → 68 channels, more than 48 (common practice default).
    expect(
      (await screen.findAllByText(/68 channels is more than the seismograph's 48/))[0],
    ).toBeVisible();
    const box = screen.getByLabelText("Seismograph channels (team setting)");
    await userEvent.clear(box);
    await userEvent.type(box, "96");
    await waitFor(() => expect(screen.queryByText(/more than the seismograph/)).toBeNull());
  });

  it("shows a lead the team's count as text, with no box to change it", async () => {
    renderPanel(
      <ApplyChoicesPanel
        spread={spread}
        recommendation={{ maxSpacing: 5, spreadLength: 200 }}
        units="metric"
        current
        onApply={() => {}}
      />,
      "lead",
    );
    expect(await screen.findByText(/The team’s seismograph records 48 channels/)).toBeVisible();
    expect(screen.queryByLabelText(/^Seismograph channels/)).toBeNull();
  });

  it("offers an option beyond the seismograph as roll-along and applies it", async () => {
    localStorage.clear();
    const onApply = vi.fn();
    renderPanel(
      <ApplyChoicesPanel
        spread={spread}
        recommendation={{ maxSpacing: 5, spreadLength: 405 }}
        units="metric"
        current
        onApply={onApply}
      />,
    );
    // 405 m at 3 m → 136 channels; on 48: 3 spreads sharing 2 (default) = 140 stations over
    // 417 m (by hand).
    const roll = await screen.findByRole("button", {
      name: /^Keep spacing \(add channels\), as roll-along: 3\.00 m × 3 spreads of 48$/,
    });
    expect(roll).toHaveAccessibleDescription(
      /^3 spreads of 48 channels, overlapping by 2, 140 stations over 417\.00 m\./,
    );
    await userEvent.click(roll);
    expect(onApply).toHaveBeenCalledWith({
      spacing: 3,
      channels: 48,
      shots: [-1.5, 142.5],
      rollAlong: { spreads: 3, overlap: 2 },
    });
  });
});
