import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { del, get, patch, post } from "@/lib/api-client";
import type { InvitationSummary, InviteInput } from "@/contracts/auth";
import type { Role } from "@/contracts/common";
import type { MemberSummary } from "@/contracts/team";

export const membersQueryOptions = queryOptions({
  queryKey: ["team", "members"],
  queryFn: () => get<MemberSummary[]>("/api/team/members"),
});

export const invitationsQueryOptions = queryOptions({
  queryKey: ["team", "invitations"],
  queryFn: () => get<InvitationSummary[]>("/api/invitations"),
});

export const useMembers = () => useQuery(membersQueryOptions);
export const useInvitations = () => useQuery(invitationsQueryOptions);

export function useInvite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: InviteInput) => post<InvitationSummary>("/api/invitations", input),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: invitationsQueryOptions.queryKey });
      void queryClient.invalidateQueries({ queryKey: ["mailbox"] });
    },
  });
}

export function useRevokeInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => del<void>(`/api/invitations/${id}`),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationsQueryOptions.queryKey }),
  });
}

export function useChangeRole() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, role }: { userId: string; role: Role }) =>
      patch<MemberSummary>(`/api/team/members/${userId}`, { role }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: membersQueryOptions.queryKey }),
  });
}

export function useRemoveMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => del<void>(`/api/team/members/${userId}`),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: membersQueryOptions.queryKey }),
  });
}
