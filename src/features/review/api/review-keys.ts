/** Query keys of the Review screen, in one place so every mutation invalidates what it changes. */
export const reviewKeys = {
  all: ["review"] as const,
  plan: (planId: string) => ["review", planId] as const,
  detail: (planId: string) => ["review", planId, "plan"] as const,
  revisions: (planId: string) => ["review", planId, "revisions"] as const,
  revision: (planId: string, number: number) => ["review", planId, "revision", number] as const,
  diff: (planId: string, from: number, to: number) => ["review", planId, "diff", from, to] as const,
  comments: (planId: string) => ["review", planId, "comments"] as const,
  activity: (planId: string) => ["review", planId, "activity"] as const,
};

/** Keys owned by other screens that a review action makes stale (matched by prefix). */
export const foreignKeys = {
  /** The designer's and the plans list's caches. */
  plans: ["plans"] as const,
  notifications: ["notifications"] as const,
  teamAudit: ["audit"] as const,
};

/** `/api/plans/:id` with the id encoded. */
export const planUrl = (planId: string, rest = "") =>
  `/api/plans/${encodeURIComponent(planId)}${rest}`;
