/**
 * Work done after the response was sent (e.g. a password reset: look-up, token, e-mail), so that
 * the answer takes the same time whatever the work finds. Failures are logged, never thrown;
 * `drain` waits for what is still running (tests and shutdown).
 */
import type { Logger } from "pino";

export interface BackgroundQueue {
  /** Starts `work` on a later turn of the event loop. */
  run(label: string, work: () => Promise<unknown>): void;
  /** Resolves when every started piece of work has finished. */
  drain(): Promise<void>;
}

export function backgroundQueue(logger: Logger): BackgroundQueue {
  const running = new Set<Promise<unknown>>();
  return {
    run(label, work) {
      const task: Promise<unknown> = new Promise<void>((resolve) => setImmediate(resolve))
        .then(work)
        .catch((error: unknown) =>
          logger.error({ err: error, task: label }, "background work failed"),
        )
        .finally(() => running.delete(task));
      running.add(task);
    },
    async drain() {
      while (running.size) await Promise.allSettled([...running]);
    },
  };
}
