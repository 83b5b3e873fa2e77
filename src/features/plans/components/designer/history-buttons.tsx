import { memo } from "react";
import type { FieldValues } from "react-hook-form";
import { Button } from "@/components/button";
import { useHistoryState, type PlanHistory } from "../../hooks/use-plan-history";

/** Undo and Redo for the designer's edits since load (keys: Ctrl+Z, Ctrl+Shift+Z or Ctrl+Y). */
export const HistoryButtons = memo(function HistoryButtons({
  history,
}: {
  history: PlanHistory<FieldValues>;
}) {
  const { canUndo, canRedo } = useHistoryState(history);
  return (
    <div className="flex gap-1" role="group" aria-label="Edit history">
      <Button
        variant="quiet"
        className="px-2.5! py-1! text-xs! max-sm:py-2.5!"
        disabled={!canUndo}
        title="Undo the last edit (Ctrl+Z)"
        onClick={() => history.undo()}
      >
        ↶ Undo
      </Button>
      <Button
        variant="quiet"
        className="px-2.5! py-1! text-xs! max-sm:py-2.5!"
        disabled={!canRedo}
        title="Redo (Ctrl+Shift+Z or Ctrl+Y)"
        onClick={() => history.redo()}
      >
        ↷ Redo
      </Button>
    </div>
  );
});
