import { useEffect, useState } from "react";
import type { Plan } from "@engine";
import { formatQuantity, type UnitSystem } from "@/lib/units";
import { ErrorNotice, Loading } from "@/components/feedback";
import { resolvabilityOf, type ResolvabilitySummary } from "../lib/resolvability";
import { VerdictTag } from "./badges";
import { sentenceInUnits } from "../lib/sentence-units";

/**
 * Resolvability of a revision: the worst verdict, then per ground model each refractor's verdict
 * with its true depth, the depth the intercept-time method would report, and the error.
 */
export function ResolvabilitySummaryView({
  document,
  stored,
  units,
}: {
  document: Plan;
  stored?: unknown;
  units: UnitSystem;
}) {
  // The analysis runs in the modeller's worker; the answer is kept with what it answers.
  const [answer, setAnswer] = useState<{
    document: Plan;
    stored: unknown;
    result: { summary: ResolvabilitySummary } | { error: unknown };
  } | null>(null);
  useEffect(() => {
    let live = true;
    resolvabilityOf(document, stored).then(
      (summary) => live && setAnswer({ document, stored, result: { summary } }),
      (error: unknown) => live && setAnswer({ document, stored, result: { error } }),
    );
    return () => {
      live = false;
    };
  }, [document, stored]);
  const result =
    answer && answer.document === document && answer.stored === stored ? answer.result : null;
  if (!result) return <Loading label="Analysing this revision…" />;
  if ("error" in result)
    return <ErrorNotice error={result.error} title="The engine could not analyse this revision" />;
  const { summary } = result;
  const tolerance = document.criteria.depthTolerance;

  return (
    <div className="flex flex-col gap-4">
      <p className="flex flex-wrap items-center gap-2 text-sm">
        <span className="font-medium text-ink">Worst verdict over every model:</span>
        <VerdictTag verdict={summary.worstVerdict} />
        <span className="text-xs text-ink-soft">
          depth tolerance {formatQuantity("length", tolerance, units, 2)}
        </span>
      </p>
      {summary.models.map((model, m) => (
        <div key={`${m}:${model.name}`}>
          <h3 className="mb-1 flex items-center gap-2 text-sm font-semibold text-ink-deep">
            {model.name} <VerdictTag verdict={model.worstStatus} />
          </h3>
          {model.refractors.length === 0 ? (
            <p className="text-sm text-ink-soft">One layer only: no refractor to resolve.</p>
          ) : (
            <div className="overflow-x-auto">
              {/* Below 640 px each refractor reads as a small labelled block (no sideways scroll). */}
              <table
                className="block w-full text-sm sm:table"
                aria-label={`Resolvability of ${model.name}`}
              >
                <thead className="hidden text-left text-xs tracking-wide text-ink-soft uppercase sm:table-header-group">
                  <tr className="border-b border-rule">
                    <th scope="col" className="py-1.5 pr-3 font-semibold">
                      Refractor
                    </th>
                    <th scope="col" className="py-1.5 pr-3 font-semibold">
                      Verdict
                    </th>
                    <th scope="col" className="py-1.5 pr-3 text-right font-semibold">
                      True depth
                    </th>
                    <th scope="col" className="py-1.5 pr-3 text-right font-semibold">
                      Interpreted
                    </th>
                    <th scope="col" className="py-1.5 text-right font-semibold">
                      Depth error
                    </th>
                  </tr>
                </thead>
                <tbody className="block font-mono text-xs sm:table-row-group">
                  {model.refractors.map((r) => (
                    <tr
                      key={r.layer}
                      className="grid grid-cols-2 items-center gap-x-3 gap-y-1 border-b border-rule/60 py-2 sm:table-row sm:py-0"
                    >
                      <th
                        scope="row"
                        className="py-1.5 pr-3 text-left font-sans text-sm font-medium max-sm:py-0"
                      >
                        Top of layer {r.layer}
                        <span className="block text-xs font-normal text-ink-soft">
                          {r.name ? `${r.name} · ` : ""}
                          {formatQuantity(
                            "velocity",
                            document.models[m]?.layers[r.layer - 1]?.velocity,
                            units,
                          )}
                        </span>
                      </th>
                      <td className="py-1.5 pr-3 max-sm:py-0">
                        <VerdictTag verdict={r.status} />
                      </td>
                      <td className="py-1.5 pr-3 text-right max-sm:py-0 max-sm:text-left max-sm:before:content-['true_depth_']">
                        {formatQuantity("length", r.trueDepth, units, 2)}
                      </td>
                      <td className="py-1.5 pr-3 text-right max-sm:py-0 max-sm:text-left max-sm:before:content-['interpreted_']">
                        {r.interpretedDepth === null
                          ? "not seen"
                          : formatQuantity("length", r.interpretedDepth, units, 2)}
                      </td>
                      <td
                        className={`py-1.5 text-right max-sm:py-0 max-sm:text-left max-sm:before:content-['depth_error_'] ${r.exceedsTolerance ? "font-semibold text-brick" : ""}`}
                      >
                        {r.error === null
                          ? "—"
                          : `${r.error > 0 ? "+" : ""}${formatQuantity("length", r.error, units, 2)}`}
                        {r.exceedsTolerance ? (
                          <span
                            className="ml-1 font-sans"
                            title="beyond the plan's depth tolerance"
                          >
                            ⚠
                          </span>
                        ) : null}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
          {model.recommendation && summary.models.length > 1 ? (
            <p className="mt-1.5 text-xs text-ink-soft">
              {sentenceInUnits(model.recommendation, units)}
            </p>
          ) : null}
        </div>
      ))}
      {summary.recommendation.text ? (
        <p className="rounded-md border border-rule bg-paper/60 px-3 py-2 text-sm text-ink-deep">
          <span className="font-medium">Recommendation at this revision: </span>
          {sentenceInUnits(summary.recommendation.text, units)}
        </p>
      ) : null}
      <p className="text-xs text-ink-faint">
        {summary.source === "stored"
          ? "From the analysis saved with this revision."
          : "Analysed in your browser from this revision's document."}{" "}
        Depth error is the interpreted minus the true depth under the first shot (negative:
        interpreted too shallow; ⚠ beyond the plan's depth tolerance). A design check is a model,
        not ground truth: boreholes and a qualified geophysicist’s review decide.
      </p>
      <p className="text-xs text-ink-faint" data-testid="blind-usage">
        <span className="font-medium">Blind</span> means a thin layer whose head wave is never the
        first arrival (a layer in the blind zone, after Soske 1959); some texts call it a hidden
        layer. A slower layer under a faster one is a velocity inversion.
      </p>
    </div>
  );
}
