import { useId } from "react";
import type { UnitSystem } from "@/lib/units";
import { materialChoices, type MaterialChoice } from "../../lib/materials";

/**
 * Pick a near-surface material: fills the layer's velocity with the middle of the table's
 * range and its sweep bounds with the range itself (in the user's units). The table's source
 * is named under the layers table (see MaterialSourceNote).
 */
export function MaterialPicker({
  layerNumber,
  value,
  units,
  onPick,
}: {
  layerNumber: number;
  value: string;
  units: UnitSystem;
  onPick: (choice: MaterialChoice) => void;
}) {
  const id = useId();
  const choices = materialChoices(units);
  if (choices.length === 0) return null;
  return (
    <div className="flex items-center gap-1">
      <label htmlFor={id} className="sr-only">
        Layer {layerNumber} material
      </label>
      <select
        id={id}
        value={choices.some((c) => c.key === value) ? value : ""}
        onChange={(e) => {
          const choice = choices.find((c) => c.key === e.target.value);
          if (choice) onPick(choice);
        }}
        className="field-input px-1.5! py-0.5! text-xs!"
      >
        <option value="">Material…</option>
        {choices.map((c) => (
          <option key={c.key} value={c.key}>
            {c.label} ({c.rangeText})
          </option>
        ))}
      </select>
    </div>
  );
}

export function MaterialSourceNote() {
  const choices = materialChoices("metric");
  if (choices.length === 0) return null;
  return <p className="mt-2 text-xs text-ink-soft">Material velocities: {choices[0].source}</p>;
}
