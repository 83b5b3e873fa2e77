/**
 * What the worker-thread pool runs (server/workers/pool.ts): CPU-heavy work that must not hold
 * the event loop: the plan report (analysis, field check, PDF drawing) and the content check of
 * an uploaded file (CSV parsing, SEG-2 reading). Every task resolves; an expected refusal comes
 * back as a plain `{ error }` object because thrown errors lose their fields between threads.
 */
import { readlinkSync } from "node:fs";
import { setPriority } from "node:os";
import type { AttachmentFields, AttachmentKind } from "@/contracts/field";
import { checkContent, type CheckedContent } from "../domain/attachment-content";
import { AppError, type FieldErrors } from "../domain/errors";
import { completeReportInput, type ReportSource } from "../reports/assemble";
import { renderPlanReport } from "../reports/plan-report";

/**
 * On Linux, lower this worker thread's scheduling priority (nice 10; /proc/thread-self names
 * the thread's own id, and setpriority on a thread id affects that thread only), so that on a
 * busy machine the event loop, which answers every request, wins the CPU over report drawing
 * and file parsing. Elsewhere nothing changes.
 */
function lowerThreadPriority(): void {
  try {
    const tid = /task\/(\d+)$/.exec(readlinkSync("/proc/thread-self"))?.[1];
    if (tid) setPriority(Number(tid), 10);
  } catch {
    // not Linux, or not allowed: keep the default priority
  }
}
lowerThreadPriority();

export type WorkerTask =
  | { kind: "report"; source: ReportSource; compress?: boolean }
  | {
      kind: "check-upload";
      fileKind: AttachmentKind;
      fileName: string;
      bytes: Uint8Array;
      fields: AttachmentFields;
    }
  | { kind: "ping" };

/** An AppError as it crosses the thread boundary. */
export interface WorkerRefusal {
  error: { status: number; code: string; message: string; fields?: FieldErrors };
}

export type WorkerResult<T extends WorkerTask["kind"]> = T extends "report"
  ? Uint8Array
  : T extends "check-upload"
    ? CheckedContent | WorkerRefusal
    : { pong: true; rss: number };

export default async function run(task: WorkerTask): Promise<unknown> {
  switch (task.kind) {
    case "report": {
      const pdf = await renderPlanReport(completeReportInput(task.source), {
        compress: task.compress,
      });
      return new Uint8Array(pdf.buffer, pdf.byteOffset, pdf.byteLength);
    }
    case "check-upload": {
      try {
        const buffer = Buffer.from(task.bytes.buffer, task.bytes.byteOffset, task.bytes.byteLength);
        return checkContent(task.fileKind, { originalname: task.fileName, buffer }, task.fields);
      } catch (error) {
        if (error instanceof AppError) {
          const refusal: WorkerRefusal = {
            error: { status: error.status, code: error.code, message: error.message },
          };
          if (error.fields) refusal.error.fields = { ...error.fields };
          return refusal;
        }
        throw error;
      }
    }
    case "ping":
      return { pong: true, rss: process.memoryUsage().rss };
  }
}
