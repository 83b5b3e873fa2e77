import { useMutation, useQueryClient } from "@tanstack/react-query";
import { post } from "@/lib/api-client";
import type { MeResponse, SignInInput } from "@/contracts/auth";
import { meQueryOptions } from "./me";

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SignInInput) => post<MeResponse>("/api/auth/sign-in", input),
    onSuccess: (me) => {
      queryClient.clear();
      queryClient.setQueryData(meQueryOptions.queryKey, me);
    },
  });
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => post<void>("/api/auth/sign-out"),
    onSuccess: () => {
      queryClient.clear();
      queryClient.setQueryData(meQueryOptions.queryKey, null);
    },
  });
}
