/**
 * The material picker's choices, from the engine's table of typical P-wave velocities, in the
 * user's units. The engine names the table's source; the picker shows it on screen.
 */
import { formatInput, formatQuantity, type UnitSystem } from "@/lib/units";
import { MATERIALS, MATERIALS_SOURCE } from "./engine";

export interface MaterialChoice {
  key: string;
  label: string;
  /** Middle of the range, as typed into the velocity box (display units). */
  typical: string;
  /** The range as typed into the sweep bounds (display units). */
  range: [string, string];
  rangeText: string;
  source: string;
}

/** Where the velocities come from, as the engine states it. */
export const materialsSource = MATERIALS_SOURCE;

export function materialChoices(units: UnitSystem): MaterialChoice[] {
  return MATERIALS.map((m) => {
    const lo = m.min;
    const hi = m.max;
    return {
      key: m.key,
      label: m.label,
      typical: formatInput("velocity", m.typical, units),
      range: [formatInput("velocity", lo, units), formatInput("velocity", hi, units)],
      rangeText: `${formatQuantity("velocity", lo, units)}–${formatQuantity("velocity", hi, units)}`,
      source: MATERIALS_SOURCE,
    };
  });
}
