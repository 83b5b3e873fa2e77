/** What every router receives from createApp. */
import type { ServerFlags } from "../domain/me";
import type { Services } from "../domain/services";
import type { SlidingWindowLimiter } from "./rate-limit";
import type { SessionTools } from "./session";

export interface RouteContext {
  services: Services;
  sessions: SessionTools;
  flags: ServerFlags;
  limiters: {
    signInPerAccount: SlidingWindowLimiter;
    signInPerIp: SlidingWindowLimiter;
    passwordResetPerIp: SlidingWindowLimiter;
  };
}
