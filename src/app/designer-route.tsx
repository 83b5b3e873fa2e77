/**
 * The designer route's element (loaded with the designer's own chunk, see router.tsx): the plan
 * designer with what it borrows from the Review feature.
 */
import { AnchorComments, useAnchorThreadCounts } from "@/features/review";
import { PlanDesignerPage } from "@/features/plans/components/designer/plan-designer-page";
import { DesignerSlotsProvider, type DesignerSlots } from "@/features/plans/designer-slots";

/** What the designer borrows from the Review feature: the threads beside a layer, refractor or shot. */
export const designerSlots: DesignerSlots = {
  renderAnchorComments: (planId, anchor) => <AnchorComments planId={planId} anchor={anchor} />,
  useAnchorCounts: useAnchorThreadCounts,
};

export function DesignerRoute() {
  return (
    <DesignerSlotsProvider slots={designerSlots}>
      <PlanDesignerPage />
    </DesignerSlotsProvider>
  );
}
