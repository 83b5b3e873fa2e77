/** What every router receives from createApp. */
import type { ServerFlags } from "../domain/me";
import type { Services } from "../domain/services";
import type { RateLimitConfig, RateLimitStore, SignInGuard } from "./rate-limit";
import type { SessionTools } from "./session";
import type { BackgroundQueue } from "./background";

export interface RouteContext {
  services: Services;
  sessions: SessionTools;
  flags: ServerFlags;
  limits: {
    config: RateLimitConfig;
    /** Counters in the database, shared by every app server on it. */
    store: RateLimitStore;
    signIn: SignInGuard;
  };
  /** Work queued after the response (e.g. a password-reset e-mail), awaited on shutdown. */
  background: BackgroundQueue;
}
