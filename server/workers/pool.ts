/**
 * The worker-thread pool (piscina) for CPU-heavy work: PDF reports and upload content checks.
 * The event loop only reads the database and sends answers, so plain GETs stay fast while
 * reports render and files are parsed.
 *
 * The pool starts on first use with one thread fewer than the machine has cores (at least one,
 * at most 4; or SPREADSIGHT_WORKERS), so that a core stays free for the event loop; each thread
 * is reused for every task. Tasks wait in a queue of at most 200, beyond which the request gets
 * 503 `busy`.
 */
import { availableParallelism } from "node:os";
import { Piscina } from "piscina";
import { AppError } from "../domain/errors";
import type { WorkerResult, WorkerTask } from "./tasks";

let pool: Piscina | null = null;

/** The worker file: the compiled tasks beside the compiled server, else the TypeScript entry. */
function workerFile(): string {
  const compiled = import.meta.url.endsWith(".js");
  return new URL(compiled ? "./tasks.js" : "./entry.mjs", import.meta.url).href;
}

function threads(): number {
  const wanted = Number(process.env.SPREADSIGHT_WORKERS);
  if (Number.isInteger(wanted) && wanted > 0) return wanted;
  return Math.max(1, Math.min(4, availableParallelism() - 1));
}

function getPool(): Piscina {
  pool ??= new Piscina({
    filename: workerFile(),
    minThreads: 0,
    maxThreads: threads(),
    idleTimeout: 60_000,
    maxQueue: 200,
  });
  return pool;
}

/** Runs one task in the pool. */
export async function runTask<T extends WorkerTask>(task: T): Promise<WorkerResult<T["kind"]>> {
  try {
    return (await getPool().run(task)) as WorkerResult<T["kind"]>;
  } catch (error) {
    if (error instanceof Error && /queue is at limit/i.test(error.message)) {
      throw new AppError(503, "busy", "the server is busy: try again in a moment", undefined, {
        "Retry-After": "5",
      });
    }
    throw error;
  }
}

/** Stops the pool's threads (server shutdown, tests). */
export async function closeWorkerPools(): Promise<void> {
  const current = pool;
  pool = null;
  await current?.destroy();
}
