/**
 * What a plan report shows, gathered by server/domain/reports.ts and drawn by
 * server/reports/plan-report.ts. Plain data; the renderer computes arrivals and sections from
 * the plan document with the engine, so every number in the report is the engine's.
 */
import type { Plan, PlanAnalysis } from "@engine";
import type { UnitSystem } from "@/lib/units";
import type { ReportInterpretation } from "./field-interpretation";

export interface ReportRevision {
  number: number;
  author: string;
  createdAt: Date;
  message: string | null;
  worstVerdict: string | null;
}

/** One step of the review: submitted, approved, changes requested, reopened, … */
export interface ReportReviewEvent {
  at: Date;
  actor: string | null;
  /** Plain words, e.g. "Submitted for review", "Approved". */
  label: string;
  revision: number | null;
  note: string | null;
}

export interface ReportApproval {
  by: string;
  at: Date;
  revision: number;
  note: string | null;
}

/** The saved field picks compared with the candidate models (only when picks exist). */
export interface ReportFieldCheck {
  picks: number;
  shots: number[];
  fits: { name: string; rms: number | null; meanResidual: number | null; count: number }[];
  best: string | null;
  warnings: string[];
  /** The interpreted section under the line (server/reports/field-interpretation.ts). */
  interpretation?: ReportInterpretation | null;
}

export interface PlanReportInput {
  generatedAt: Date;
  generatedBy: string;
  teamName: string;
  site: { name: string; description: string };
  plan: {
    id: string;
    name: string;
    /** Human label, e.g. "Approved", "In review". */
    status: string;
    revision: number;
    author: string;
    sandbox: boolean;
  };
  document: Plan;
  /** The engine's analysis of `document`, or why there is none. */
  analysis: { ok: true; value: PlanAnalysis } | { ok: false; reason: string };
  revisions: ReportRevision[];
  review: ReportReviewEvent[];
  approval: ReportApproval | null;
  fieldCheck: ReportFieldCheck | null;
  /**
   * The reader's units for lengths and velocities (the requesting user's preference, or the
   * `units` query parameter); metric when absent. Stored values stay SI.
   */
  units?: UnitSystem;
}
