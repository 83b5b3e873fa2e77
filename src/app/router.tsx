import { lazy, Suspense, type ComponentType } from "react";
import { createBrowserRouter, Navigate, type RouteObject } from "react-router-dom";
import { can } from "@/contracts/common";
import { Loading } from "@/components/feedback";
import { SignInPage } from "@/features/auth/components/sign-in-page";
import { AppLayout } from "./layout";
import { RequireAuth, RequireRole } from "./guards";
import { paths } from "./paths";
import { NotFoundPage } from "./not-found";
import { PlanLinkGuard, SiteLinkGuard } from "./plan-link";

/**
 * A screen loaded with its own chunk the first time it is shown (the first load carries only
 * the sign-in page and the frame). `load` is a dynamic import; `pick` names the component.
 */
function lazyScreen<M>(load: () => Promise<M>, pick: (module: M) => ComponentType) {
  const Screen = lazy(() => load().then((module) => ({ default: pick(module) })));
  return function LazyScreen() {
    return (
      <Suspense fallback={<Loading label="Loading…" />}>
        <Screen />
      </Suspense>
    );
  };
}

const ForgotPasswordPage = lazyScreen(
  () => import("@/features/auth/components/password-pages"),
  (m) => m.ForgotPasswordPage,
);
const ResetPasswordPage = lazyScreen(
  () => import("@/features/auth/components/password-pages"),
  (m) => m.ResetPasswordPage,
);
const AcceptInvitationPage = lazyScreen(
  () => import("@/features/auth/components/accept-invitation-page"),
  (m) => m.AcceptInvitationPage,
);
const SitesPage = lazyScreen(
  () => import("@/features/sites/components/sites-page"),
  (m) => m.SitesPage,
);
const SiteRoute = lazyScreen(
  () => import("./site-route"),
  (m) => m.SiteRoute,
);
/** The designer with the comment threads it borrows from Review (designer-route.tsx). */
const DesignerRoute = lazyScreen(
  () => import("./designer-route"),
  (m) => m.DesignerRoute,
);
/** The Review screen with the designer's charts it borrows (review-charts.tsx). */
const ReviewPage = lazyScreen(
  () => import("./review-charts"),
  (m) => m.ReviewRoute,
);
const TeamActivityPage = lazyScreen(
  () => import("@/features/review"),
  (m) => m.TeamActivityPage,
);
const FieldCheckPage = lazyScreen(
  () => import("@/features/field"),
  (m) => m.FieldCheckPage,
);
const InboxPage = lazyScreen(
  // the page's own module: the feature's index is in the first load (header link)
  () => import("@/features/inbox/components/inbox-page"),
  (m) => m.InboxPage,
);
const TeamPage = lazyScreen(
  () => import("@/features/team/components/team-page"),
  (m) => m.TeamPage,
);
const MailboxPage = lazyScreen(
  () => import("@/features/mailbox/components/mailbox-page"),
  (m) => m.MailboxPage,
);
const SettingsPage = lazyScreen(
  () => import("@/features/settings/components/settings-page"),
  (m) => m.SettingsPage,
);

/** Routes shown inside the signed-in frame. Features add theirs here. */
export const appRoutes: RouteObject[] = [
  { index: true, element: <Navigate to={paths.sites} replace /> },
  { path: paths.sites, element: <SitesPage /> },
  {
    path: paths.site(),
    element: (
      <SiteLinkGuard>
        <SiteRoute />
      </SiteLinkGuard>
    ),
  },
  {
    path: paths.plan(),
    element: (
      <PlanLinkGuard>
        <DesignerRoute />
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

/**
 * Fetch the chunks of the likeliest next screens (sites list, designer) while the browser is
 * idle after the first screen: they stay out of the first load yet are ready when clicked.
 */
export function prefetchLikelyScreens(): () => void {
  const run = () => {
    void import("@/features/sites/components/sites-page");
    void import("./designer-route");
  };
  if (typeof window.requestIdleCallback === "function") {
    const id = window.requestIdleCallback(run, { timeout: 3000 });
    return () => window.cancelIdleCallback(id);
  }
  const timer = window.setTimeout(run, 1000);
  return () => window.clearTimeout(timer);
}
