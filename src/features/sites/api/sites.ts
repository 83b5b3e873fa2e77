import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { get, patch, post } from "@/lib/api-client";
import type { SiteCreateInput, SiteSummary, SiteUpdateInput } from "@/contracts/sites";

export type SiteFilter = "false" | "true" | "all";

export const sitesQueryOptions = (archived: SiteFilter = "false") =>
  queryOptions({
    queryKey: ["sites", { archived }],
    queryFn: () => get<SiteSummary[]>(`/api/sites?archived=${archived}`),
  });

export const siteQueryOptions = (id: string) =>
  queryOptions({
    queryKey: ["sites", "one", id],
    queryFn: () => get<SiteSummary>(`/api/sites/${id}`),
  });

export function useSites(archived: SiteFilter = "false") {
  return useQuery(sitesQueryOptions(archived));
}

export function useSite(id: string) {
  return useQuery(siteQueryOptions(id));
}

export function useCreateSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SiteCreateInput) => post<SiteSummary>("/api/sites", input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ["sites"] }),
  });
}

export function useUpdateSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...input }: SiteUpdateInput & { id: string }) =>
      patch<SiteSummary>(`/api/sites/${id}`, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ["sites"] }),
  });
}
