import { queryOptions, useQuery } from "@tanstack/react-query";
import type { AttachmentSummary } from "@/contracts/field";
import { get } from "@/lib/api-client";
import { fieldKeys } from "./field-keys";

/** GET /api/plans/:id/attachments — the plan's uploaded files, newest first. */
export const fetchAttachments = (planId: string) =>
  get<AttachmentSummary[]>(`/api/plans/${encodeURIComponent(planId)}/attachments`);

export const attachmentsQueryOptions = (planId: string) =>
  queryOptions({
    queryKey: fieldKeys.attachments(planId),
    queryFn: () => fetchAttachments(planId),
  });

export function useAttachments(planId: string) {
  return useQuery(attachmentsQueryOptions(planId));
}
