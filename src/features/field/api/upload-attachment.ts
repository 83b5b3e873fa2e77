import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { AttachmentKind, AttachmentUploadResponse } from "@/contracts/field";
import { request } from "@/lib/api-client";
import { fieldKeys } from "./field-keys";

export interface UploadInput {
  kind: AttachmentKind;
  file: File;
  timeUnit?: "ms" | "s";
  modelName?: string;
}

/**
 * POST /api/plans/:id/attachments as multipart/form-data, through the shared `request`.
 * Errors arrive as ApiError with the server's `fields.file` messages (line and column of a CSV,
 * byte offset of a SEG-2 file).
 */
export async function uploadAttachment(
  planId: string,
  input: UploadInput,
): Promise<AttachmentUploadResponse> {
  const form = new FormData();
  form.append("kind", input.kind);
  if (input.timeUnit) form.append("timeUnit", input.timeUnit);
  if (input.modelName) form.append("modelName", input.modelName);
  form.append("file", input.file, input.file.name);
  return request<AttachmentUploadResponse>(`/api/plans/${encodeURIComponent(planId)}/attachments`, {
    method: "POST",
    body: form,
  });
}

export function useUploadAttachment(planId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UploadInput) => uploadAttachment(planId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: fieldKeys.attachments(planId) }),
  });
}
