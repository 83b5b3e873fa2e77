/**
 * What the app lends the Review screen from other features (features never import each other):
 * the designer's charts, drawn read-only for the revision under review. Without a provider
 * (component tests of the Review screen alone) the screen shows tables only.
 */
import { createContext, useContext, type ReactNode } from "react";
import type { Plan } from "@engine";
import type { UnitSystem } from "@/lib/units";

export interface ReviewSlots {
  /** Charts of `document` (the revision under review), read-only, in the user's units. */
  renderCharts: (document: Plan, units: UnitSystem) => ReactNode;
}

const SlotsContext = createContext<ReviewSlots | null>(null);

/** Lends the Review screen below it what other features provide. */
export function ReviewSlotsProvider({
  slots,
  children,
}: {
  slots: ReviewSlots;
  children: ReactNode;
}) {
  return <SlotsContext value={slots}>{children}</SlotsContext>;
}

/** The slots the app filled, or `null` when the Review screen runs without them. */
export function useReviewSlots(): ReviewSlots | null {
  return useContext(SlotsContext);
}
