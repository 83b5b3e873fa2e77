/** How the values of a revision diff read on screen: each field in its own unit. */
import type { DiffValue, Verdict } from "@/contracts/plans";
import { formatQuantity, type Quantity, type UnitSystem } from "@/lib/units";

const FIELD_QUANTITY: Record<string, Quantity> = {
  velocity: "velocity",
  thickness: "length",
  spacing: "length",
  firstGeophone: "length",
  position: "length",
  depthTolerance: "length",
  dip: "angle",
  pickError: "time",
  channels: "count",
  minGeophones: "count",
};

const FIELD_LABELS: Record<string, string> = {
  velocity: "velocity",
  thickness: "thickness",
  dip: "dip",
  name: "name",
  material: "material",
  velocityRange: "velocity range",
  thicknessRange: "thickness range",
  spacing: "geophone spacing",
  channels: "channels",
  firstGeophone: "first geophone",
  minGeophones: "minimum geophones per segment",
  pickError: "pick error",
  depthTolerance: "depth tolerance",
};

/** A readable name for a diff field ("firstGeophone" → "first geophone"). */
export function fieldLabel(field: string): string {
  return FIELD_LABELS[field] ?? field.replace(/([a-z])([A-Z])/g, "$1 $2").toLowerCase();
}

/** A diff value in the user's units; "—" for absent, "half-space" for a missing thickness. */
export function formatDiffValue(field: string, value: DiffValue, units: UnitSystem): string {
  if (value === null) return field === "thickness" ? "half-space" : "—";
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (typeof value === "number") {
    const quantity = FIELD_QUANTITY[field];
    if (!quantity) return String(value);
    const digits = quantity === "count" ? 0 : undefined;
    return formatQuantity(quantity, value, units, digits);
  }
  return value === "" ? "(empty)" : value;
}

const ORDER: Record<Verdict, number> = { resolved: 0, "under-sampled": 1, blind: 2, inverted: 3 };

/** Did a verdict get worse, better, or neither (appearing or disappearing refractors)? */
export function verdictTrend(
  from: Verdict | null,
  to: Verdict | null,
): "worse" | "better" | "same" {
  if (from === null || to === null) return "same";
  return ORDER[to] > ORDER[from] ? "worse" : ORDER[to] < ORDER[from] ? "better" : "same";
}
