import { formatQuantity, formatSigned, type UnitSystem } from "@/lib/units";
import { hiddenStatementInUnits, recommendationSentence } from "../../lib/recommendation-text";
import type { ModelAnalysis, Plan, PlanAnalysis, Segment } from "../../lib/engine";
import type { AppliedSpread } from "../../lib/apply-recommendation";
import { ApplyChoicesPanel } from "./apply-choices-panel";
import { VerdictBadge, VERDICT_MEANINGS } from "../verdict-badge";
import { AnchorCommentsChip } from "./anchor-comments";
import { PhoneLabel } from "./cell-input";

/** The cautions every design check carries (design.md). */
export function Cautions() {
  return (
    <aside
      aria-label="Cautions"
      className="mt-4 rounded-md border border-ochre/50 bg-ochre-soft/60 px-4 py-3 text-sm text-ink-deep"
    >
      <p className="font-semibold">Before anyone goes to site</p>
      <ul className="mt-1 list-disc space-y-1 pl-5">
        <li>
          A design check is a model, not ground truth: boreholes and a qualified geophysicist’s
          review decide. Defer to local codes and licensed practice.
        </li>
        <li>
          Explosive sources need a licensed blaster and local permits; hammer and weight-drop
          sources need eye and hearing protection.
        </li>
        <li>
          Clear buried utilities before spiking geophones or drilling shot holes; lines along roads
          need traffic management.
        </li>
      </ul>
    </aside>
  );
}

function segmentText(segment: Segment | null, units: UnitSystem): string {
  if (!segment) return "never first";
  const from = formatQuantity("length", segment.from, units, 1);
  return segment.to === null
    ? `from ${from} on`
    : `${from} – ${formatQuantity("length", segment.to, units, 1)}`;
}

/** A table row on a phone: the refractor across the top, the values two by two under it. */
const PHONE_ROW = "max-sm:grid max-sm:grid-cols-2 max-sm:gap-x-3 max-sm:gap-y-1.5 max-sm:py-2";
const PHONE_HEAD = "max-sm:col-span-2 max-sm:p-0";
const PHONE_CELL = "max-sm:p-0 max-sm:text-left";

/**
 * Resolvability: per refractor of one ground model its verdict, first-arrival segment and
 * geophone count, the depth a practitioner would interpret against the true depth, the pick
 * uncertainty and the thinnest layer the spread would resolve; then the plan's
 * recommendation with a one-click apply, the layers no spread can reveal, and the cautions.
 */
export function ResolvabilityPanel({
  plan,
  analysis,
  model,
  modelIndex,
  units,
  readOnly,
  current,
  onApply,
}: {
  plan: Plan;
  analysis: PlanAnalysis;
  model: ModelAnalysis;
  /** Which of the plan's ground models `model` is (0-based), for comments anchored there. */
  modelIndex: number;
  units: UnitSystem;
  readOnly: boolean;
  current: boolean;
  onApply: (spread: AppliedSpread) => void;
}) {
  const interpreted = new Map(
    (model.interpretation?.refractors ?? []).map((r) => [r.layer, r] as const),
  );
  const sigma = new Map((model.uncertainty?.refractors ?? []).map((r) => [r.layer, r] as const));
  const tolerance = plan.criteria.depthTolerance;
  const rec = analysis.recommendation;

  return (
    <div>
      {/* On a phone (below sm) each refractor is a card with its own labels: every column
          stays in view, with no box that scrolls sideways. */}
      <div className="sm:overflow-x-auto">
        <table
          className="w-full text-sm max-sm:block"
          aria-label={`Resolvability of ${model.name}`}
        >
          <thead className="text-left text-xs text-ink-soft max-sm:hidden">
            <tr className="border-b border-rule">
              <th scope="col" className="py-1.5 pr-3 font-semibold">
                Refractor
              </th>
              <th scope="col" className="py-1.5 pr-3 font-semibold">
                Verdict
              </th>
              <th scope="col" className="py-1.5 pr-3 font-semibold">
                Segment
              </th>
              <th scope="col" className="py-1.5 pr-3 text-right font-semibold">
                Geophones
              </th>
              <th scope="col" className="min-w-[10.5rem] py-1.5 pr-3 text-right font-semibold">
                Depth (true, interpreted)
              </th>
              <th scope="col" className="py-1.5 text-right font-semibold">
                Min. thickness
              </th>
            </tr>
          </thead>
          <tbody className="font-mono text-xs max-sm:block">
            <tr className={`border-b border-rule/60 align-top ${PHONE_ROW}`}>
              <th
                scope="row"
                className={`py-2 pr-3 text-left font-sans text-sm font-medium ${PHONE_HEAD}`}
              >
                Direct wave
                <span className="block text-xs font-normal text-ink-soft">
                  layer 1 · {formatQuantity("velocity", model.direct.velocity, units)}
                </span>
              </th>
              <td className={`py-2 pr-3 ${PHONE_CELL}`}>
                <PhoneLabel>Verdict</PhoneLabel>
                <VerdictBadge verdict={model.direct.status} />
              </td>
              <td className={`py-2 pr-3 ${PHONE_CELL}`}>
                <PhoneLabel>Segment</PhoneLabel>
                {segmentText(model.direct.segment, units)}
              </td>
              <td className={`py-2 pr-3 text-right ${PHONE_CELL}`}>
                <PhoneLabel>Geophones</PhoneLabel>
                {model.direct.geophones}
              </td>
              <td className="py-2 pr-3 text-right max-sm:hidden">—</td>
              <td className="py-2 text-right max-sm:hidden">—</td>
            </tr>
            {model.refractors.map((r) => {
              const i = interpreted.get(r.layer);
              const s = sigma.get(r.layer);
              return (
                <tr
                  key={r.layer}
                  className={`border-b border-rule/60 align-top ${PHONE_ROW}`}
                  data-layer={r.layer}
                >
                  <th
                    scope="row"
                    className={`py-2 pr-3 text-left font-sans text-sm font-medium ${PHONE_HEAD}`}
                  >
                    Layer {r.layer}
                    {r.name ? ` (${r.name})` : ""}
                    <span className="flex items-center justify-between gap-2 text-xs font-normal text-ink-soft">
                      {formatQuantity("velocity", r.velocity, units)}
                      <AnchorCommentsChip
                        anchor={{ kind: "refractor", model: modelIndex, index: r.layer - 1 }}
                        label={`the refractor at the top of layer ${r.layer}`}
                        compact
                        align="start"
                      />
                    </span>
                  </th>
                  <td className={`py-2 pr-3 ${PHONE_CELL}`}>
                    <PhoneLabel>Verdict</PhoneLabel>
                    <span title={VERDICT_MEANINGS[r.status]}>
                      <VerdictBadge verdict={r.status} />
                    </span>
                  </td>
                  <td className={`py-2 pr-3 ${PHONE_CELL}`}>
                    <PhoneLabel>Segment</PhoneLabel>
                    {segmentText(r.segment, units)}
                  </td>
                  <td className={`py-2 pr-3 text-right ${PHONE_CELL}`}>
                    <PhoneLabel>Geophones</PhoneLabel>
                    {r.geophones}
                  </td>
                  <td className={`py-2 pr-3 text-right ${PHONE_CELL}`}>
                    <PhoneLabel>Depth</PhoneLabel>
                    <span className="block">{formatQuantity("length", r.depth, units)} true</span>
                    {i ? (
                      <>
                        <span className="block">
                          {formatQuantity("length", i.interpretedDepth, units)} interpreted
                        </span>
                        {i.error !== null ? (
                          <span
                            className={`block ${i.exceedsTolerance ? "font-semibold text-brick" : "text-ink-soft"}`}
                            data-testid={`depth-error-${r.layer}`}
                          >
                            error {formatSigned("length", i.error, units)}
                            {i.errorPercent !== null
                              ? ` (${formatSigned("percent", i.errorPercent, units)})`
                              : ""}
                          </span>
                        ) : null}
                        {s && s.depthSigma !== null ? (
                          <span
                            className={`block ${s.exceedsTolerance ? "font-semibold text-brick" : "text-ink-soft"}`}
                          >
                            ±{formatQuantity("length", s.depthSigma, units)} from picks
                          </span>
                        ) : null}
                      </>
                    ) : (
                      <span className="block text-ink-faint">
                        {model.interpretation ? "not seen" : "not interpreted"}
                      </span>
                    )}
                  </td>
                  <td className={`py-2 text-right ${PHONE_CELL}`}>
                    <PhoneLabel>Min. thickness</PhoneLabel>
                    {r.minimumThickness === null
                      ? "—"
                      : formatQuantity("length", r.minimumThickness, units)}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <p className="mt-2 text-xs text-ink-soft">
        Segment and geophones: first shot’s longest branch; verdict: worst over every shot branch.
        Interpreted depth: intercept-time method on the resolved segments only, under shot 1; a
        missed inversion reads too deep, a missed thin layer too shallow. Errors beyond the depth
        tolerance ({formatQuantity("length", tolerance, units)}) are marked.
      </p>
      {!model.interpretation ? (
        <p className="mt-2 text-sm text-brick">
          No depths can be interpreted: the direct wave itself is under-sampled on shot 1’s longest
          branch, so the first layer’s velocity is unknown.
        </p>
      ) : null}

      {model.recommendation.hidden.length > 0 ? (
        <ul className="mt-3 space-y-2" aria-label="Layers no spread can reveal">
          {model.recommendation.hidden.map((h) => (
            <li
              key={h.layer}
              className="rounded-md border border-brick/40 bg-brick-soft px-3 py-2 text-sm text-brick"
            >
              <span aria-hidden>⚑ </span>
              {hiddenStatementInUnits(
                h.statement,
                model.refractors.find((r) => r.layer === h.layer)?.minimumThickness,
                units,
              )}
            </li>
          ))}
        </ul>
      ) : null}

      <section
        aria-label="Recommendation"
        className="mt-4 rounded-md border border-rule bg-paper px-4 py-3"
      >
        <h3 className="text-sm font-semibold text-ink-deep">Recommendation</h3>
        <p className="mt-1 text-sm">{recommendationSentence(rec, plan.spread.spacing, units)}</p>
        <p className="mt-1 font-mono text-xs text-ink-soft">
          Largest spacing{" "}
          {rec.maxSpacing === null ? "any" : formatQuantity("length", rec.maxSpacing, units)} ·
          branch length {formatQuantity("length", rec.spreadLength, units)} · {rec.channels}{" "}
          channels
        </p>
        {!readOnly ? (
          <ApplyChoicesPanel
            spread={plan.spread}
            recommendation={rec}
            units={units}
            current={current}
            onApply={onApply}
          />
        ) : null}
      </section>
      <Cautions />
    </div>
  );
}
