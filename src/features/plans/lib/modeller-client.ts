/**
 * The plans feature's door to the modeller facade (src/lib/modeller.ts): every engine
 * computation the designer shows runs through it, off the main thread, with stale answers
 * discarded. Tests may substitute it.
 *
 * The facade lets only the newest request of each kind finish. The designer's live views use
 * the application's shared modeller; Side by side, which asks several questions of one kind
 * at once, gets its own instance and asks them one after another.
 */
import { createModeller, getModeller, isModellerCancelled, type Modeller } from "@/lib/modeller";

export type ModellerClient = Pick<
  Modeller,
  | "analyze"
  | "arrivals"
  | "curves"
  | "rayPath"
  | "sweep"
  | "sectionField"
  | "sectionSweep"
  | "sectionReading"
>;

let override: ModellerClient | null = null;

/** The shared modeller (or the test's substitute). */
export const modeller = (): ModellerClient => override ?? getModeller();

/** A modeller of one's own (its own workers), disposed by the caller; the substitute in tests. */
export function privateModeller(): { client: ModellerClient; dispose: () => void } {
  if (override) return { client: override, dispose: () => {} };
  const own = createModeller();
  return { client: own, dispose: () => own.dispose() };
}

/** Start the shared modeller's worker early (the designer does so while the plan loads). */
export function warmModeller(): void {
  if (!override) getModeller().warm();
}

/** Substitute the modeller (tests); null restores the real one. */
export function setModeller(next: ModellerClient | null): void {
  override = next;
}

/** A request that ended because a newer one (or a cancel) replaced it: not a failure. */
export const isSuperseded = isModellerCancelled;
