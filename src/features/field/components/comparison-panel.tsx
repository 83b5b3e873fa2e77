import { useMemo } from "react";
import { unitLabel, type UnitSystem } from "@/lib/units";
import type { FirstBreakPick } from "@/contracts/field";
import { chartFont, palette } from "@/lib/chart/palette";
import type { ModelFit, MisfitWarning } from "../../../../workers/field/index";
import { useElementWidth } from "@/hooks/use-element-width";
import type { Candidate, Comparison } from "../lib/comparison";
import { length, lengthNumber, localise, ms, signedMs } from "../lib/format";
import { shotPositions } from "../lib/picks";
import { fieldWorker } from "../lib/field-worker";
import { curvePath, lengthTicks, residualScales, tdScales } from "../lib/td-chart";
import { useFieldResult } from "../lib/use-field-result";
import { PICK_COLOURS } from "./record-section";

/** Colours of candidate models on the chart (our own sequence). */
export const MODEL_COLOURS = [
  palette.ink,
  palette.ochre,
  "#2f7d8c",
  "#6a4c7d",
  palette.moss,
  "#8a5a2b",
  "#a04e6a",
  "#3a5f8f",
];
const SHOT_COLOURS = [
  palette.inkDeep,
  palette.brick,
  "#2f7d8c",
  palette.ochre,
  "#6a4c7d",
  palette.moss,
];

export function FitTable({
  comparison,
  candidates,
  selected,
  onSelect,
}: {
  comparison: Comparison;
  candidates: Candidate[];
  selected: number;
  onSelect: (index: number) => void;
}) {
  return (
    <table className="w-full text-left text-sm">
      <caption className="sr-only">How well each ground model fits the picks</caption>
      <thead className="border-b border-rule text-xs tracking-wide text-ink-soft uppercase">
        <tr>
          <th className="py-1.5 pr-2 font-medium">Shown</th>
          <th className="py-1.5 pr-2 font-medium">Ground model</th>
          <th className="py-1.5 pr-2 text-right font-medium">RMS residual</th>
          <th className="hidden py-1.5 pr-2 text-right font-medium sm:table-cell">Mean residual</th>
          <th className="py-1.5 text-right font-medium">
            Picks<span className="hidden sm:inline"> modelled</span>
          </th>
        </tr>
      </thead>
      <tbody>
        {comparison.fits.map((fit: ModelFit, i) => (
          <tr
            key={`${fit.name}-${i}`}
            className={`border-b border-rule/60 ${i === comparison.best ? "bg-moss-soft/60" : ""}`}
          >
            <td className="py-1.5 pr-2">
              <input
                type="radio"
                name="shown-model"
                aria-label={`Show ${fit.name}`}
                checked={i === selected}
                onChange={() => onSelect(i)}
                className="accent-[var(--color-ink)]"
              />
            </td>
            <td className="py-1.5 pr-2">
              <span
                className="mr-2 inline-block h-2.5 w-2.5 rounded-full align-middle"
                style={{ background: MODEL_COLOURS[i % MODEL_COLOURS.length] }}
                aria-hidden
              />
              {fit.name}
              {candidates[i]?.source === "borehole" ? (
                <span className="ml-1 text-xs text-ink-soft">
                  {/* "Borehole log (borehole log, …)" said it twice. */}
                  {/borehole|\blog\b/i.test(fit.name)
                    ? "(not in the plan)"
                    : "(borehole log, not in the plan)"}
                </span>
              ) : null}
              {i === comparison.best ? (
                <span className="ml-2 rounded-full bg-moss px-2 py-0.5 text-xs font-semibold text-card">
                  best fit
                </span>
              ) : null}
            </td>
            <td className="py-1.5 pr-2 text-right font-mono">
              {ms(fit.rms, 2)}
              {/* On a phone the mean residual reads under the RMS (no room for its column). */}
              <span className="block text-xs text-ink-soft sm:hidden">
                mean {signedMs(fit.meanResidual, 2)}
              </span>
            </td>
            <td className="hidden py-1.5 pr-2 text-right font-mono sm:table-cell">
              {signedMs(fit.meanResidual, 2)}
            </td>
            <td className="py-1.5 text-right font-mono">
              {fit.count}
              {fit.unmodelled > 0 ? (
                <span className="text-ochre"> ({fit.unmodelled} without a time)</span>
              ) : null}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** A tick number as read on a chart: "−5", "0", "12.5" (a true minus sign). */
const tickText = (v: number) => {
  const text = String(Number(v.toFixed(6)));
  return text.startsWith("-") ? `−${text.slice(1)}` : text;
};

const FRAME = { height: 320, margin: { left: 56, right: 16, top: 14, bottom: 40 } };

/** Observed picks over the modelled first arrivals of every candidate, per shot. */
export function TimeDistanceChart({
  picks,
  candidates,
  selected,
  spreadExtent,
  units,
}: {
  picks: readonly FirstBreakPick[];
  candidates: Candidate[];
  selected: number;
  spreadExtent: [number, number];
  units: UnitSystem;
}) {
  const { ref, width } = useElementWidth<HTMLDivElement>(760);
  const span = useMemo(() => {
    const shots = shotPositions(picks);
    const positions = picks.flatMap((p) => [p.receiverPosition, p.sourcePosition]);
    const from = Math.min(spreadExtent[0], ...positions);
    const to = Math.max(spreadExtent[1], ...positions);
    return { shots, from, to, models: candidates.map((c) => c.model) };
  }, [picks, candidates, spreadExtent]);
  // The curves are sampled in the field worker; until they arrive the picks are drawn alone.
  const modelled = useFieldResult("curves", span, (s) =>
    fieldWorker().modelledCurves(s.models, s.shots, s.from, s.to),
  ).data;
  const chart = useMemo(() => {
    const { shots, from, to } = span;
    const frame = { ...FRAME, width };
    const scales = tdScales(frame, picks, [from, to], modelled?.maxTime ?? 0);
    const curves = (modelled?.curves ?? []).flatMap((perShot, ci) =>
      perShot.map((c) => ({
        key: `${ci}-${c.sourcePosition}`,
        index: ci,
        path: curvePath(c, scales),
      })),
    );
    return { frame, scales, curves, shots };
  }, [span, modelled, picks, width]);
  const { frame, scales, curves, shots } = chart;
  const xTicks = lengthTicks(scales.x, units, 10);
  const yTicks = scales.y.ticks(6);
  return (
    <div ref={ref} className="w-full">
      <svg
        width={frame.width}
        height={frame.height}
        viewBox={`0 0 ${frame.width} ${frame.height}`}
        className="block h-auto max-w-full"
        role="img"
        aria-label={`Time–distance chart: ${picks.length} observed picks over the modelled first arrivals of ${candidates.length} ground model${candidates.length === 1 ? "" : "s"}`}
        style={{ fontFamily: chartFont }}
        data-testid="td-chart"
      >
        <rect
          x={frame.margin.left}
          y={frame.margin.top}
          width={frame.width - frame.margin.left - frame.margin.right}
          height={frame.height - frame.margin.top - frame.margin.bottom}
          fill={palette.card}
          stroke={palette.rule}
        />
        {yTicks.map((t) => (
          <g key={`y${t}`}>
            <line
              x1={frame.margin.left}
              x2={frame.width - frame.margin.right}
              y1={scales.y(t)}
              y2={scales.y(t)}
              stroke={palette.rule}
              strokeWidth={0.6}
            />
            <text
              x={frame.margin.left - 6}
              y={scales.y(t)}
              textAnchor="end"
              dominantBaseline="middle"
              fontSize={11}
              fill={palette.inkSoft}
            >
              {Number((t * 1000).toFixed(3))}
            </text>
          </g>
        ))}
        {xTicks.map((t) => (
          <text
            key={`x${t.shown}`}
            x={scales.x(t.si)}
            y={frame.height - frame.margin.bottom + 16}
            textAnchor="middle"
            fontSize={11}
            fill={palette.inkSoft}
          >
            {tickText(t.shown)}
          </text>
        ))}
        <text
          x={(frame.margin.left + frame.width - frame.margin.right) / 2}
          y={frame.height - 6}
          textAnchor="middle"
          fontSize={11}
          fill={palette.ink}
        >
          position along the line ({unitLabel("length", units)})
        </text>
        <text
          transform={`translate(14 ${(frame.margin.top + frame.height - frame.margin.bottom) / 2}) rotate(-90)`}
          textAnchor="middle"
          fontSize={11}
          fill={palette.ink}
        >
          first-break time (ms)
        </text>
        {curves
          .filter((c) => c.index !== selected)
          .map((c) => (
            <path
              key={c.key}
              d={c.path}
              fill="none"
              stroke={MODEL_COLOURS[c.index % MODEL_COLOURS.length]}
              strokeWidth={1.2}
              strokeOpacity={0.55}
              strokeDasharray="5 3"
            />
          ))}
        {curves
          .filter((c) => c.index === selected)
          .map((c) => (
            <path
              key={c.key}
              d={c.path}
              fill="none"
              stroke={MODEL_COLOURS[c.index % MODEL_COLOURS.length]}
              strokeWidth={2.2}
            />
          ))}
        {picks.map((p) => (
          <circle
            key={`${p.sourcePosition}|${p.receiverPosition}`}
            cx={scales.x(p.receiverPosition)}
            cy={scales.y(p.time)}
            r={3.2}
            fill={PICK_COLOURS[p.origin]}
            stroke={palette.card}
            strokeWidth={0.8}
          >
            <title>{`shot ${length(p.sourcePosition, units)}, geophone ${length(p.receiverPosition, units)}: ${ms(p.time, 2)} (${p.origin})`}</title>
          </circle>
        ))}
        {shots.map((s, i) => (
          <g
            key={`s${s}`}
            transform={`translate(${scales.x(s)} ${frame.height - frame.margin.bottom})`}
          >
            <path d="M -5 0 L 5 0 L 0 -8 Z" fill={SHOT_COLOURS[i % SHOT_COLOURS.length]} />
          </g>
        ))}
      </svg>
      <p className="mt-1 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft">
        <span>
          <span
            className="mr-1 inline-block h-2.5 w-2.5 rounded-full align-middle"
            style={{ background: PICK_COLOURS.auto }}
          />
          automatic pick
        </span>
        <span>
          <span
            className="mr-1 inline-block h-2.5 w-2.5 rounded-full align-middle"
            style={{ background: PICK_COLOURS.adjusted }}
          />
          adjusted by hand
        </span>
        <span>
          <span
            className="mr-1 inline-block h-2.5 w-2.5 rounded-full align-middle"
            style={{ background: PICK_COLOURS.csv }}
          />
          from a CSV
        </span>
        <span>
          solid line: the model shown; dashed: the other candidates; triangles: shot points
        </span>
      </p>
    </div>
  );
}

/** Residual (observed − modelled) per geophone for the model shown, one colour per shot. */
export function ResidualChart({
  fit,
  pickError,
  units,
}: {
  fit: ModelFit;
  pickError: number;
  units: UnitSystem;
}) {
  const { ref, width } = useElementWidth<HTMLDivElement>(760);
  const frame = { width, height: 210, margin: { left: 56, right: 16, top: 10, bottom: 44 } };
  const { margin, height } = frame;
  const rows = fit.residuals;
  const { x, y, xTicks, yTicks } = residualScales(
    frame,
    rows,
    Math.max(2 * pickError, 0.001),
    units,
  );
  const shots = shotPositions(rows);
  const barWidth = Math.max(
    2,
    Math.min(8, ((width - margin.left - margin.right) / Math.max(1, rows.length)) * 0.6),
  );
  const lenUnit = unitLabel("length", units);
  return (
    <div ref={ref} className="w-full">
      <svg
        width={width}
        height={height}
        viewBox={`0 0 ${width} ${height}`}
        className="block h-auto max-w-full"
        role="img"
        aria-label={`Residuals per geophone against ${fit.name}`}
        style={{ fontFamily: chartFont }}
        data-testid="residual-chart"
      >
        <rect
          x={margin.left}
          y={y(2 * pickError)}
          width={width - margin.left - margin.right}
          height={Math.max(0, y(-2 * pickError) - y(2 * pickError))}
          fill={palette.mossSoft}
          opacity={0.7}
        />
        <g data-testid="residual-y-ticks">
          {yTicks.map((t) => (
            <g key={`y${t}`}>
              <line
                x1={margin.left}
                x2={width - margin.right}
                y1={y(t)}
                y2={y(t)}
                stroke={palette.rule}
                strokeWidth={0.6}
              />
              <text
                x={margin.left - 6}
                y={y(t)}
                textAnchor="end"
                dominantBaseline="middle"
                fontSize={11}
                fill={palette.inkSoft}
              >
                {tickText(t * 1000)}
              </text>
            </g>
          ))}
        </g>
        <g data-testid="residual-x-ticks">
          {xTicks.map((t) => (
            <g key={`x${t.shown}`}>
              <line
                x1={x(t.si)}
                x2={x(t.si)}
                y1={height - margin.bottom}
                y2={height - margin.bottom + 4}
                stroke={palette.inkSoft}
              />
              <text
                x={x(t.si)}
                y={height - margin.bottom + 16}
                textAnchor="middle"
                fontSize={11}
                fill={palette.inkSoft}
              >
                {tickText(t.shown)}
              </text>
            </g>
          ))}
        </g>
        <line
          x1={margin.left}
          x2={width - margin.right}
          y1={height - margin.bottom}
          y2={height - margin.bottom}
          stroke={palette.rule}
        />
        <line
          x1={margin.left}
          x2={width - margin.right}
          y1={y(0)}
          y2={y(0)}
          stroke={palette.inkSoft}
        />
        {rows.map((r) =>
          r.residual === null ? null : (
            <rect
              key={`${r.sourcePosition}|${r.receiverPosition}`}
              x={
                x(r.receiverPosition) -
                barWidth / 2 +
                (shots.indexOf(r.sourcePosition) - (shots.length - 1) / 2) * (barWidth * 0.35)
              }
              y={Math.min(y(r.residual), y(0))}
              width={barWidth}
              height={Math.max(1, Math.abs(y(r.residual) - y(0)))}
              fill={SHOT_COLOURS[shots.indexOf(r.sourcePosition) % SHOT_COLOURS.length]}
              opacity={Math.abs(r.residual) > 2 * pickError ? 1 : 0.55}
            >
              <title>{`shot ${length(r.sourcePosition, units)}, geophone ${length(r.receiverPosition, units)}: ${signedMs(r.residual, 2)}`}</title>
            </rect>
          ),
        )}
        <text
          x={(margin.left + width - margin.right) / 2}
          y={height - 6}
          textAnchor="middle"
          fontSize={11}
          fill={palette.ink}
        >
          geophone position ({lenUnit})
        </text>
        <text
          transform={`translate(14 ${(margin.top + height - margin.bottom) / 2}) rotate(-90)`}
          textAnchor="middle"
          fontSize={11}
          fill={palette.ink}
        >
          residual (ms)
        </text>
      </svg>
      <p className="mt-1 flex flex-wrap gap-x-4 text-xs text-ink-soft">
        {shots.map((s, i) => (
          <span key={s}>
            <span
              className="mr-1 inline-block h-2.5 w-2.5 align-middle"
              style={{ background: SHOT_COLOURS[i % SHOT_COLOURS.length] }}
            />
            shot at {length(s, units)}
          </span>
        ))}
        <span>green band: within ±2σ of the plan's pick error ({ms(pickError, 2)})</span>
      </p>
    </div>
  );
}

export function ResidualTable({ fit, units }: { fit: ModelFit; units: UnitSystem }) {
  const lenUnit = unitLabel("length", units);
  return (
    <details className="mt-2">
      <summary className="cursor-pointer text-sm font-medium text-ink">
        Residuals per geophone (table)
      </summary>
      <div className="mt-2 max-h-72 overflow-y-auto">
        <table className="w-full text-left font-mono text-xs">
          <caption className="sr-only">Residuals per geophone against {fit.name}</caption>
          <thead className="sticky top-0 bg-card text-ink-soft">
            <tr>
              <th className="py-1 pr-2 font-medium">Shot ({lenUnit})</th>
              <th className="py-1 pr-2 font-medium">Geophone ({lenUnit})</th>
              <th className="py-1 pr-2 text-right font-medium">Offset ({lenUnit})</th>
              <th className="py-1 pr-2 text-right font-medium">Observed</th>
              <th className="py-1 pr-2 text-right font-medium">Modelled</th>
              <th className="py-1 text-right font-medium">Residual</th>
            </tr>
          </thead>
          <tbody>
            {fit.residuals.map((r) => (
              <tr
                key={`${r.sourcePosition}|${r.receiverPosition}`}
                className="border-t border-rule/50"
              >
                <td className="py-0.5 pr-2">{lengthNumber(r.sourcePosition, units)}</td>
                <td className="py-0.5 pr-2">{lengthNumber(r.receiverPosition, units)}</td>
                <td className="py-0.5 pr-2 text-right">{lengthNumber(r.offset, units)}</td>
                <td className="py-0.5 pr-2 text-right">{ms(r.time, 2)}</td>
                <td className="py-0.5 pr-2 text-right">{ms(r.modelled, 2)}</td>
                <td className="py-0.5 text-right">{signedMs(r.residual, 2)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}

const WARNING_TITLES: Record<MisfitWarning["kind"], string> = {
  early: "Picks systematically early",
  late: "Picks systematically late",
  "extra-break": "A slope change the model lacks",
  "missing-break": "A modelled slope change the picks lack",
  outlier: "A pick off its neighbours' trend",
};

/** Misfit patterns, stated plainly. A missed layer is brick red; other patterns ochre. */
export function MisfitWarnings({
  warnings,
  modelName,
  units,
}: {
  warnings: MisfitWarning[];
  modelName: string;
  units: UnitSystem;
}) {
  if (warnings.length === 0) {
    return (
      <p
        role="status"
        className="rounded-md border border-moss/40 bg-moss-soft px-4 py-2 text-sm text-ink-deep"
      >
        No misfit pattern against {modelName}: residuals scatter about zero within the pick error.
      </p>
    );
  }
  return (
    <ul className="flex flex-col gap-2" aria-label="Misfit warnings">
      {warnings.map((w, i) => {
        const missedLayer =
          w.kind === "extra-break" ||
          (w.kind === "early" && /layer the plan missed/.test(w.message));
        return (
          <li
            key={i}
            className={`rounded-md border px-4 py-2 text-sm text-ink-deep ${missedLayer ? "border-brick/50 bg-brick-soft" : "border-ochre/50 bg-ochre-soft"}`}
          >
            <p className="font-semibold">
              {WARNING_TITLES[w.kind]} — shot at {length(w.sourcePosition, units)},{" "}
              {w.side === "forward" ? "geophones beyond the shot" : "geophones before the shot"},{" "}
              {w.from === w.to
                ? `offset ${length(w.from, units)}`
                : `offsets ${length(w.from, units)}–${length(w.to, units)}`}
            </p>
            <p>{localise(w.message, units)}</p>
          </li>
        );
      })}
    </ul>
  );
}
