import { describe, expect, it } from "vitest";
import { render, screen } from "@testing-library/react";
import { AnchorChip } from "../badges";

describe("AnchorChip", () => {
  it("shows a long place in full, wrapping instead of cutting it off, in the sans face", () => {
    const label =
      "Layer 2 · water-bearing sand lens under the stiff till (Sand lens under stiff till)";
    render(<AnchorChip kind="layer" label={label} />);
    const chip = screen.getByTitle(label);
    expect(chip).toHaveTextContent(label);
    expect(chip.className).not.toMatch(/\btruncate\b/);
    expect(chip.className).not.toMatch(/\bfont-mono\b/);
    expect(chip.className).toMatch(/\bbreak-words\b/);
  });
});
