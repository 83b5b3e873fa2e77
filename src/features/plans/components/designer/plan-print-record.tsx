import type { PlanDetail } from "@/contracts/plans";
import { PLAN_STATUS_LABELS } from "@/contracts/plans";
import { formatQuantity, type UnitSystem } from "@/lib/units";
import type { Plan, PlanAnalysis } from "../../lib/engine";
import { VerdictBadge } from "../verdict-badge";

/**
 * The designer's inputs as a printed record (shown only in print, where the form's boxes,
 * tabs and buttons are hidden): site, author and revision, every ground model with its
 * layers and verdict, the spread and its shots, and the acceptance criteria.
 */
export function PlanPrintRecord({
  detail,
  plan,
  analysis,
  units,
}: {
  detail: PlanDetail;
  /** The plan as typed, when it is valid. */
  plan: Plan | null;
  /** The analysis of exactly `plan`, when it is current. */
  analysis: PlanAnalysis | null;
  units: UnitSystem;
}) {
  const length = (m: number, digits?: number) => formatQuantity("length", m, units, digits);
  return (
    <div className="mb-4 hidden text-sm text-ink print:block" data-print-record="">
      <p>
        Site: <span className="font-medium">{detail.siteName}</span> ·{" "}
        {PLAN_STATUS_LABELS[detail.status]} · by {detail.author.name} · revision {detail.revision}
        {detail.sandbox ? " · sandbox" : ""} · printed {new Date().toLocaleString()}
      </p>
      {!plan ? (
        <p className="mt-2 font-medium text-brick">
          The plan as typed has fields to fix; this record shows no inputs until they are fixed.
        </p>
      ) : (
        <>
          <h2 className="mt-3 mb-1 text-base font-semibold text-ink-deep">Ground models</h2>
          <div className="grid grid-cols-2 gap-4">
            {plan.models.map((model, m) => (
              <div key={m} className="break-inside-avoid">
                <h3 className="flex flex-wrap items-center gap-2 font-semibold text-ink-deep">
                  {model.name}
                  {analysis ? <VerdictBadge verdict={analysis.models[m]?.worstStatus} /> : null}
                </h3>
                {model.kind === "section" ? (
                  <p className="text-xs text-ink-soft">
                    Section: surface of {model.surface.length} points from{" "}
                    {length(model.surface[0][0])} to{" "}
                    {length(model.surface[model.surface.length - 1][0])}
                    {model.cellSize ? `, grid cell ${length(model.cellSize, 2)}` : ""}
                  </p>
                ) : null}
                <table
                  className="mt-1 w-full text-xs"
                  aria-label={`Printed layers of ${model.name}`}
                >
                  <thead className="text-left text-ink-soft">
                    <tr className="border-b border-rule">
                      <th className="py-0.5 pr-2 font-semibold">Layer</th>
                      <th className="py-0.5 pr-2 text-right font-semibold">Velocity</th>
                      <th className="py-0.5 text-right font-semibold">
                        {model.kind === "section" ? "Base" : "Thickness · dip"}
                      </th>
                    </tr>
                  </thead>
                  <tbody className="font-mono">
                    {model.layers.map((layer, i) => (
                      <tr key={i} className="border-b border-rule/50 align-top">
                        <td className="py-0.5 pr-2 font-sans">
                          {i + 1}. {layer.name || layer.material || "unnamed"}
                        </td>
                        <td className="py-0.5 pr-2 text-right">
                          {formatQuantity("velocity", layer.velocity, units)}
                          {"velocityAt" in layer && layer.velocityAt ? " (varies)" : ""}
                        </td>
                        <td className="py-0.5 text-right">
                          {model.kind === "section"
                            ? "base" in layer && layer.base
                              ? `${layer.base.length} points`
                              : "half-space"
                            : layer.thickness == null
                              ? "half-space"
                              : `${length(layer.thickness, 2)}${
                                  layer.dip
                                    ? ` · ${formatQuantity("angle", layer.dip, units, 1)}`
                                    : ""
                                }`}
                        </td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            ))}
          </div>

          <h2 className="mt-3 mb-1 text-base font-semibold text-ink-deep">Spread and shots</h2>
          <p>
            {plan.spread.channels} geophones at {length(plan.spread.spacing, 2)}, the first at{" "}
            {length(plan.spread.firstGeophone, 2)} (spread length{" "}
            {length((plan.spread.channels - 1) * plan.spread.spacing, 2)})
            {plan.spread.rollAlong
              ? `; rolled along as ${plan.spread.rollAlong.spreads} spreads overlapping by ${plan.spread.rollAlong.overlap} geophones`
              : ""}
            {plan.spread.noise ? `; site noise ${plan.spread.noise}` : ""}.
          </p>
          <table className="mt-1 text-xs" aria-label="Printed shots">
            <thead className="text-left text-ink-soft">
              <tr className="border-b border-rule">
                <th className="py-0.5 pr-3 font-semibold">Shot</th>
                <th className="py-0.5 pr-3 text-right font-semibold">Position</th>
                <th className="py-0.5 pr-3 font-semibold">Source</th>
                <th className="py-0.5 font-semibold">Depth · label</th>
              </tr>
            </thead>
            <tbody>
              {plan.spread.shots.map((shot, i) => (
                <tr key={i} className="border-b border-rule/50">
                  <td className="py-0.5 pr-3 font-mono">{i + 1}</td>
                  <td className="py-0.5 pr-3 text-right font-mono">{length(shot.position, 2)}</td>
                  <td className="py-0.5 pr-3">{shot.source?.replace("-", " ") ?? "not stated"}</td>
                  <td className="py-0.5">
                    {shot.depth ? `${length(shot.depth, 2)} deep` : "surface"}
                    {shot.label ? ` · ${shot.label}` : ""}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>

          <p className="mt-2">
            Criteria: a refractor counts as resolved with at least {plan.criteria.minGeophones}{" "}
            geophones; pick error {formatQuantity("time", plan.criteria.pickError, units)}; depth
            tolerance {length(plan.criteria.depthTolerance, 2)}.
          </p>
          {!analysis ? (
            <p className="mt-1 text-ink-soft">
              The analysis below may be of an earlier version of these inputs.
            </p>
          ) : null}
        </>
      )}
    </div>
  );
}
