import type { ReactNode } from "react";
import { Link, useParams } from "react-router-dom";
import { paths } from "./paths";

/** A plan id as the server issues it (a UUID); anything else cannot name a plan. */
const PLAN_ID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** True when `id` has the shape of a plan id. */
export const isPlanId = (id: string | undefined): boolean => !!id && PLAN_ID.test(id);

/**
 * Guards the plan pages (designer, review, field check): a link whose `:planId` cannot be a plan
 * id says so in plain words and offers the way back, never a "Try again" that cannot help.
 */
export function PlanLinkGuard({ children }: { children: ReactNode }) {
  const { planId } = useParams();
  if (isPlanId(planId)) return <>{children}</>;
  return <NotALink what="plan" />;
}

/** The same guard for a site's page (`:siteId`): site ids are UUIDs too. */
export function SiteLinkGuard({ children }: { children: ReactNode }) {
  const { siteId } = useParams();
  if (isPlanId(siteId)) return <>{children}</>;
  return <NotALink what="site" />;
}

function NotALink({ what }: { what: "plan" | "site" }) {
  return (
    <div className="flex max-w-2xl flex-col gap-3">
      <div
        role="alert"
        className="rounded-md border border-brick/40 bg-brick-soft px-4 py-3 text-sm text-brick"
      >
        <p className="font-semibold">This {what} link is not valid</p>
        <p className="mt-0.5">
          {what === "plan"
            ? "The address does not name a plan; it may have been cut short when it was copied. Open the plan from its site instead."
            : "The address does not name a site; it may have been cut short when it was copied. Open the site from the list instead."}
        </p>
      </div>
      <Link to={paths.sites} className="text-sm text-ink underline">
        Back to Sites
      </Link>
    </div>
  );
}
