import type { ReactNode } from "react";
import { describe, expect, it } from "vitest";
import { act, renderHook, waitFor } from "@testing-library/react";
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import type { Role } from "@/contracts/common";
import { meQueryOptions } from "@/features/auth/api/me";
import { stubFetch, testMe } from "@/testing/render";
import { SAVE_DELAY_MS, useSeismographChannels } from "../use-seismograph-channels";

/** Lets query updates (delivered on a zero timeout) reach the hook. */
const settle = () => act(() => new Promise((resolve) => setTimeout(resolve, 30)));

/** The hook inside a fresh query client with `role` signed in and the team at `channels`. */
function setup(role: Role, channels: number) {
  const calls = stubFetch({
    "GET /api/team/settings": () => ({ status: 200, body: { seismographChannels: channels } }),
    "PATCH /api/team/settings": (body) => ({ status: 200, body }),
  });
  const queryClient = new QueryClient({
    defaultOptions: { queries: { retry: false }, mutations: { retry: false } },
  });
  queryClient.setQueryData(meQueryOptions.queryKey, testMe({ role }));
  const wrapper = ({ children }: { children: ReactNode }) => (
    <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>
  );
  const hook = renderHook(() => useSeismographChannels(), { wrapper });
  const patches = () => calls.filter((c) => c.method === "PATCH").map((c) => c.body);
  return { hook, patches };
}

describe("useSeismographChannels", () => {
  it("gives the default 48 while loading, then the team's count from the server", async () => {
    const { hook } = setup("trainee", 24);
    expect(hook.result.current[0]).toBe(48);
    await waitFor(() => expect(hook.result.current[0]).toBe(24));
  });

  it("for an admin shows a change at once and saves only the last one after a pause", async () => {
    // The change comes before the team's count has loaded: the late answer must not undo it.
    const { hook, patches } = setup("admin", 48);
    await act(async () => hook.result.current[1](9));
    await act(async () => hook.result.current[1](96));
    await waitFor(() => expect(hook.result.current[0]).toBe(96));
    expect(patches()).toEqual([]);
    await waitFor(() => expect(patches()).toEqual([{ seismographChannels: 96 }]), {
      timeout: SAVE_DELAY_MS + 1000,
    });
    expect(hook.result.current[0]).toBe(96);
  });

  it("still saves a change made just before the designer closes", async () => {
    const { hook, patches } = setup("admin", 48);
    await waitFor(() => expect(hook.result.current[0]).toBe(48));
    await act(async () => hook.result.current[1](24));
    hook.unmount();
    expect(patches()).toEqual([{ seismographChannels: 24 }]);
  });

  it("ignores counts outside 2…1024", async () => {
    const { hook, patches } = setup("admin", 48);
    await waitFor(() => expect(hook.result.current[0]).toBe(48));
    await act(async () => {
      hook.result.current[1](1);
      hook.result.current[1](1025);
      hook.result.current[1](24.5);
    });
    await settle();
    expect(hook.result.current[0]).toBe(48);
    hook.unmount();
    expect(patches()).toEqual([]);
  });

  it.each(["lead", "reviewer", "trainee"] as const)(
    "gives a %s a setter that changes nothing",
    async (role) => {
      const { hook, patches } = setup(role, 48);
      await waitFor(() => expect(hook.result.current[0]).toBe(48));
      await act(async () => hook.result.current[1](24));
      await settle();
      expect(hook.result.current[0]).toBe(48);
      hook.unmount();
      expect(patches()).toEqual([]);
    },
  );
});
