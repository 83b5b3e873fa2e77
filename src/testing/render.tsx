import type { ReactElement } from "react";
import { render } from "@testing-library/react";
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { createMemoryRouter, RouterProvider, type RouteObject } from "react-router-dom";
import type { MeResponse } from "@/contracts/auth";
import { meQueryOptions } from "@/features/auth/api/me";

export const testMe = (overrides: Partial<MeResponse> = {}): MeResponse => ({
  user: {
    id: "00000000-0000-4000-8000-000000000001",
    email: "lead@example.test",
    name: "Test Lead",
  },
  team: { id: "00000000-0000-4000-8000-0000000000aa", name: "Test Team" },
  role: "lead",
  preferences: { units: "metric" },
  demo: true,
  ...overrides,
});

/** Renders an element inside a fresh query client and a memory router; `me` seeds the session. */
export function renderWithApp(
  element: ReactElement,
  {
    me = testMe(),
    path = "/",
    route = "/",
    extraRoutes = [],
  }: { me?: MeResponse | null; path?: string; route?: string; extraRoutes?: RouteObject[] } = {},
) {
  const queryClient = new QueryClient({
    defaultOptions: { queries: { retry: false }, mutations: { retry: false } },
  });
  queryClient.setQueryData(meQueryOptions.queryKey, me);
  const router = createMemoryRouter([{ path, element }, ...extraRoutes], {
    initialEntries: [route],
  });
  const utils = render(
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  return { ...utils, queryClient, router };
}

/** A fetch stub answering by method and path; unmatched calls fail the test loudly. */
export function stubFetch(
  handlers: Record<string, (body: unknown) => { status: number; body?: unknown }>,
) {
  const calls: Array<{ method: string; url: string; body: unknown }> = [];
  const fetchStub = async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = typeof input === "string" ? input : input.toString();
    const method = init?.method ?? "GET";
    const body = init?.body ? JSON.parse(String(init.body)) : undefined;
    calls.push({ method, url, body });
    const handler = handlers[`${method} ${url}`];
    if (!handler) throw new Error(`unexpected request ${method} ${url}`);
    const result = handler(body);
    return new Response(result.body === undefined ? null : JSON.stringify(result.body), {
      status: result.status,
      headers: { "Content-Type": "application/json" },
    });
  };
  globalThis.fetch = fetchStub as typeof fetch;
  return calls;
}
