/**
 * The one schema for a survey plan: candidate ground models, the spread and the
 * acceptance criteria. Shared by the client forms, the server API, the worker and the
 * command line. All quantities are SI: metres, seconds, metres per second, degrees.
 *
 * Geometry convention: positions are metres along the survey line. Depths are metres
 * below the (flat) ground surface. A layer's `thickness` is its vertical thickness at the
 * line's reference position 0 m. `dip` is the dip of the layer's *base* interface in
 * degrees, positive when the interface deepens towards increasing position.
 *
 * A plan may also hold *section* models (`kind: "section"`, section-schema.ts): surface and
 * interface polylines in elevation, analysed by the 2-D first-arrival modeller. Format
 * `spreadsight-plan/2` introduced them; `spreadsight-plan/1` documents (layered models only,
 * no `kind`) stay valid.
 */
import { z } from "zod";
import { sectionIssues, sectionModelShape } from "./section-schema";
import { MAX_ROLL_ALONG_SPREADS } from "./roll-along";
import { resolveShotPositions } from "./shot-anchors";

export const MAX_LAYERS = 12;
export const MAX_MODELS = 8;
export const MAX_SHOTS = 25;
export const MAX_CHANNELS = 1024;

const finite = (label: string) =>
  z.number({ error: `${label} must be a number` }).refine(Number.isFinite, {
    message: `${label} must be a finite number`,
  });

const positive = (label: string) => finite(label).refine((v) => v > 0, `${label} must be > 0`);

const range = (label: string) =>
  z
    .tuple([positive(`${label} lower bound`), positive(`${label} upper bound`)])
    .refine(([lo, hi]) => lo <= hi, `${label} lower bound must not exceed the upper bound`);

export const layerSchema = z.strictObject({
  /** Free label, e.g. "dry sand". */
  name: z.string().trim().max(80).optional(),
  /** Optional material key from the velocity table (see material picker). */
  material: z.string().trim().max(40).optional(),
  /** P-wave velocity, m/s. */
  velocity: positive("velocity").refine((v) => v <= 10000, "velocity must be at most 10000 m/s"),
  /** Vertical thickness at position 0, m. Omitted (or null) for the last layer (half-space). */
  thickness: positive("thickness")
    .refine((v) => v <= 1000, "thickness must be at most 1000 m")
    .nullable()
    .optional(),
  /** Dip of the layer's base interface, degrees, positive deepening towards +position. */
  dip: finite("dip")
    .refine((v) => Math.abs(v) <= 45, "dip must be between -45 and 45 degrees")
    .optional(),
  /** Optional bounds used by the design sweep. */
  velocityRange: range("velocity range").optional(),
  thicknessRange: range("thickness range").optional(),
});

export const groundModelSchema = z
  .strictObject({
    /** Optional: a model without `kind` is layered. */
    kind: z.literal("layered").optional(),
    name: z.string().trim().min(1, "model name is required").max(80),
    layers: z
      .array(layerSchema)
      .min(1, "a model needs at least one layer")
      .max(MAX_LAYERS, `a model has at most ${MAX_LAYERS} layers`),
  })
  .superRefine((model, ctx) => {
    model.layers.forEach((layer, i) => {
      const last = i === model.layers.length - 1;
      if (!last && (layer.thickness === undefined || layer.thickness === null)) {
        ctx.addIssue({
          code: "custom",
          path: ["layers", i, "thickness"],
          message: `layer ${i + 1} needs a thickness (only the last layer is a half-space)`,
        });
      }
      if (last && layer.dip !== undefined && layer.dip !== 0) {
        ctx.addIssue({
          code: "custom",
          path: ["layers", i, "dip"],
          message: "the last layer is a half-space and has no base to dip",
        });
      }
    });
  });

/**
 * A section model: surface and interface polylines (position m, elevation m) and a velocity
 * per layer, analysed in 2-D (see section-schema.ts and docs/plan-format.md).
 */
export const sectionModelSchema = z.strictObject(sectionModelShape).superRefine((model, ctx) => {
  for (const issue of sectionIssues(model)) {
    ctx.addIssue({ code: "custom", path: issue.path, message: issue.message });
  }
});

/** Any candidate ground model of a plan: layered (no `kind`, or `"layered"`) or a section. */
export const candidateModelSchema = z.discriminatedUnion(
  "kind",
  [groundModelSchema, sectionModelSchema],
  {
    error: 'kind must be "layered" or "section"',
  },
);

export const shotSchema = z.strictObject({
  /** Shot position along the line, m. */
  position: finite("shot position"),
  /**
   * Depth of a buried charge below the surface, m (default 0). Used by section models;
   * layered models place every shot at the surface.
   */
  depth: finite("shot depth")
    .refine((v) => v >= 0 && v <= 100, "shot depth must be between 0 and 100 m")
    .optional(),
  label: z.string().trim().max(40).optional(),
  /**
   * Anchor to the spread (shot-anchors.ts): `offset` m from the spread's start, end or centre.
   * An anchored shot follows every spread change and its `position` is recomputed on parse;
   * a shot without an anchor is fixed (plans written before anchors keep their positions).
   */
  anchor: z
    .strictObject({
      to: z.enum(["start", "end", "centre"], {
        error: 'shot anchor must be "start", "end" or "centre"',
      }),
      offset: finite("shot anchor offset").refine(
        (v) => Math.abs(v) <= 1e6,
        "shot anchor offset must be within 1000 km",
      ),
    })
    .optional(),
  /** Source used at this shot (source-reach.ts); absent = not stated (no reach check). */
  source: z
    .enum(["sledgehammer", "weight-drop", "seismic-gun", "buried-charge"], {
      error: 'shot source must be "sledgehammer", "weight-drop", "seismic-gun" or "buried-charge"',
    })
    .optional(),
});

export const spreadSchema = z
  .strictObject({
    /** Geophone spacing, m. */
    spacing: positive("spacing").refine((v) => v <= 500, "spacing must be at most 500 m"),
    /** Number of geophones (channels). */
    channels: z
      .number({ error: "channels must be a number" })
      .int("channels must be a whole number")
      .min(1, "channels must be at least 1")
      .max(MAX_CHANNELS, `channels must be at most ${MAX_CHANNELS}`),
    /** Position of the first geophone along the line, m. */
    firstGeophone: finite("first geophone position"),
    /** Site noise for the sources' reach (source-reach.ts); absent = not stated. */
    noise: z
      .enum(["quiet", "moderate", "noisy"], {
        error: 'site noise must be "quiet", "moderate" or "noisy"',
      })
      .optional(),
    shots: z
      .array(shotSchema)
      .min(1, "a spread needs at least one shot")
      .max(MAX_SHOTS, `a spread has at most ${MAX_SHOTS} shots`),
    /**
     * Roll-along (roll-along.ts): the line as `spreads` spreads of `channels` geophones, each
     * moved on by `channels − overlap` stations. Absent = one spread.
     */
    rollAlong: z
      .strictObject({
        spreads: z
          .number({ error: "roll-along spreads must be a number" })
          .int("roll-along spreads must be a whole number")
          .min(2, "roll-along needs at least 2 spreads")
          .max(MAX_ROLL_ALONG_SPREADS, `roll-along has at most ${MAX_ROLL_ALONG_SPREADS} spreads`),
        overlap: z
          .number({ error: "roll-along overlap must be a number" })
          .int("roll-along overlap must be a whole number of geophones")
          .min(0, "roll-along overlap must be at least 0"),
      })
      .optional(),
  })
  .superRefine((spread, ctx) => {
    if (spread.rollAlong && spread.rollAlong.overlap >= spread.channels) {
      ctx.addIssue({
        code: "custom",
        path: ["rollAlong", "overlap"],
        message: `roll-along overlap must be below the ${spread.channels} channels of a spread`,
      });
    }
  })
  .transform((spread) => {
    // Anchored shots stand where their anchor puts them on this spread (shot-anchors.ts).
    if (!spread.shots.some((s) => s.anchor)) return spread;
    const positions = resolveShotPositions(spread.shots, spread);
    return { ...spread, shots: spread.shots.map((s, i) => ({ ...s, position: positions[i] })) };
  });

export const criteriaSchema = z.strictObject({
  /** Fewest geophones a refractor's first-arrival segment must hold to count as resolved. */
  minGeophones: z
    .number({ error: "minimum geophones must be a number" })
    .int("minimum geophones must be a whole number")
    .min(2, "minimum geophones must be at least 2")
    .max(50, "minimum geophones must be at most 50")
    .default(2),
  /** Standard deviation of a first-break pick, s. */
  pickError: finite("pick error")
    .refine((v) => v >= 0 && v <= 0.1, "pick error must be between 0 and 0.1 s")
    .default(0.0005),
  /** Largest acceptable depth error or uncertainty, m. */
  depthTolerance: positive("depth tolerance").default(1),
});

/** The current plan format; `spreadsight-plan/1` (layered models only) is still read. */
export const PLAN_FORMAT = "spreadsight-plan/2";

export const planSchema = z
  .strictObject({
    /** Format version of this document: "spreadsight-plan/2" (default) or "…/1". */
    format: z
      .enum(["spreadsight-plan/1", "spreadsight-plan/2"], {
        error: 'format must be "spreadsight-plan/2" (or "spreadsight-plan/1")',
      })
      .default(PLAN_FORMAT),
    name: z.string().trim().min(1, "plan name is required").max(120).default("Untitled plan"),
    models: z
      .array(candidateModelSchema)
      .min(1, "a plan needs at least one ground model")
      .max(MAX_MODELS, `a plan has at most ${MAX_MODELS} ground models`),
    spread: spreadSchema,
    criteria: criteriaSchema.default({ minGeophones: 2, pickError: 0.0005, depthTolerance: 1 }),
  })
  .superRefine((plan, ctx) => {
    if (plan.format !== "spreadsight-plan/1") return;
    plan.models.forEach((model, i) => {
      if (model.kind === "section") {
        ctx.addIssue({
          code: "custom",
          path: ["models", i, "kind"],
          message: 'section models need format "spreadsight-plan/2"',
        });
      }
    });
  });

export type Layer = z.infer<typeof layerSchema>;
/** A layered ground model (flat surface, planar interfaces). */
export type GroundModel = z.infer<typeof groundModelSchema>;
/**
 * One layer of a section model. The layered-only fields are typed `never` so that code
 * reading `layer.thickness` or `layer.dip` on any model's layer still compiles (and gets
 * undefined for a section).
 */
export type SectionLayer = z.infer<typeof sectionModelSchema>["layers"][number] & {
  thickness?: never;
  dip?: never;
  velocityRange?: never;
  thicknessRange?: never;
};
/** A section ground model (polylines in elevation, analysed in 2-D). */
export type SectionModel = Omit<z.infer<typeof sectionModelSchema>, "layers"> & {
  layers: SectionLayer[];
};
/** Any candidate ground model of a plan. */
export type CandidateModel = GroundModel | SectionModel;
export type Shot = z.infer<typeof shotSchema>;
export type Spread = z.infer<typeof spreadSchema>;
export type Criteria = z.infer<typeof criteriaSchema>;
/** A validated plan: layered and section models. */
export type Plan = Omit<z.infer<typeof planSchema>, "models"> & { models: CandidateModel[] };
/** A plan as written by hand or sent by a form, before defaults are applied. */
export type PlanInput = z.input<typeof planSchema>;

/** True for a section model (`kind: "section"`); layered models have no kind or "layered". */
export function isSectionModel(model: CandidateModel): model is SectionModel {
  return model.kind === "section";
}

/** True for a layered model (the original kind, with or without `kind: "layered"`). */
export function isLayeredModel(model: CandidateModel): model is GroundModel {
  return model.kind !== "section";
}

/**
 * The model as a layered model, for code that only handles layered models. Throws
 * TypeError for a section model (it has no layered form; use the section analysis).
 */
export function layeredModel(model: CandidateModel): GroundModel {
  if (model.kind === "section") {
    throw new TypeError(`"${model.name}" is a section model: it has no layered form`);
  }
  return model;
}

/**
 * One line per problem, each naming the field path, e.g. `models[0].layers[2].velocity: …`.
 * An unknown field gets its own line naming it: `spread.colour: unknown field`.
 */
export function describePlanIssues(error: z.ZodError): string[] {
  return error.issues.flatMap((issue) => {
    const path = issue.path
      .map((part, i) =>
        typeof part === "number" ? `[${part}]` : `${i === 0 ? "" : "."}${String(part)}`,
      )
      .join("");
    if (issue.code === "unrecognized_keys") {
      return issue.keys.map((key) => `${path ? `${path}.` : ""}${key}: unknown field`);
    }
    return [`${path || "(plan)"}: ${issue.message}`];
  });
}
