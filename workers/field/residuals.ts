/**
 * Residuals of observed first breaks against modelled first arrivals, their RMS per candidate
 * ground model, and which model fits best.
 */
import { checkPicks, type FirstArrivalFn, type ObservedPick } from "./field-picks";

/** One pick with its modelled time and residual. */
export interface PickResidual extends ObservedPick {
  /** |geophone − shot|, m. */
  offset: number;
  /** Modelled first arrival, s; null where the model gives none (NaN or infinite). */
  modelled: number | null;
  /** Observed − modelled, s (negative: the pick is early); null where `modelled` is null. */
  residual: number | null;
}

/** How well one candidate model fits the picks. */
export interface ModelFit {
  name: string;
  /** Root mean square of the residuals, s; null when no pick could be modelled. */
  rms: number | null;
  /** Mean residual, s (negative: picks are early on average); null as for `rms`. */
  meanResidual: number | null;
  /** Picks with a modelled time. */
  count: number;
  /** Picks the model gives no time for. */
  unmodelled: number;
  residuals: PickResidual[];
}

/** Residual of every pick against one model's first arrivals. */
export function residualsFor(
  picks: readonly ObservedPick[],
  firstArrival: FirstArrivalFn,
): PickResidual[] {
  checkPicks(picks);
  return picks.map((p) => {
    const m = firstArrival(p.sourcePosition, p.receiverPosition);
    const modelled = typeof m === "number" && Number.isFinite(m) ? m : null;
    return {
      sourcePosition: p.sourcePosition,
      receiverPosition: p.receiverPosition,
      time: p.time,
      offset: Math.abs(p.receiverPosition - p.sourcePosition),
      modelled,
      residual: modelled === null ? null : p.time - modelled,
    };
  });
}

/** RMS and mean residual of one model. */
export function fitModel(
  name: string,
  picks: readonly ObservedPick[],
  firstArrival: FirstArrivalFn,
): ModelFit {
  const residuals = residualsFor(picks, firstArrival);
  let sum = 0;
  let sumSq = 0;
  let count = 0;
  for (const r of residuals) {
    if (r.residual === null) continue;
    sum += r.residual;
    sumSq += r.residual * r.residual;
    count++;
  }
  return {
    name,
    rms: count > 0 ? Math.sqrt(sumSq / count) : null,
    meanResidual: count > 0 ? sum / count : null,
    count,
    unmodelled: residuals.length - count,
    residuals,
  };
}

/**
 * Fits every candidate model and names the best: the lowest RMS among the models that give
 * a time for the most picks (so a model is not favoured for leaving awkward picks out).
 * `best` is the index into `fits`, or null when no model gives any time.
 */
export function compareModels(
  picks: readonly ObservedPick[],
  models: readonly { name: string; firstArrival: FirstArrivalFn }[],
): { fits: ModelFit[]; best: number | null } {
  const fits = models.map((m) => fitModel(m.name, picks, m.firstArrival));
  const most = fits.reduce((a, f) => Math.max(a, f.count), 0);
  let best: number | null = null;
  fits.forEach((f, i) => {
    if (most === 0 || f.count !== most || f.rms === null) return;
    if (best === null || f.rms < (fits[best].rms ?? Number.POSITIVE_INFINITY)) best = i;
  });
  return { fits, best };
}
