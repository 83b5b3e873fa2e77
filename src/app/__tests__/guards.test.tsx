import { describe, expect, it } from "vitest";
import { screen } from "@testing-library/react";
import { useQuery } from "@tanstack/react-query";
import { get } from "@/lib/api-client";
import { renderWithApp, stubFetch, testMe } from "@/testing/render";
import { SignInPage } from "@/features/auth/components/sign-in-page";
import { RequireAuth } from "../guards";

function SitesProbe() {
  const sites = useQuery({
    queryKey: ["sites-probe"],
    queryFn: () => get<unknown[]>("/api/sites"),
  });
  return <p>{sites.isError ? `error: ${sites.error.message}` : "loading sites"}</p>;
}

describe("RequireAuth", () => {
  it("sends a user whose session ended mid-use to sign in, says why, and keeps the way back", async () => {
    stubFetch({
      "GET /api/sites": () => ({
        status: 401,
        body: { error: { code: "unauthenticated", message: "sign in first" } },
      }),
    });
    const { router } = renderWithApp(
      <RequireAuth>
        <SitesProbe />
      </RequireAuth>,
      {
        me: testMe(),
        path: "/sites",
        route: "/sites",
        extraRoutes: [{ path: "/sign-in", element: <SignInPage /> }],
      },
    );
    expect(await screen.findByText(/your session has ended/i)).toBeInTheDocument();
    expect(screen.queryByText(/sign in first/)).toBeNull();
    expect(router.state.location.pathname).toBe("/sign-in");
    const search = new URLSearchParams(router.state.location.search);
    expect(search.get("next")).toBe("/sites");
    expect(search.get("ended")).toBe("1");
  });

  it("leaves other refusals on the page (a 403 is not a lost session)", async () => {
    stubFetch({
      "GET /api/sites": () => ({
        status: 403,
        body: { error: { code: "forbidden", message: "your role may not do this" } },
      }),
    });
    const { router } = renderWithApp(
      <RequireAuth>
        <SitesProbe />
      </RequireAuth>,
      { me: testMe(), path: "/sites", route: "/sites" },
    );
    expect(await screen.findByText("error: your role may not do this")).toBeInTheDocument();
    expect(router.state.location.pathname).toBe("/sites");
  });

  it("asks a visitor who was never signed in to sign in without the session notice", async () => {
    stubFetch({});
    const { router } = renderWithApp(
      <RequireAuth>
        <SitesProbe />
      </RequireAuth>,
      {
        me: null,
        path: "/sites",
        route: "/sites",
        extraRoutes: [{ path: "/sign-in", element: <SignInPage /> }],
      },
    );
    expect(await screen.findByRole("heading", { name: "Sign in" })).toBeInTheDocument();
    expect(screen.queryByText(/your session has ended/i)).toBeNull();
    expect(router.state.location.search).toBe("?next=%2Fsites");
  });
});
