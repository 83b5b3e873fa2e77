/** Every route path of the client, in one place. */
export const paths = {
  signIn: "/sign-in",
  forgot: "/forgot-password",
  reset: (token = ":token") => `/reset/${token}`,
  invite: (token = ":token") => `/invite/${token}`,
  home: "/",
  sites: "/sites",
  site: (id = ":siteId") => `/sites/${id}`,
  plan: (id = ":planId") => `/plans/${id}`,
  planReview: (id = ":planId") => `/plans/${id}/review`,
  planField: (id = ":planId") => `/plans/${id}/field`,
  inbox: "/inbox",
  activity: "/activity",
  team: "/team",
  mailbox: "/mailbox",
  settings: "/settings",
} as const;
