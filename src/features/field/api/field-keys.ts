/** Query keys of the field feature, in one place so mutations invalidate what they change. */
export const fieldKeys = {
  all: ["field"] as const,
  plan: (planId: string) => ["field", "plan", planId] as const,
  attachments: (planId: string) => ["field", "attachments", planId] as const,
  picks: (planId: string) => ["field", "picks", planId] as const,
  content: (attachmentId: string) => ["field", "content", attachmentId] as const,
};
