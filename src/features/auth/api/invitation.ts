import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { get, post } from "@/lib/api-client";
import type { AcceptInvitationInput, InvitationPreview, MeResponse } from "@/contracts/auth";
import { meQueryOptions } from "./me";

export const invitationPreviewQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ["invitation-preview", token],
    queryFn: () => get<InvitationPreview>(`/api/invitations/token/${encodeURIComponent(token)}`),
  });

export function useInvitationPreview(token: string) {
  return useQuery(invitationPreviewQueryOptions(token));
}

export function useAcceptInvitation(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: AcceptInvitationInput) =>
      post<MeResponse>(`/api/invitations/token/${encodeURIComponent(token)}/accept`, input),
    onSuccess: (me) => {
      queryClient.clear();
      queryClient.setQueryData(meQueryOptions.queryKey, me);
    },
  });
}
