/** pino, silent under tests unless LOG_LEVEL says otherwise. */
import { pino, type Logger } from "pino";

export function defaultLogLevel(env: NodeJS.ProcessEnv = process.env): string {
  if (env.LOG_LEVEL) return env.LOG_LEVEL;
  if (env.NODE_ENV === "test" || env.VITEST) return "silent";
  return "info";
}

export function createLogger(level = defaultLogLevel()): Logger {
  return pino({ name: "spreadsight", level });
}
