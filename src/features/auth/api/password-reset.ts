import { useMutation } from "@tanstack/react-query";
import { post } from "@/lib/api-client";

export function useRequestReset() {
  return useMutation({
    mutationFn: (input: { email: string }) => post<void>("/api/auth/password-reset", input),
  });
}

export function useCompleteReset(token: string) {
  return useMutation({
    mutationFn: (input: { password: string }) =>
      post<void>(`/api/auth/password-reset/${encodeURIComponent(token)}`, input),
  });
}
