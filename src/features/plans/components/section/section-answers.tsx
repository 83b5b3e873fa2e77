import { useMemo, useState } from "react";
import { ErrorNotice, Notice } from "@/components/feedback";
import { useElementWidth } from "@/hooks/use-element-width";
import { chartFont, palette } from "@/lib/chart/palette";
import { formatQuantity, formatSigned, type UnitSystem } from "@/lib/units";
import { readingInUnits } from "../../lib/recommendation-text";
import type { CoverageStretch, InterfaceCoverage, SectionModelAnalysis } from "@engine";
import { useLatestResult } from "../../hooks/use-latest-result";
import type { Plan } from "../../lib/engine";
import { modeller } from "../../lib/modeller-client";
import { objectId } from "../../lib/object-id";
import type { SectionDraft } from "../../lib/plan-form";
import {
  arrivalsPlot,
  featureVerdict,
  geophoneWord,
  orderStretches,
  rayColour,
  recommendationFor,
  sideWord,
  STRETCH_STYLE,
} from "../../lib/section-answers";
import { boreholeTop, deepestDepth } from "../../lib/section-boreholes";
import { buildSectionView } from "../../lib/section-view";
import { VerdictBadge } from "../verdict-badge";
import { SectionAxes, SectionGrid } from "./section-axes";
import { SectionFigure } from "./section-figure";
import {
  BoreholeLogs,
  FeatureOverlay,
  InterpretationOverlay,
  RayOverlay,
  READING_DASH,
  ReadingOverlay,
  StretchOverlay,
} from "./section-overlays";
import type { SectionReading } from "../../../../../workers/field/section-reading";

export type SectionTab = "arrivals" | "section" | "resolvability";

/** How the modeller gridded the section and what it warns about, shown above every answer. */
export function SectionGridNote({
  analysis,
  units,
}: {
  analysis: SectionModelAnalysis;
  units: UnitSystem;
}) {
  const { grid, warnings } = analysis.section;
  const why =
    grid.cellSizeSource === "plan"
      ? "set in the plan"
      : grid.cellSizeSource === "limit"
        ? "coarsened to keep the grid within the modeller's limit"
        : "chosen from the thinnest layer and the spacing";
  return (
    <div className="mb-3 space-y-2">
      {warnings.length > 0 ? (
        <div
          role="alert"
          className="rounded-md border-2 border-ochre bg-ochre-soft px-3 py-2 text-sm text-ink-deep"
        >
          <p className="font-semibold">
            {warnings.length === 1 ? "Warning" : `${warnings.length} warnings`} from the modeller
          </p>
          <ul className="mt-1 list-disc pl-5">
            {warnings.map((w, i) => (
              <li key={i}>{w}</li>
            ))}
          </ul>
        </div>
      ) : null}
      <p className="text-xs text-ink-soft">
        2-D first-arrival modeller: grid cell{" "}
        <span className="font-mono font-medium text-ink-deep">
          {formatQuantity("length", grid.cellSize, units)}
        </span>{" "}
        ({why}), {grid.nx} × {grid.nz} nodes.
      </p>
    </div>
  );
}

/** The interpreted interfaces' worst depth error in one sentence. */
function worstSentence(analysis: SectionModelAnalysis, section: SectionDraft, units: UnitSystem) {
  const w = analysis.section.interpretation.worst;
  if (!w) return "No interface could be interpreted from these arrivals.";
  const name = section.layers[w.layer - 1]?.name || `layer ${w.layer}`;
  return `Interpreted by the intercept-time method under each shot, the top of ${name} is off by ${formatSigned("length", w.error, units)} at worst, at ${formatQuantity("length", w.position, units)} (positive: interpreted too deep).`;
}

/** The plus-minus reading's worst depth error in one line (null without a reading). */
export function readingSentence(reading: SectionReading | null, units: UnitSystem): string | null {
  const pm = reading?.readings.find((r) => r.method === "plus-minus");
  if (!pm) return null;
  if (!pm.worst) {
    return `No interface could be read by the plus-minus method${pm.notes.length ? `: ${pm.notes[0]}` : "."}`;
  }
  return `Worst depth error of a plus-minus reading: ${formatSigned("length", pm.worst.error, units)} at ${formatQuantity("length", pm.worst.position, units)}.`;
}

/** "S2 (far) reverse" for a stretch's shot branch, "—" for none. */
function branchText(plan: Plan, s: CoverageStretch) {
  if (s.shot === null) return "—";
  const label = plan.spread.shots[s.shot]?.label;
  return `S${s.shot + 1} ${label ? `(${label}) ` : ""}${sideWord(s.side)}`;
}

/**
 * The interface features the spread misses (judged feature stretches), highlighted above the
 * interface's table: feature, where, exit-point geophones and branch, and beside it the
 * recommendation that would sample it.
 */
function WeakFeatures({
  coverage,
  analysis,
  plan,
  units,
}: {
  coverage: InterfaceCoverage;
  analysis: SectionModelAnalysis;
  plan: Plan;
  units: UnitSystem;
}) {
  const weak = coverage.stretches.filter((s) => s.feature !== undefined && s.judged);
  if (weak.length === 0) return null;
  // one entry per feature: the branches that flag the same feature share it
  const groups: CoverageStretch[][] = [];
  for (const s of weak) {
    const g = groups.find(
      (h) =>
        h[0].feature === s.feature &&
        Math.abs(h[0].from - s.from) < 1e-3 &&
        Math.abs(h[0].to - s.to) < 1e-3,
    );
    if (g) g.push(s);
    else groups.push([s]);
  }
  const name = coverage.name || `layer ${coverage.layer}`;
  return (
    <div
      role="group"
      aria-label={`Features of the top of ${name} the spread misses`}
      className="mt-1 rounded-md border-2 border-ochre bg-ochre-soft px-3 py-2"
    >
      <p className="font-semibold text-ink-deep">Missed by this spread</p>
      <ul className="mt-1 space-y-1">
        {groups.map((g, i) => {
          const s = g[0];
          const rec = recommendationFor(analysis.section.recommendations, coverage.layer, s);
          return (
            <li key={i} className="grid gap-x-4 sm:grid-cols-2">
              <span className="text-ink-deep">
                <span className="font-semibold">{s.feature}</span>{" "}
                <span className="font-mono">
                  {formatQuantity("length", s.from, units)} –{" "}
                  {formatQuantity("length", s.to, units)}
                </span>
                : {g.map((b) => `${geophoneWord(b.geophones)} (${branchText(plan, b)})`).join(", ")}
                , under-sampled
              </span>
              {rec ? <span className="text-ink">{readingInUnits(rec.text, units)}</span> : null}
            </li>
          );
        })}
      </ul>
    </div>
  );
}

/**
 * Per interface: its summary sentence, then the stretches sampled by each shot branch with
 * their geophone counts and verdicts, and the recommendations for weak stretches.
 */
export function CoverageDetails({
  analysis,
  plan,
  units,
  table = true,
}: {
  analysis: SectionModelAnalysis;
  plan: Plan;
  units: UnitSystem;
  table?: boolean;
}) {
  return (
    <div className="space-y-3 text-sm">
      {analysis.coverage.map((c) => (
        <section key={c.layer} aria-label={`Top of layer ${c.layer}`}>
          <h4 className="flex flex-wrap items-center gap-2 font-semibold text-ink-deep">
            Top of {c.name || `layer ${c.layer}`} <VerdictBadge verdict={c.status} />
          </h4>
          <p className="mt-0.5 text-ink">{readingInUnits(c.summary, units)}</p>
          <WeakFeatures coverage={c} analysis={analysis} plan={plan} units={units} />
          {table && c.stretches.length > 0 ? (
            <table
              className="mt-1 w-full text-xs"
              aria-label={`Stretches of the top of layer ${c.layer}`}
            >
              <thead className="text-left tracking-wide text-ink-soft uppercase">
                <tr className="border-b border-rule">
                  <th className="py-1 pr-2 font-semibold">Shot branch</th>
                  <th className="py-1 pr-2 font-semibold">Stretch</th>
                  <th className="py-1 pr-2 text-right font-semibold">Geophones</th>
                  <th className="py-1 font-semibold">Verdict</th>
                </tr>
              </thead>
              <tbody>
                {orderStretches(c.stretches).map((s, i) => {
                  const weak = s.feature !== undefined && s.judged;
                  return (
                    <tr
                      key={i}
                      className={
                        weak ? "border-b border-rule/50 bg-ochre-soft" : "border-b border-rule/50"
                      }
                    >
                      <td className="py-1 pr-2">{branchText(plan, s)}</td>
                      <td className="py-1 pr-2">
                        {s.feature !== undefined ? (
                          <span className={weak ? "font-semibold text-ink-deep" : "text-ink"}>
                            {s.feature}{" "}
                          </span>
                        ) : null}
                        <span className="font-mono">
                          {formatQuantity("length", s.from, units)} –{" "}
                          {formatQuantity("length", s.to, units)}
                        </span>
                      </td>
                      <td className="py-1 pr-2 text-right font-mono">
                        {s.geophones}
                        {s.feature !== undefined ? (
                          <span className="font-sans text-ink-soft">
                            {s.geophones === 1 ? " exit point" : " exit points"}
                          </span>
                        ) : null}
                      </td>
                      <td className="py-1">
                        {s.feature !== undefined && !s.judged ? (
                          <span className="text-ink">{featureVerdict(s)}</span>
                        ) : (
                          <VerdictBadge verdict={s.status} />
                        )}
                        {!s.judged && s.feature === undefined ? (
                          <span className="ml-1 text-ink-soft">
                            not judged (runs off the spread)
                          </span>
                        ) : null}
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          ) : null}
        </section>
      ))}
      {analysis.section.recommendations.length > 0 ? (
        <div className="rounded-md border border-ochre/60 bg-ochre-soft/60 px-3 py-2">
          <p className="font-semibold text-ink-deep">To sample the weak stretches</p>
          <ul className="mt-1 list-disc pl-5 text-ink">
            {analysis.section.recommendations.map((r, i) => (
              <li key={i}>{readingInUnits(r.text, units)}</li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}

/** Legend of the section answers (lines and marks as drawn). */
function Legend() {
  const item = (swatch: React.ReactNode, text: string) => (
    <span className="inline-flex items-center gap-1.5">
      <svg width="26" height="10" aria-hidden>
        {swatch}
      </svg>
      {text}
    </span>
  );
  const band = (status: keyof typeof STRETCH_STYLE) => (
    <line
      x1="1"
      x2="25"
      y1="5"
      y2="5"
      stroke={STRETCH_STYLE[status].colour}
      strokeWidth="3.5"
      strokeDasharray={STRETCH_STYLE[status].dash}
    />
  );
  return (
    <p className="mt-1 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft">
      {item(band("resolved"), "stretch resolved")}
      {item(band("under-sampled"), "under-sampled")}
      {item(band("blind"), "blind")}
      {item(
        <>
          <line x1="1" x2="25" y1="5" y2="5" stroke={palette.ochre} strokeWidth="8" />
          <line
            x1="1"
            x2="25"
            y1="5"
            y2="5"
            stroke={palette.inkDeep}
            strokeWidth="8"
            strokeDasharray="1.5 3"
          />
        </>,
        "hatched band on the interface: a feature under-sampled by every shot branch",
      )}
      {item(
        <line
          x1="1"
          x2="25"
          y1="5"
          y2="5"
          stroke={palette.inkDeep}
          strokeWidth="1.6"
          strokeDasharray="5 4"
        />,
        "as a crew would interpret it",
      )}
      {item(
        <line
          x1="1"
          x2="25"
          y1="5"
          y2="5"
          stroke={palette.moss}
          strokeWidth="2"
          strokeDasharray={READING_DASH}
          strokeLinecap="round"
        />,
        "crew's reading: plus-minus",
      )}
      {item(
        <line x1="1" x2="25" y1="5" y2="5" stroke={rayColour(2)} strokeWidth="1.2" />,
        "first-arrival rays (grey: direct wave)",
      )}
      <span>
        S1→ 40: geophones on the stretch for shot 1 shooting forward (one row per shot branch, under
        the interface)
      </span>
    </p>
  );
}

/** The section with the chosen shot's rays, stretches by verdict and the interpretation. */
export function SectionAnswerFigure({
  plan,
  analysis,
  modelIndex,
  shotIndex,
  units,
  showRays = true,
}: {
  plan: Plan;
  analysis: SectionModelAnalysis;
  modelIndex: number;
  shotIndex: number;
  units: UnitSystem;
  showRays?: boolean;
}) {
  const { ref, width } = useElementWidth<HTMLDivElement>(720);
  const [rays, setRays] = useState(showRays);
  const [interpreted, setInterpreted] = useState(true);
  const section = plan.models[modelIndex] as unknown as SectionDraft;
  const field = useLatestResult(
    rays ? { plan, modelIndex, shotIndex } : null,
    rays ? `${objectId(plan)}:${modelIndex}:${shotIndex}` : null,
    (r) => modeller().sectionField(r.plan, r.modelIndex, r.shotIndex),
  );
  // read from the arrivals of the analysis on the page, not a second analysis in the worker
  const reading = useLatestResult(
    interpreted ? { plan, modelIndex, analysis } : null,
    interpreted ? `${objectId(plan)}:${objectId(analysis)}:${modelIndex}:reading` : null,
    async (r) => modeller().sectionReading(r.plan, r.modelIndex, undefined, r.analysis),
  );
  const plusMinus =
    interpreted && reading.result && reading.current
      ? (reading.result.readings.find((r) => r.method === "plus-minus") ?? null)
      : null;
  const include = useMemo(
    () => [
      ...(interpreted
        ? analysis.section.interpretation.interfaces.flatMap((f) =>
            f.points.map((p) => p.elevation),
          )
        : []),
      // the foot of each stored borehole stays inside the figure
      ...(section.boreholes ?? []).map((b) => boreholeTop(section.surface, b) - deepestDepth(b)),
    ],
    [analysis, interpreted, section],
  );
  const view = useMemo(
    () =>
      buildSectionView({
        section,
        spread: plan.spread,
        shotIndex,
        width: Math.max(360, width),
        units,
        exaggeration: "auto",
        include,
      }),
    [section, plan.spread, shotIndex, width, units, include],
  );
  const name = plan.models[modelIndex].name;
  return (
    <div ref={ref} className="min-w-0">
      <div className="mb-1 flex flex-wrap items-center gap-4 text-xs text-ink">
        <label className="flex items-center gap-1.5">
          <input type="checkbox" checked={rays} onChange={(e) => setRays(e.target.checked)} />
          Ray paths of shot {shotIndex + 1}
        </label>
        <label className="flex items-center gap-1.5">
          <input
            type="checkbox"
            checked={interpreted}
            onChange={(e) => setInterpreted(e.target.checked)}
          />
          Interpretation
        </label>
        {rays && field.pending ? <span className="text-ochre">tracing rays…</span> : null}
      </div>
      {rays && field.error ? (
        <ErrorNotice error={field.error} title="The ray paths could not be traced" />
      ) : null}
      <SectionFigure
        view={view}
        title={`Section, ${name}, shot ${shotIndex + 1}: stretches sampled by head waves`}
        units={units}
      >
        {rays && field.result && field.current ? (
          <RayOverlay view={view} rays={field.result.rays} />
        ) : null}
        <StretchOverlay view={view} section={section} coverage={analysis.coverage} />
        <FeatureOverlay view={view} section={section} coverage={analysis.coverage} units={units} />
        {interpreted ? (
          <InterpretationOverlay
            view={view}
            interpretation={analysis.section.interpretation}
            units={units}
          />
        ) : null}
        {plusMinus ? <ReadingOverlay view={view} reading={plusMinus} /> : null}
        <BoreholeLogs
          view={view}
          boreholes={section.boreholes ?? []}
          surface={section.surface}
          units={units}
        />
      </SectionFigure>
      <Legend />
      <p className="mt-2 text-sm text-ink">{worstSentence(analysis, section, units)}</p>
      {interpreted && plusMinus ? (
        <p className="mt-1 text-sm text-ink">
          {readingSentence(reading.result && reading.current ? reading.result : null, units)}
        </p>
      ) : null}
      {interpreted && reading.pending ? (
        <p className="mt-1 text-xs text-ochre">reading the line by the plus-minus method…</p>
      ) : null}
    </div>
  );
}

/** First arrivals of one shot on the section (from the analysis), coloured by the layer they travelled along. */
export function SectionArrivalsChart({
  analysis,
  shotIndex,
  units,
  title,
  layerNames,
}: {
  analysis: SectionModelAnalysis;
  shotIndex: number;
  units: UnitSystem;
  title: string;
  layerNames: string[];
}) {
  const { ref, width } = useElementWidth<HTMLDivElement>(720);
  const shot = analysis.arrivals.find((a) => a.shot === shotIndex);
  const plot = useMemo(
    () => (shot ? arrivalsPlot(shot, Math.max(360, width), units) : null),
    [shot, width, units],
  );
  if (!shot || !plot) return <Notice>No arrivals for this shot.</Notice>;
  const { margin, height } = plot;
  const vias = [...new Set(plot.points.map((p) => p.via))].sort();
  return (
    <div ref={ref} className="min-w-0">
      <svg
        role="img"
        aria-label={title}
        viewBox={`0 0 ${plot.width} ${height}`}
        width="100%"
        style={{ maxWidth: plot.width }}
        fontFamily={chartFont}
      >
        <title>{title}</title>
        <rect width={plot.width} height={height} fill={palette.card} />
        <SectionGrid frame={plot} yTicks={plot.yTicks} />
        <SectionAxes
          frame={plot}
          xTicks={plot.xTicks}
          yTicks={plot.yTicks}
          xLabel={plot.xLabel}
          yLabel={plot.yLabel}
        />
        <line
          x1={plot.shotX}
          x2={plot.shotX}
          y1={margin.top}
          y2={height - margin.bottom}
          stroke={palette.ochre}
          strokeDasharray="3 3"
        />
        {plot.segments.map((s, i) => (
          <path key={i} d={s.path} stroke={s.colour} strokeWidth={1.4} fill="none" />
        ))}
        {plot.points.map((p, i) => (
          <circle key={i} cx={p.px} cy={p.py} r={2.6} fill={p.colour}>
            <title>{`${formatQuantity("length", p.position, units)}: ${formatQuantity("time", p.time, units)}`}</title>
          </circle>
        ))}
      </svg>
      <p className="mt-1 flex flex-wrap gap-x-4 text-xs text-ink-soft">
        {vias.map((v) => (
          <span key={v} className="inline-flex items-center gap-1.5">
            <span
              className="inline-block h-2.5 w-2.5 rounded-full"
              style={{ background: plot.points.find((p) => p.via === v)?.colour }}
            />
            {v === 1
              ? "direct wave"
              : `head wave along the top of ${layerNames[v - 1] || `layer ${v}`}`}
          </span>
        ))}
      </p>
    </div>
  );
}

/** The answers for a section model in the designer's results (one tab at a time). */
export function SectionAnswers({
  plan,
  analysis,
  modelIndex,
  shotIndex,
  units,
  tab,
}: {
  plan: Plan;
  analysis: SectionModelAnalysis;
  modelIndex: number;
  shotIndex: number;
  units: UnitSystem;
  tab: SectionTab;
}) {
  const model = plan.models[modelIndex];
  const names = model.layers.map((l, i) => l.name || `layer ${i + 1}`);
  return (
    <div>
      <SectionGridNote analysis={analysis} units={units} />
      {tab === "arrivals" ? (
        <SectionArrivalsChart
          analysis={analysis}
          shotIndex={shotIndex}
          units={units}
          title={`Arrivals, ${model.name}, shot ${shotIndex + 1}`}
          layerNames={names}
        />
      ) : null}
      {tab === "section" ? (
        <>
          <SectionAnswerFigure
            plan={plan}
            analysis={analysis}
            modelIndex={modelIndex}
            shotIndex={shotIndex}
            units={units}
          />
          <div className="mt-3">
            <CoverageDetails analysis={analysis} plan={plan} units={units} table={false} />
          </div>
        </>
      ) : null}
      {tab === "resolvability" ? (
        <CoverageDetails analysis={analysis} plan={plan} units={units} />
      ) : null}
    </div>
  );
}

/** A read-only section with its stretches and verdicts (the Review screen). */
export function SectionReadOnly({
  plan,
  analysis,
  modelIndex,
  units,
}: {
  plan: Plan;
  analysis: SectionModelAnalysis;
  modelIndex: number;
  units: UnitSystem;
}) {
  return (
    <div>
      <SectionGridNote analysis={analysis} units={units} />
      <SectionAnswerFigure
        plan={plan}
        analysis={analysis}
        modelIndex={modelIndex}
        shotIndex={0}
        units={units}
        showRays={false}
      />
      <div className="mt-3">
        <CoverageDetails analysis={analysis} plan={plan} units={units} />
      </div>
    </div>
  );
}
