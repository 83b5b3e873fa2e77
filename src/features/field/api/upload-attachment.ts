import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ApiErrorBody } from "@/contracts/common";
import type { AttachmentKind, AttachmentUploadResponse } from "@/contracts/field";
import { ApiError } from "@/lib/api-client";
import { fieldKeys } from "./field-keys";

export interface UploadInput {
  kind: AttachmentKind;
  file: File;
  timeUnit?: "ms" | "s";
  modelName?: string;
}

/**
 * POST /api/plans/:id/attachments as multipart/form-data (the JSON client cannot send files).
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
  let response: Response;
  try {
    response = await fetch(`/api/plans/${encodeURIComponent(planId)}/attachments`, {
      method: "POST",
      credentials: "same-origin",
      headers: { Accept: "application/json" },
      body: form,
    });
  } catch {
    throw new ApiError(
      0,
      "network",
      "Cannot reach the Spreadsight server. Check your connection and try again.",
    );
  }
  const text = await response.text();
  let data: unknown;
  try {
    data = text ? JSON.parse(text) : undefined;
  } catch {
    throw new ApiError(
      response.status,
      "bad_response",
      `The server answered ${response.status} with something that is not JSON.`,
    );
  }
  if (!response.ok) {
    const error = (data as ApiErrorBody | undefined)?.error;
    throw new ApiError(
      response.status,
      error?.code ?? "http_error",
      error?.message ?? `Upload failed with status ${response.status}.`,
      error?.fields,
    );
  }
  return data as AttachmentUploadResponse;
}

export function useUploadAttachment(planId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UploadInput) => uploadAttachment(planId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: fieldKeys.attachments(planId) }),
  });
}
