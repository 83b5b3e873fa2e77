import { ApiError } from "@/lib/api-client";

/** URL of GET /api/attachments/:id/content (also used as a download link). */
export const attachmentContentUrl = (attachmentId: string) =>
  `/api/attachments/${encodeURIComponent(attachmentId)}/content`;

/** The stored bytes of an attachment (a SEG-2 record to draw and pick). */
export async function fetchAttachmentBytes(attachmentId: string): Promise<ArrayBuffer> {
  let response: Response;
  try {
    response = await fetch(attachmentContentUrl(attachmentId), { credentials: "same-origin" });
  } catch {
    throw new ApiError(
      0,
      "network",
      "Cannot reach the Spreadsight server. Check your connection and try again.",
    );
  }
  if (!response.ok) {
    let message = `Could not load the file (status ${response.status}).`;
    try {
      const body = (await response.json()) as { error?: { message?: string } };
      if (body.error?.message) message = body.error.message;
    } catch {
      // keep the generic message
    }
    throw new ApiError(response.status, "content_failed", message);
  }
  return response.arrayBuffer();
}
