import { useNavigate, useParams } from "react-router-dom";
import { SitePage } from "@/features/sites/components/site-page";
import { PlansList } from "@/features/plans/components/plans-list";
import { ImportPlanButton } from "@/features/field";
import { paths } from "./paths";

/** A site with its plans; plans can also be imported from a plan JSON file (docs/plan-format.md). */
export function SiteRoute() {
  const { siteId = "" } = useParams();
  const navigate = useNavigate();
  return (
    <SitePage>
      <PlansList
        siteId={siteId}
        extraActions={
          <ImportPlanButton siteId={siteId} onImported={(plan) => navigate(paths.plan(plan.id))} />
        }
      />
    </SitePage>
  );
}
