/** Query keys for the plans feature, in one place so mutations invalidate what they change. */
export const plansKeys = {
  all: ["plans"] as const,
  site: (siteId: string) => ["plans", "site", siteId] as const,
  one: (planId: string) => ["plans", "one", planId] as const,
};
