/**
 * Field check and exports: uploads stored against a plan revision (borehole logs, first-break
 * picks as CSV, SEG-2 shot records), saved picks, and the plan import. Request schemas and
 * response types shared by the client and the server. Units: m, s, m/s.
 */
import { z } from "zod";
import type { GroundModel } from "../../workers/engine/plan-schema";

export const ATTACHMENT_KINDS = ["borehole", "picks", "seg2"] as const;
export type AttachmentKind = (typeof ATTACHMENT_KINDS)[number];

export const ATTACHMENT_KIND_LABELS: Record<AttachmentKind, string> = {
  borehole: "Borehole or probe log (CSV)",
  picks: "First-break picks (CSV)",
  seg2: "SEG-2 shot record",
};

const MB = 1024 * 1024;

/** Largest upload accepted per kind, bytes. */
export const ATTACHMENT_LIMITS: Record<AttachmentKind, number> = {
  borehole: 2 * MB,
  picks: 2 * MB,
  seg2: 20 * MB,
};

/** File name endings accepted per kind (lower case, with the dot). */
export const ATTACHMENT_EXTENSIONS: Record<AttachmentKind, readonly string[]> = {
  borehole: [".csv", ".txt"],
  picks: [".csv", ".txt"],
  seg2: [".sg2", ".seg2", ".dat"],
};

/**
 * The text fields of POST /api/plans/:id/attachments (multipart/form-data, beside the one
 * file field `file`).
 */
export const attachmentFieldsSchema = z.strictObject({
  kind: z.enum(ATTACHMENT_KINDS, { error: "kind must be borehole, picks or seg2" }),
  /** Unit of a bare `time` column in a picks CSV (a unit in the header wins). */
  timeUnit: z.enum(["ms", "s"], { error: "timeUnit must be ms or s" }).optional(),
  /** Name of the ground model a borehole log builds (default: the file name). */
  modelName: z.string().trim().min(1).max(80, "modelName must be at most 80 characters").optional(),
});
export type AttachmentFields = z.infer<typeof attachmentFieldsSchema>;

/** Facts read from an uploaded file when it was checked. */
export type AttachmentFacts =
  | {
      kind: "seg2";
      traces: number;
      /** Samples of the longest trace. */
      samples: number;
      /** Sample interval of the first trace, s. */
      sampleInterval: number;
      /** Data format codes found (1 int16 … 5 float64). */
      formats: number[];
      byteOrder: "little" | "big";
      /** Distinct SOURCE_LOCATION values, m. */
      sourcePositions: number[];
      /** Traces that state a RECEIVER_LOCATION. */
      tracesWithReceiver: number;
    }
  | { kind: "picks"; picks: number; shots: number[]; timeUnit: "ms" | "s" }
  | { kind: "borehole"; intervals: number; layers: number; model: GroundModel };

export interface AttachmentSummary {
  id: string;
  planId: string;
  /** Plan revision the file was stored against (the latest when it was uploaded). */
  revision: number;
  kind: AttachmentKind;
  fileName: string;
  mediaType: string;
  /** Bytes. */
  size: number;
  /** Hex SHA-256 of the content. */
  sha256: string;
  facts: AttachmentFacts;
  uploadedBy: { id: string; name: string };
  createdAt: string;
}

/** Where a pick came from: the automatic picker, a click on the record section, or a CSV. */
export const PICK_ORIGINS = ["auto", "adjusted", "csv"] as const;
export type PickOrigin = (typeof PICK_ORIGINS)[number];

const position = (label: string) =>
  z
    .number({ error: `${label} must be a number` })
    .refine(Number.isFinite, `${label} must be a finite number`)
    .refine((v) => Math.abs(v) <= 100000, `${label} must be within ±100 km`);

export const pickSchema = z.strictObject({
  /** Shot position along the line, m. */
  sourcePosition: position("sourcePosition"),
  /** Geophone position along the line, m. */
  receiverPosition: position("receiverPosition"),
  /** First-break time, s. */
  time: z
    .number({ error: "time must be a number" })
    .refine(Number.isFinite, "time must be a finite number")
    .refine((v) => v >= 0 && v <= 10, "time must be between 0 and 10 s"),
  origin: z.enum(PICK_ORIGINS, { error: "origin must be auto, adjusted or csv" }).default("auto"),
});
export type FirstBreakPick = z.infer<typeof pickSchema>;
export type FirstBreakPickInput = z.input<typeof pickSchema>;

/** Most picks in one save (25 shots × about 200 geophones; keeps the body under the 1 MB JSON limit). */
export const MAX_PICKS = 5000;

/** Interpretation methods under the line (as workers/field/line-interpretation.ts LineMethod). */
export const INTERPRETATION_METHODS = ["plus-minus", "delay-time", "grm"] as const;
export type InterpretationMethod = (typeof INTERPRETATION_METHODS)[number];

/** Most assignment segments and station elevations kept with the choices. */
export const MAX_ASSIGNMENTS = 2000;
export const MAX_ELEVATIONS = 5000;

const finite = (label: string) =>
  z
    .number({ error: `${label} must be a number` })
    .refine(Number.isFinite, `${label} must be a finite number`);

/** One segment of one shot's picks assigned to a layer (workers/field LayerAssignment), m. */
export const layerAssignmentSchema = z
  .strictObject({
    shot: position("shot"),
    layer: z
      .number({ error: "layer must be a number" })
      .int("layer must be a whole number")
      .min(1, "layer must be 1 (direct wave) to 12")
      .max(12, "layer must be 1 (direct wave) to 12"),
    from: position("from"),
    to: position("to"),
  })
  .refine((a) => a.from <= a.to, { message: "from must not be after to", path: ["to"] });

/**
 * The choices made on the Field check's "Under the line" card, kept with the saved picks so
 * that the report and interpretation.csv use them. SI: datum, xy and positions in m. Absent or
 * null fields take the defaults (workers/field/plan-interpretation.ts).
 */
export const interpretationChoicesSchema = z.strictObject({
  method: z.enum(INTERPRETATION_METHODS, {
    error: "method must be plus-minus, delay-time or grm",
  }),
  /** Datum elevation, m; null: the lowest station. */
  datum: finite("datum")
    .refine((v) => Math.abs(v) <= 10000, "datum must be within ±10 km")
    .nullable()
    .optional(),
  /** GRM only: a fixed XY distance, m; null: the optimum of the search. */
  xy: finite("xy")
    .refine((v) => v >= 0 && v <= 1000, "xy must be between 0 and 1000 m")
    .nullable()
    .optional(),
  /** The user's assignment of picks to refractors; null: the suggestion of the best candidate. */
  assignments: z
    .array(layerAssignmentSchema)
    .max(MAX_ASSIGNMENTS, `at most ${MAX_ASSIGNMENTS} assignment segments`)
    .nullable()
    .optional(),
  /** Station elevations loaded from a CSV, m; null: the plan's section surface, else flat. */
  elevations: z
    .array(
      z.strictObject({
        position: position("position"),
        elevation: finite("elevation").refine(
          (v) => Math.abs(v) <= 10000,
          "elevation must be within ±10 km",
        ),
      }),
    )
    .max(MAX_ELEVATIONS, `at most ${MAX_ELEVATIONS} station elevations`)
    .nullable()
    .optional(),
});
export type InterpretationChoices = z.output<typeof interpretationChoicesSchema>;
export type InterpretationChoicesInput = z.input<typeof interpretationChoicesSchema>;

/** PUT /api/plans/:id/picks/interpretation — sets or clears (null) the stored choices. */
export const interpretationSaveSchema = z.strictObject({
  interpretation: interpretationChoicesSchema.nullable(),
});
export type InterpretationSaveInput = z.input<typeof interpretationSaveSchema>;

/** PUT /api/plans/:id/picks — replaces the plan's saved picks. */
export const picksSaveSchema = z
  .strictObject({
    picks: z.array(pickSchema).max(MAX_PICKS, `at most ${MAX_PICKS} picks`),
    /** The SEG-2 record or CSV the picks were made on, if any. */
    attachmentId: z.uuid({ error: "attachmentId must be a UUID" }).nullable().optional(),
    /** Picker used for the automatic picks, e.g. "sta-lta". */
    picker: z.string().trim().max(40).optional(),
    /** The interpretation choices; absent: the stored ones stay; null: cleared (defaults). */
    interpretation: interpretationChoicesSchema.nullable().optional(),
  })
  .superRefine((body, ctx) => {
    const seen = new Map<string, number>();
    body.picks.forEach((p, i) => {
      const key = `${p.sourcePosition.toFixed(3)}|${p.receiverPosition.toFixed(3)}`;
      const first = seen.get(key);
      if (first !== undefined) {
        ctx.addIssue({
          code: "custom",
          path: ["picks", i],
          message: `a second pick for shot ${p.sourcePosition} m and geophone ${p.receiverPosition} m (the first is picks.${first})`,
        });
      } else seen.set(key, i);
    });
  });
export type PicksSaveInput = z.input<typeof picksSaveSchema>;

export interface PickSetView {
  planId: string;
  /** Plan revision the picks were saved against; null when none were saved yet. */
  revision: number | null;
  picks: FirstBreakPick[];
  attachmentId: string | null;
  picker: string | null;
  /** The interpretation choices made on screen; null: the defaults (the server always sends it). */
  interpretation?: InterpretationChoices | null;
  updatedBy: { id: string; name: string } | null;
  updatedAt: string | null;
}

/** Answer to an upload: the stored attachment and what the file yields. */
export interface AttachmentUploadResponse {
  attachment: AttachmentSummary;
  /** A borehole log: the ground model it builds (the client may add it as a candidate). */
  model?: GroundModel;
  /** A picks CSV: the picks it holds (origin "csv"), not yet saved as the plan's picks. */
  picks?: FirstBreakPick[];
}

/** Answer to POST /api/sites/:siteId/plans/import. */
export interface PlanImportResponse {
  id: string;
  siteId: string;
  name: string;
  revision: number;
}
