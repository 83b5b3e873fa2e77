/**
 * What the app lends the designer from other features. Features never import each other: the
 * app fills these slots (src/app/router.tsx) and the designer shows whatever it is given, or
 * nothing when no provider is present (component tests of the designer alone).
 */
import { createContext, useContext, type ReactNode } from "react";
import type { CommentAnchor } from "@/contracts/plans";

/** Threads at one place in the plan: still open, and resolved. */
export interface AnchorThreadCount {
  open: number;
  resolved: number;
}

export interface DesignerSlots {
  /**
   * The comment threads anchored at `anchor` (a layer, a refractor or a shot of the saved
   * plan), with replies and a form for a new comment there where the user's role may comment.
   */
  renderAnchorComments: (planId: string, anchor: CommentAnchor) => ReactNode;
  /**
   * A React hook (every comment chip calls it on each render, so pass the same function for
   * the whole session): a lookup of thread counts per anchor, or `null` while the comments
   * load or when they cannot be loaded.
   */
  useAnchorCounts: (planId: string) => ((anchor: CommentAnchor) => AnchorThreadCount) | null;
}

const SlotsContext = createContext<DesignerSlots | null>(null);

/** Lends the designer below it what other features provide. */
export function DesignerSlotsProvider({
  slots,
  children,
}: {
  slots: DesignerSlots;
  children: ReactNode;
}) {
  return <SlotsContext value={slots}>{children}</SlotsContext>;
}

/** The slots the app filled, or `null` when the designer runs without them. */
export function useDesignerSlots(): DesignerSlots | null {
  return useContext(SlotsContext);
}
