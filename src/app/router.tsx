import { createBrowserRouter, Navigate, type RouteObject } from "react-router-dom";
import { can } from "@/contracts/common";
import { SignInPage } from "@/features/auth/components/sign-in-page";
import { ForgotPasswordPage, ResetPasswordPage } from "@/features/auth/components/password-pages";
import { AcceptInvitationPage } from "@/features/auth/components/accept-invitation-page";
import { SitesPage } from "@/features/sites/components/sites-page";
import { PlanDesignerPage } from "@/features/plans/components/designer/plan-designer-page";
import { DesignerSlotsProvider, type DesignerSlots } from "@/features/plans/designer-slots";
import { TeamPage } from "@/features/team/components/team-page";
import { MailboxPage } from "@/features/mailbox/components/mailbox-page";
import { SettingsPage } from "@/features/settings/components/settings-page";
import {
  AnchorComments,
  ReviewPage,
  TeamActivityPage,
  useAnchorThreadCounts,
} from "@/features/review";
import { InboxPage } from "@/features/inbox";
import { AppLayout } from "./layout";
import { SiteRoute } from "./site-route";
import { RequireAuth, RequireRole } from "./guards";
import { paths } from "./paths";
import { NotFoundPage } from "./not-found";
import { PlanLinkGuard } from "./plan-link";
import { FieldCheckPage } from "@/features/field";

/** What the designer borrows from the Review feature: the threads beside a layer, refractor or shot. */
export const designerSlots: DesignerSlots = {
  renderAnchorComments: (planId, anchor) => <AnchorComments planId={planId} anchor={anchor} />,
  useAnchorCounts: useAnchorThreadCounts,
};

/** Routes shown inside the signed-in frame. Features add theirs here. */
export const appRoutes: RouteObject[] = [
  { index: true, element: <Navigate to={paths.sites} replace /> },
  { path: paths.sites, element: <SitesPage /> },
  { path: paths.site(), element: <SiteRoute /> },
  {
    path: paths.plan(),
    element: (
      <PlanLinkGuard>
        <DesignerSlotsProvider slots={designerSlots}>
          <PlanDesignerPage />
        </DesignerSlotsProvider>
      </PlanLinkGuard>
    ),
  },
  {
    path: paths.planReview(),
    element: (
      <PlanLinkGuard>
        <ReviewPage />
      </PlanLinkGuard>
    ),
  },
  {
    path: paths.planField(),
    element: (
      <PlanLinkGuard>
        <FieldCheckPage />
      </PlanLinkGuard>
    ),
  },
  { path: paths.inbox, element: <InboxPage /> },
  {
    path: paths.activity,
    element: (
      <RequireRole allow={(me) => me.role !== "trainee"}>
        <TeamActivityPage />
      </RequireRole>
    ),
  },
  {
    path: paths.team,
    element: (
      <RequireRole allow={(me) => can.manageTeam(me.role)}>
        <TeamPage />
      </RequireRole>
    ),
  },
  {
    path: paths.mailbox,
    element: (
      <RequireRole allow={(me) => can.readMailbox(me.role) && (me.mailbox ?? me.demo)}>
        <MailboxPage />
      </RequireRole>
    ),
  },
  { path: paths.settings, element: <SettingsPage /> },
  { path: "*", element: <NotFoundPage /> },
];

export const routes: RouteObject[] = [
  { path: paths.signIn, element: <SignInPage /> },
  { path: paths.forgot, element: <ForgotPasswordPage /> },
  { path: paths.reset(), element: <ResetPasswordPage /> },
  { path: paths.invite(), element: <AcceptInvitationPage /> },
  {
    path: "/",
    element: (
      <RequireAuth>
        <AppLayout />
      </RequireAuth>
    ),
    children: appRoutes,
  },
];

export const createRouter = () => createBrowserRouter(routes);
