import { queryOptions, useQuery } from "@tanstack/react-query";
import { get } from "@/lib/api-client";
import type { CommentView } from "@/contracts/plans";
import { planUrl, reviewKeys } from "./review-keys";

/** GET /api/plans/:id/comments — every comment of the plan, on any revision. */
export const commentsQueryOptions = (planId: string) =>
  queryOptions({
    queryKey: reviewKeys.comments(planId),
    queryFn: () => get<CommentView[]>(planUrl(planId, "/comments")),
  });

export function useComments(planId: string) {
  return useQuery(commentsQueryOptions(planId));
}
