/**
 * Result types of the 2-D analysis of a section model (the section modeller). Plain JSON
 * (no NaN or Infinity: null instead) apart from `SectionShotField`, whose typed arrays the
 * worker transfers. Units: positions and elevations m (elevation up), times s, velocities
 * m/s. Layers are numbered from 1 (top); a refractor's `layer` is the layer whose top it is.
 * Shots are 0-based indexes into `spread.shots`.
 */
import type { ModelAnalysis } from "./analysis";
import type { Side } from "./branches";
import type { Status } from "./statuses";

/** The first arrival at one geophone. */
export interface SectionGeophoneArrival {
  /** Geophone position along the line, m. */
  position: number;
  /** Geophone elevation (on the surface), m. */
  elevation: number;
  /** First-arrival time, s (0 for a geophone standing at a surface shot). */
  time: number;
  /** Layer (1-based) along whose top the first-arrival ray travelled; 1 = direct wave. */
  via: number;
}

/** First arrivals of one shot at every geophone of the spread (geophone order). */
export interface SectionShotArrivals {
  /** Shot index (0-based into spread.shots). */
  shot: number;
  /** Shot position along the line, m. */
  position: number;
  /** Elevation of the shot point itself (surface minus the shot depth), m. */
  elevation: number;
  geophones: SectionGeophoneArrival[];
}

/**
 * A stretch of an interface sampled by head waves of one shot branch: the geophones whose
 * first arrival travelled along the interface between `from` and `to`.
 */
export interface CoverageStretch {
  /** Start and end of the stretch along the line, m (from ≤ to). */
  from: number;
  to: number;
  /** Geophones whose first-arrival ray travelled along this stretch. */
  geophones: number;
  /**
   * Verdict with the layered definitions (verdicts.ts): resolved (≥ minGeophones),
   * under-sampled (fewer), blind (faster than every layer above here but never first:
   * `shot` null), inverted (not faster than a layer above here: `shot` null).
   */
  status: Status;
  /** Shot index of the branch, null for blind and inverted stretches. */
  shot: number | null;
  /** Branch side, null for blind and inverted stretches. */
  side: Side | null;
  /**
   * Whether this stretch counts towards the interface's verdict: an under-sampled stretch
   * whose geophones include the first or last geophone of its branch is not judged (the
   * arrival may go on beyond the spread), as the layered rule for segments.
   */
  judged: boolean;
  /** Positions of the geophones, m (the first and last bound the receiving window). */
  geophonePositions: number[];
  /**
   * Present only on a FEATURE stretch: the plain name of an interface feature (e.g. "channel
   * floor", "slope dipping 30°"; section-features.ts) that lies strictly inside a branch's
   * run but on which fewer than minGeophones of the run's rays leave the interface (their
   * exit points, where a geophone images the refractor). `from`/`to` are the feature's ends,
   * `geophones` the exit points on it, `geophonePositions` those geophones; the status is
   * under-sampled, placed after its branch's run stretch. `judged` is false when another
   * branch puts minGeophones exit points on the same feature (it is then resolved).
   */
  feature?: string;
}

/** Coverage of one interface (the top of `layer`). */
export interface InterfaceCoverage {
  /** 1-based layer whose top this interface is (2 = base of the first layer). */
  layer: number;
  name: string | null;
  /** Branch stretches (sorted by shot, side, from), then blind and inverted stretches. */
  stretches: CoverageStretch[];
  /** Worst verdict over the judged stretches (under-sampled when none is judged). */
  status: Status;
  /** One plain sentence, e.g. "rockhead sampled from 12 to 86 m; … 44 to 50 m … under-sampled". */
  summary: string;
}

/** A design hint for a weak stretch: spacing and shots that would sample it. */
export interface StretchRecommendation {
  layer: number;
  from: number;
  to: number;
  /** Largest geophone spacing that would put minGeophones on the stretch, m (null: unknown). */
  spacing: number | null;
  /** Shot positions that would sample it, m (forward shot before it, reverse shot after it). */
  shots: number[];
  text: string;
}

/** One point of an interface as a crew would interpret it (under one shot). */
export interface InterpretedPoint {
  /** Shot index and branch side whose arrivals gave the point. */
  shot: number;
  side: Side;
  /** Position (the shot's), m. */
  position: number;
  /** Interpreted depth below the surface and elevation, m. */
  depth: number;
  elevation: number;
  /** True depth below the surface there, m. */
  trueDepth: number;
  /** depth − trueDepth, m (positive: interpreted too deep). */
  error: number;
}

/** An interface as interpreted from the modelled first arrivals. */
export interface InterpretedInterface {
  layer: number;
  /** Interpreted velocity below the interface, m/s (mean over the points' branches). */
  velocity: number;
  points: InterpretedPoint[];
}

/** The interpretation a crew would make: intercept-time method under each shot. */
export interface SectionInterpretation {
  /** "intercept-time" (Telford et al. 1990 §4.3), one estimate per shot branch. */
  method: "intercept-time";
  interfaces: InterpretedInterface[];
  /** The largest |error| over every point, null when nothing was interpreted. */
  worst: { layer: number; position: number; error: number } | null;
}

/** How the section was gridded. */
export interface SectionGridInfo {
  /** Cell size used, m (square cells). */
  cellSize: number;
  /** Why that size: "geometry" (chosen), "plan" (model.cellSize), "limit" (cell cap hit). */
  cellSizeSource: "geometry" | "plan" | "limit";
  /** Grid nodes along the line and down. */
  nx: number;
  nz: number;
  /** Position of the first node column and elevation of the top node row, m. */
  x0: number;
  zTop: number;
}

/** Section-only details of a model's analysis. */
export interface SectionDetails {
  grid: SectionGridInfo;
  /** Plain warnings, e.g. a layer thinner than two cells somewhere. */
  warnings: string[];
  interpretation: SectionInterpretation;
  recommendations: StretchRecommendation[];
}

/**
 * The analysis of a section model. It is a ModelAnalysis (the layered summary fields are
 * filled from the stretches, so lists and reports keep working) plus the section fields.
 * `refractors[i].depth` is the depth under the first shot; `interpretation` and
 * `uncertainty` of the layered part are null (see `section.interpretation`).
 */
export interface SectionModelAnalysis extends ModelAnalysis {
  kind: "section";
  /** First arrivals per shot. */
  arrivals: SectionShotArrivals[];
  /** Per interface (top of layer 2 … n), the stretches sampled by head waves. */
  coverage: InterfaceCoverage[];
  section: SectionDetails;
}

/** The time field and first-arrival rays of one shot (for drawing the section). */
export interface SectionShotField {
  shot: number;
  grid: SectionGridInfo;
  /**
   * First-arrival time at every grid node, s, row-major from the top row (index
   * row·nx + column; node at x0 + column·cellSize, zTop − row·cellSize). Infinity above the
   * surface where no wave goes.
   */
  times: Float64Array;
  /** One ray per geophone (geophone order; empty points at the shot itself). */
  rays: SectionRay[];
}

/** A first-arrival ray from the shot to a geophone. */
export interface SectionRay {
  geophone: number;
  /** Interleaved x, elevation pairs, m, from the shot to the geophone. */
  points: Float64Array;
  /** Layer along whose top it travelled (1 = direct wave). */
  via: number;
  /** Stretch of that interface it travelled along, m (null for the direct wave). */
  from: number | null;
  to: number | null;
}

/** A section design sweep request: geophone spacing × one section parameter. */
export interface SectionSweepSpec {
  modelIndex: number;
  /** Geophone spacings, m. */
  spacings: number[];
  /**
   * The varied parameter: the elevation of one point of a polyline (layer 1-based whose
   * base it is, point index 0-based), or a layer's velocity (m/s).
   */
  parameter:
    | { kind: "elevation"; layer: number; point: number; values: number[] }
    | { kind: "velocity"; layer: number; values: number[] };
  /** "follow" (default) moves shots with the spread as runSweep does; "fixed" keeps them. */
  shotLayout?: "follow" | "fixed";
}

/**
 * Result of a section sweep, shaped like the layered SweepResult so the same heat map can
 * draw it: row i = parameter value i, column j = spacing j, cell at i · cols + j.
 */
export interface SectionSweepResult {
  rows: number;
  cols: number;
  axis: { kind: "spacing"; values: Float64Array };
  parameter: {
    layer: number;
    kind: "elevation" | "velocity";
    /** Point index for "elevation", null for "velocity". */
    point: number | null;
    values: Float64Array;
  };
  /** Worst status code per cell: 0 resolved, 1 under-sampled, 2 blind, 3 inverted, 254 not computed, 255 invalid geometry. */
  status: Uint8Array;
  /** Signed depth error (m) of the worst interpreted point per cell; NaN when nothing is interpreted. */
  depthError: Float64Array;
  cancelled: boolean;
  completedRows: number;
}
