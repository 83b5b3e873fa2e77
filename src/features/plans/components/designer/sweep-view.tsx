import { useEffect, useId, useMemo, useRef, useState } from "react";
import { useNavigate } from "react-router-dom";
import type { PlanDetail } from "@/contracts/plans";
import { useMe } from "@/features/auth/api/me";
import { Button } from "@/components/button";
import { Card, ErrorNotice, Notice } from "@/components/feedback";
import { paths } from "@/app/paths";
import { palette, chartFont } from "@/lib/chart/palette";
import { formatInput, parseInput, unitLabel, type UnitSystem } from "@/lib/units";
import { useCreatePlan } from "../../api/create-plan";
import { useElementWidth } from "@/hooks/use-element-width";
import type { Plan, SweepResult } from "../../lib/engine";
import { isSuperseded, modeller } from "../../lib/modeller-client";
import { buildHeatmap, CELL_FILL, heatmapImage, type HeatCell } from "../../lib/sweep-heatmap";
import {
  defaultAxisRange,
  defaultParameterRange,
  planAtCell,
  sweepSpec,
  type SweepParameterKind,
} from "../../lib/sweep-plan";
import { mayCreatePlan } from "../plans-list";
import { VERDICT_LABELS } from "../verdict-badge";
import { SectionSweep } from "../section/section-sweep";
import { SweepReading } from "./sweep-reading";

/** Most steps along either side of the grid (a 200 × 200 sweep takes about a second). */
const MAX_STEPS = 200;

interface Setup {
  modelIndex: number;
  layer: number;
  kind: SweepParameterKind;
  from: string;
  to: string;
  steps: string;
  axis: "spacing" | "channels";
  axisFrom: string;
  axisTo: string;
  axisSteps: string;
}

function initialSetup(plan: Plan, units: UnitSystem): Setup {
  const layers = plan.models[0].layers;
  // Start with the thinnest layer above the half-space: the likeliest to hide.
  let layer = layers.length;
  let thinnest = Number.POSITIVE_INFINITY;
  layers.slice(0, -1).forEach((l, i) => {
    if ((l.thickness ?? Number.POSITIVE_INFINITY) < thinnest) {
      thinnest = l.thickness ?? Number.POSITIVE_INFINITY;
      layer = i + 1;
    }
  });
  const kind: SweepParameterKind = layers.length > 1 ? "thickness" : "velocity";
  const [lo, hi] = defaultParameterRange(plan, 0, layer, kind);
  const [a, b] = defaultAxisRange(plan, "spacing");
  const q = kind === "thickness" ? "length" : "velocity";
  return {
    modelIndex: 0,
    layer,
    kind,
    from: formatInput(q, lo, units),
    to: formatInput(q, hi, units),
    steps: "24",
    axis: "spacing",
    axisFrom: formatInput("length", a, units),
    axisTo: formatInput("length", b, units),
    axisSteps: "24",
  };
}

/**
 * Design sweep: the verdict over a grid of spacing (or channels) × one layer's thickness or
 * velocity, computed by the modeller with progress and cancel. A cell applies to a copy.
 */
export function SweepView({
  plan,
  detail,
  units,
}: {
  plan: Plan | null;
  detail: PlanDetail;
  units: UnitSystem;
}) {
  if (!plan) {
    return (
      <Card>
        <Notice tone="caution">
          Fix the marked fields in Ground models and Spread to run a sweep.
        </Notice>
      </Card>
    );
  }
  return (
    <>
      <SweepEditor plan={plan} detail={detail} units={units} />
      <SectionSweep plan={plan} units={units} />
    </>
  );
}

function SweepEditor({
  plan,
  detail,
  units,
}: {
  plan: Plan;
  detail: PlanDetail;
  units: UnitSystem;
}) {
  const [setup, setSetup] = useState(() => initialSetup(plan, units));
  const [running, setRunning] = useState(false);
  const [progress, setProgress] = useState(0);
  const [result, setResult] = useState<{
    result: SweepResult;
    plan: Plan;
    modelIndex: number;
  } | null>(null);
  const [error, setError] = useState<unknown>(null);
  const [cancelled, setCancelled] = useState(false);
  const abort = useRef<AbortController | null>(null);
  const model = plan.models[Math.min(setup.modelIndex, plan.models.length - 1)];
  const length = unitLabel("length", units);
  const velocity = unitLabel("velocity", units);
  const paramUnit = setup.kind === "thickness" ? length : velocity;
  useEffect(() => () => abort.current?.abort(), []);

  const update = (patch: Partial<Setup>) => {
    setSetup((s) => {
      const next = { ...s, ...patch };
      if ("layer" in patch || "kind" in patch || "modelIndex" in patch) {
        const [lo, hi] = defaultParameterRange(plan, next.modelIndex, next.layer, next.kind);
        const q = next.kind === "thickness" ? "length" : "velocity";
        next.from = formatInput(q, lo, units);
        next.to = formatInput(q, hi, units);
      }
      if ("axis" in patch) {
        const [a, b] = defaultAxisRange(plan, next.axis);
        next.axisFrom = next.axis === "spacing" ? formatInput("length", a, units) : String(a);
        next.axisTo = next.axis === "spacing" ? formatInput("length", b, units) : String(b);
      }
      return next;
    });
  };

  const q = setup.kind === "thickness" ? "length" : "velocity";
  const axisQ = setup.axis === "spacing" ? "length" : "count";
  const numbers = {
    from: parseInput(q, setup.from, units),
    to: parseInput(q, setup.to, units),
    steps: parseInput("count", setup.steps, units),
    axisFrom: parseInput(axisQ, setup.axisFrom, units),
    axisTo: parseInput(axisQ, setup.axisTo, units),
    axisSteps: parseInput("count", setup.axisSteps, units),
  };
  const problems: string[] = [];
  const positive = (v: number | undefined, label: string) => {
    if (v === undefined || !Number.isFinite(v)) problems.push(`${label} must be a number`);
    else if (v <= 0) problems.push(`${label} must be > 0`);
  };
  positive(numbers.from, "parameter from");
  positive(numbers.to, "parameter to");
  positive(numbers.axisFrom, `${setup.axis} from`);
  positive(numbers.axisTo, `${setup.axis} to`);
  for (const [v, label] of [
    [numbers.steps, "parameter steps"],
    [numbers.axisSteps, `${setup.axis} steps`],
  ] as const) {
    if (v === undefined || !Number.isInteger(v) || v < 2 || v > MAX_STEPS)
      problems.push(`${label} must be a whole number from 2 to ${MAX_STEPS}`);
  }
  if (setup.kind === "thickness" && setup.layer >= model.layers.length)
    problems.push("the last layer is a half-space: sweep its velocity instead");

  const run = async () => {
    if (problems.length > 0) return;
    abort.current?.abort();
    const controller = new AbortController();
    abort.current = controller;
    setRunning(true);
    setProgress(0);
    setError(null);
    setCancelled(false);
    const modelIndex = Math.min(setup.modelIndex, plan.models.length - 1);
    try {
      const spec = sweepSpec({
        modelIndex,
        axis: setup.axis,
        axisRange: [numbers.axisFrom as number, numbers.axisTo as number],
        axisSteps: numbers.axisSteps as number,
        layer: setup.layer,
        kind: setup.kind,
        range: [numbers.from as number, numbers.to as number],
        steps: numbers.steps as number,
      });
      const answer = await modeller().sweep(plan, spec, {
        onProgress: (f) => {
          if (!controller.signal.aborted) setProgress(f);
        },
        signal: controller.signal,
      });
      if (abort.current === controller) setResult({ result: answer, plan, modelIndex });
    } catch (e) {
      if (abort.current !== controller) return;
      if (isSuperseded(e)) setCancelled(true);
      else setError(e);
    } finally {
      if (abort.current === controller) setRunning(false);
    }
  };

  const ids = { model: useId(), layer: useId(), kind: useId(), axis: useId() };

  return (
    <div className="grid gap-5 xl:grid-cols-[minmax(0,2fr)_minmax(0,5fr)]">
      {/* The sweep's settings are a form, not printed; the heatmap's caption names its axes. */}
      <Card className="print:hidden">
        <h2 className="mb-3 text-lg font-semibold text-ink-deep">Design sweep</h2>
        <form
          noValidate
          className="flex flex-col gap-3 text-sm"
          onSubmit={(e) => {
            e.preventDefault();
            void run();
          }}
        >
          {plan.models.length > 1 ? (
            <div className="flex flex-col gap-1">
              <label htmlFor={ids.model} className="font-medium text-ink">
                Ground model
              </label>
              <select
                id={ids.model}
                className="field-input"
                value={setup.modelIndex}
                onChange={(e) => update({ modelIndex: Number(e.target.value), layer: 1 })}
              >
                {plan.models.map((m, i) => (
                  <option key={i} value={i}>
                    {m.name}
                  </option>
                ))}
              </select>
            </div>
          ) : null}
          {/* One column: a layer's full name fits its box (issue 14: no truncated names). */}
          <div className="grid grid-cols-1 gap-2">
            <div className="flex flex-col gap-1">
              <label htmlFor={ids.layer} className="font-medium text-ink">
                Layer
              </label>
              <select
                id={ids.layer}
                className="field-input"
                value={setup.layer}
                onChange={(e) => update({ layer: Number(e.target.value) })}
              >
                {model.layers.map((l, i) => (
                  <option key={i} value={i + 1}>
                    {i + 1}
                    {l.name ? `: ${l.name}` : ""}
                  </option>
                ))}
              </select>
            </div>
            <div className="flex flex-col gap-1">
              <label htmlFor={ids.kind} className="font-medium text-ink">
                Parameter
              </label>
              <select
                id={ids.kind}
                className="field-input"
                value={setup.kind}
                onChange={(e) => update({ kind: e.target.value as SweepParameterKind })}
              >
                <option value="thickness">thickness</option>
                <option value="velocity">velocity</option>
              </select>
            </div>
          </div>
          <RangeRow
            label={`From, to (${paramUnit}) and steps`}
            names={["Parameter from", "Parameter to", "Parameter steps"]}
            values={[setup.from, setup.to, setup.steps]}
            onChange={([from, to, steps]) => update({ from, to, steps })}
          />
          <div className="flex flex-col gap-1">
            <label htmlFor={ids.axis} className="font-medium text-ink">
              Against
            </label>
            <select
              id={ids.axis}
              className="field-input"
              value={setup.axis}
              onChange={(e) => update({ axis: e.target.value as "spacing" | "channels" })}
            >
              <option value="spacing">geophone spacing</option>
              <option value="channels">channel count</option>
            </select>
          </div>
          <RangeRow
            label={
              setup.axis === "spacing"
                ? `From, to (${length}) and steps`
                : "From, to (channels) and steps"
            }
            names={[`${setup.axis} from`, `${setup.axis} to`, `${setup.axis} steps`]}
            values={[setup.axisFrom, setup.axisTo, setup.axisSteps]}
            onChange={([axisFrom, axisTo, axisSteps]) => update({ axisFrom, axisTo, axisSteps })}
          />
          <p className="text-xs text-ink-soft">
            Anchored shots follow the spread as it grows or shrinks; fixed shots stay. Other layers
            keep their values.
          </p>
          {problems.length > 0 ? (
            <ul role="alert" className="text-xs font-medium text-brick">
              {problems.map((p) => (
                <li key={p}>{p}</li>
              ))}
            </ul>
          ) : null}
          <div className="flex gap-2">
            <Button type="submit" disabled={running || problems.length > 0}>
              Run sweep
            </Button>
            {running ? (
              <Button variant="secondary" onClick={() => abort.current?.abort()}>
                Cancel
              </Button>
            ) : null}
          </div>
          {running || progress > 0 ? (
            <div>
              <div
                role="progressbar"
                aria-label="Sweep progress"
                aria-valuemin={0}
                aria-valuemax={100}
                aria-valuenow={Math.round(progress * 100)}
                className="h-2 overflow-hidden rounded-full bg-paper-deep"
              >
                <div
                  className="h-full bg-ink transition-[width]"
                  style={{ width: `${progress * 100}%` }}
                />
              </div>
              <p className="mt-1 text-xs text-ink-soft">
                {running
                  ? `${Math.round(progress * 100)}% computed`
                  : cancelled
                    ? result
                      ? "Cancelled: the previous grid stays shown"
                      : "Cancelled"
                    : "Done"}
              </p>
            </div>
          ) : null}
          {error ? <ErrorNotice error={error} title="The sweep failed" /> : null}
        </form>
      </Card>
      <Card className="min-w-0">
        {result ? (
          <Heatmap
            result={result.result}
            plan={result.plan}
            modelIndex={result.modelIndex}
            detail={detail}
            units={units}
          />
        ) : (
          <Notice>Choose a layer parameter and a spread range, then run the sweep.</Notice>
        )}
      </Card>
    </div>
  );
}

function RangeRow({
  label,
  names,
  values,
  onChange,
}: {
  label: string;
  names: [string, string, string];
  values: [string, string, string];
  onChange: (values: [string, string, string]) => void;
}) {
  return (
    <fieldset className="flex flex-col gap-1">
      <legend className="mb-1 font-medium text-ink">{label}</legend>
      <div className="grid grid-cols-3 gap-2">
        {values.map((v, i) => (
          <input
            key={i}
            aria-label={names[i]}
            inputMode="decimal"
            className="field-input font-mono"
            value={v}
            onChange={(e) => {
              const next = [...values] as [string, string, string];
              next[i] = e.target.value;
              onChange(next);
            }}
          />
        ))}
      </div>
    </fieldset>
  );
}

function Heatmap({
  result,
  plan,
  modelIndex,
  detail,
  units,
}: {
  result: SweepResult;
  plan: Plan;
  modelIndex: number;
  detail: PlanDetail;
  units: UnitSystem;
}) {
  const { ref, width } = useElementWidth<HTMLDivElement>(720);
  const heatmap = useMemo(() => {
    const layer = plan.models[modelIndex].layers[result.parameter.layer - 1];
    const parameter =
      result.parameter.kind === "thickness" ? (layer.thickness ?? Number.NaN) : layer.velocity;
    const axis = result.axis.kind === "spacing" ? plan.spread.spacing : plan.spread.channels;
    return buildHeatmap(result, Math.max(360, width), units, { axis, parameter });
  }, [result, width, units, plan, modelIndex]);
  // The cells are painted as one image (a pixel per cell); SVG carries the pointer, the marker,
  // the highlighted cell and the axes.
  const image = useMemo(() => heatmapImage(result), [result]);
  const [active, setActive] = useState<HeatCell | null>(null);
  const { data: me } = useMe();
  const createPlan = useCreatePlan(detail.siteId);
  const navigate = useNavigate();
  const mayCopy = mayCreatePlan(me);

  const applyCell = (cell: HeatCell) => {
    if (!mayCopy || cell.state === "invalid" || cell.state === "pending") return;
    const document = planAtCell(plan, modelIndex, result, cell.row, cell.col);
    const name = `${detail.name} (sweep: ${cell.readout.split(" → ")[0]})`.slice(0, 120);
    createPlan.mutate(
      { name, document: { ...document, name } },
      { onSuccess: (copy) => navigate(paths.plan(copy.id)) },
    );
  };

  const move = (dRow: number, dCol: number) => {
    const row = Math.min(result.rows - 1, Math.max(0, (active?.row ?? 0) + dRow));
    const col = Math.min(result.cols - 1, Math.max(0, (active?.col ?? 0) + dCol));
    setActive(heatmap.cellAt(row, col));
  };
  const cellUnder = (e: React.PointerEvent<SVGElement> | React.MouseEvent<SVGElement>) => {
    const svg = e.currentTarget.ownerSVGElement ?? (e.currentTarget as SVGSVGElement);
    const box = svg.getBoundingClientRect();
    const scale = box.width > 0 ? heatmap.width / box.width : 1;
    return heatmap.cellFromPoint((e.clientX - box.left) * scale, (e.clientY - box.top) * scale);
  };

  return (
    <div ref={ref}>
      <h2 className="mb-1 text-lg font-semibold text-ink-deep">
        {plan.models[modelIndex].name}: verdict over the grid
      </h2>
      <p className="mb-2 text-sm text-ink-soft print:hidden">
        {mayCopy
          ? "Click a cell (or move with the arrow keys and press Enter) to open a copy of the plan with those values."
          : "Point at a cell to read its verdict and depth error."}
      </p>
      <svg
        width={heatmap.width}
        height={heatmap.height}
        viewBox={`0 0 ${heatmap.width} ${heatmap.height}`}
        fontFamily={chartFont}
        role="grid"
        aria-label="Design sweep heatmap"
        tabIndex={0}
        className="block h-auto max-w-full focus:outline-2 focus:outline-ochre"
        onKeyDown={(e) => {
          const moves: Record<string, [number, number]> = {
            ArrowUp: [1, 0],
            ArrowDown: [-1, 0],
            ArrowLeft: [0, -1],
            ArrowRight: [0, 1],
          };
          if (moves[e.key]) {
            e.preventDefault();
            move(...moves[e.key]);
          } else if (e.key === "Enter" && active) {
            e.preventDefault();
            applyCell(active);
          }
        }}
        onPointerLeave={() => setActive(null)}
      >
        {image ? (
          <>
            <image
              href={image}
              x={heatmap.plot.x}
              y={heatmap.plot.y}
              width={heatmap.plot.width}
              height={heatmap.plot.height}
              preserveAspectRatio="none"
              style={{ imageRendering: "pixelated" }}
            />
            <rect
              x={heatmap.plot.x}
              y={heatmap.plot.y}
              width={heatmap.plot.width}
              height={heatmap.plot.height}
              fill="transparent"
              data-role="cells"
              onPointerMove={(e) => {
                const cell = cellUnder(e);
                if (cell?.row !== active?.row || cell?.col !== active?.col) setActive(cell);
              }}
              onClick={(e) => {
                const cell = cellUnder(e);
                if (cell) applyCell(cell);
              }}
              style={{ cursor: mayCopy ? "pointer" : "default" }}
            />
          </>
        ) : (
          heatmap.cells.map((c) => (
            <rect
              key={`${c.row}-${c.col}`}
              x={c.x}
              y={c.y}
              width={c.w + 0.5}
              height={c.h + 0.5}
              fill={c.fill}
              data-state={c.state}
              onPointerEnter={() => setActive(c)}
              onClick={() => applyCell(c)}
              style={{ cursor: mayCopy ? "pointer" : "default" }}
            />
          ))
        )}
        {heatmap.marker ? (
          <g pointerEvents="none" data-role="plan-marker">
            <circle
              cx={heatmap.marker.x}
              cy={heatmap.marker.y}
              r={6}
              fill="none"
              stroke={palette.card}
              strokeWidth={4}
            />
            <circle
              cx={heatmap.marker.x}
              cy={heatmap.marker.y}
              r={6}
              fill="none"
              stroke={palette.inkDeep}
              strokeWidth={2}
            />
          </g>
        ) : null}
        {active ? (
          <rect
            x={active.x}
            y={active.y}
            width={active.w}
            height={active.h}
            fill="none"
            stroke={palette.inkDeep}
            strokeWidth={2}
            pointerEvents="none"
          />
        ) : null}
        {heatmap.xTicks.map((t) => (
          <text
            key={t.label + t.px}
            x={t.px}
            y={heatmap.height - heatmap.margin.bottom + 16}
            textAnchor="middle"
            fontSize={11}
            fill={palette.inkSoft}
          >
            {t.label}
          </text>
        ))}
        {heatmap.yTicks.map((t) => (
          <text
            key={t.label + t.px}
            x={heatmap.margin.left - 6}
            y={t.px + 3.5}
            textAnchor="end"
            fontSize={11}
            fill={palette.inkSoft}
          >
            {t.label}
          </text>
        ))}
        <text
          x={(heatmap.margin.left + heatmap.width - heatmap.margin.right) / 2}
          y={heatmap.height - 8}
          textAnchor="middle"
          fontSize={12}
          fill={palette.ink}
        >
          {heatmap.xLabel}
        </text>
        <text
          data-role="y-title"
          transform={`translate(14 ${(heatmap.plot.y + heatmap.plot.y + heatmap.plot.height) / 2}) rotate(-90)`}
          textAnchor="middle"
          fontSize={12}
          fill={palette.ink}
        >
          {heatmap.yLabel}
        </text>
      </svg>
      <p
        className={`mt-1 min-h-5 text-xs text-ink-deep ${active ? "font-mono" : "font-sans"}`}
        aria-live="polite"
        data-testid="sweep-readout"
      >
        {active
          ? active.readout
          : `${heatmap.yLabel} (rows) against ${heatmap.xLabel.toLowerCase()} (columns).`}
      </p>
      <ul className="mt-2 flex flex-wrap gap-3 text-xs text-ink-soft" aria-label="Legend">
        {(["resolved", "under-sampled", "blind", "inverted"] as const).map((s) => (
          <li key={s} className="flex items-center gap-1.5">
            <span
              className="inline-block h-3 w-3 rounded-sm border border-rule"
              style={{ background: CELL_FILL[s] }}
            />
            {VERDICT_LABELS[s]}
          </li>
        ))}
        <li className="flex items-center gap-1.5">
          <span
            className="inline-block h-3 w-3 rounded-sm border border-rule"
            style={{ background: CELL_FILL.invalid }}
          />
          interfaces cross
        </li>
        {heatmap.marker ? (
          <li className="flex items-center gap-1.5">
            <span className="inline-block h-3 w-3 rounded-full border-2 border-ink-deep" />
            the plan as it stands
          </li>
        ) : null}
      </ul>
      <SweepReading
        axis={result.axis.kind}
        channels={plan.spread.channels}
        spacing={plan.spread.spacing}
        units={units}
      />
      {createPlan.isPending ? <p className="mt-2 text-sm text-ink-soft">Making a copy…</p> : null}
      {createPlan.isError ? (
        <ErrorNotice error={createPlan.error} title="Could not make the copy" />
      ) : null}
    </div>
  );
}
