import { useEffect, useRef, useState } from "react";
import { Button } from "@/components/button";
import { Card, ErrorNotice, Notice } from "@/components/feedback";
import {
  formatInput,
  formatQuantity,
  formatSigned,
  parseInput,
  unitLabel,
  type UnitSystem,
} from "@/lib/units";
import type { SectionSweepResult, SectionSweepSpec } from "@engine";
import { STATUSES, type Plan } from "../../lib/engine";
import { isSuperseded, modeller } from "../../lib/modeller-client";
import { CELL_FILL } from "../../lib/sweep-heatmap";
import { VERDICT_LABELS } from "../verdict-badge";

const MAX_STEPS = 8;

/** Evenly spaced values from a to b (n ≥ 2), rounded to a millimetre. */
export function steps(a: number, b: number, n: number): number[] {
  return Array.from(
    { length: n },
    (_, i) => Math.round((a + ((b - a) * i) / (n - 1)) * 1000) / 1000,
  );
}

/**
 * The design sweep of a section model: geophone spacing × the elevation of one polyline point
 * (e.g. the floor of a channel) or one layer's velocity, each cell a full 2-D analysis in the
 * sweep worker (so a few dozen cells take a while: the size is capped at 8 × 8).
 */
export function SectionSweep({ plan, units }: { plan: Plan; units: UnitSystem }) {
  const sections = plan.models.map((m, i) => ({ m, i })).filter(({ m }) => m.kind === "section");
  const [modelIndex, setModelIndex] = useState(sections[0]?.i ?? 0);
  const model = plan.models[modelIndex];
  const h = unitLabel("length", units);
  const v = unitLabel("velocity", units);
  const [kind, setKind] = useState<"elevation" | "velocity">("elevation");
  const [layer, setLayer] = useState(1);
  const [point, setPoint] = useState(1);
  const base = model?.kind === "section" ? model.layers[layer - 1]?.base : undefined;
  const here = kind === "elevation" ? base?.[point]?.[1] : model?.layers[layer - 1]?.velocity;
  const [text, setText] = useState(() => ({
    sFrom: formatInput("length", plan.spread.spacing / 2, units),
    sTo: formatInput("length", plan.spread.spacing * 2, units),
    sN: "4",
    pFrom: "",
    pTo: "",
    pN: "4",
  }));
  const [running, setRunning] = useState(false);
  const [progress, setProgress] = useState(0);
  const [result, setResult] = useState<SectionSweepResult | null>(null);
  const [error, setError] = useState<unknown>(null);
  const abort = useRef<AbortController | null>(null);
  useEffect(() => () => abort.current?.abort(), []);

  if (sections.length === 0 || model?.kind !== "section") return null;

  const quantity = kind === "elevation" ? "length" : "velocity";
  const num = (q: "length" | "velocity" | "count", t: string) => parseInput(q, t, units);
  const defaultFrom =
    here === undefined
      ? ""
      : formatInput(quantity, kind === "elevation" ? here - 4 : here * 0.7, units);
  const defaultTo =
    here === undefined
      ? ""
      : formatInput(quantity, kind === "elevation" ? here + 2 : here * 1.3, units);
  const problems: string[] = [];
  const sFrom = num("length", text.sFrom);
  const sTo = num("length", text.sTo);
  const sN = num("count", text.sN);
  const pFrom = num(quantity, text.pFrom || defaultFrom);
  const pTo = num(quantity, text.pTo || defaultTo);
  const pN = num("count", text.pN);
  const ok = (x: number | undefined): x is number => x !== undefined && Number.isFinite(x);
  if (!ok(sFrom) || !ok(sTo) || !(sFrom > 0) || !(sTo > 0))
    problems.push("spacings must be numbers above 0");
  if (!ok(pFrom) || !ok(pTo)) problems.push(`the ${kind} range must be numbers`);
  if (!ok(sN) || !ok(pN) || sN < 2 || pN < 2 || sN > MAX_STEPS || pN > MAX_STEPS)
    problems.push(`steps must be whole numbers from 2 to ${MAX_STEPS}`);
  if (kind === "elevation" && !base) problems.push("choose a layer with a base");

  const run = async () => {
    if (problems.length > 0) return;
    const spec: SectionSweepSpec = {
      modelIndex,
      spacings: steps(sFrom as number, sTo as number, sN as number),
      parameter:
        kind === "elevation"
          ? {
              kind: "elevation",
              layer,
              point,
              values: steps(pFrom as number, pTo as number, pN as number),
            }
          : {
              kind: "velocity",
              layer,
              values: steps(pFrom as number, pTo as number, pN as number),
            },
    };
    abort.current?.abort();
    const controller = new AbortController();
    abort.current = controller;
    setRunning(true);
    setProgress(0);
    setError(null);
    try {
      setResult(
        await modeller().sectionSweep(plan, spec, {
          onProgress: setProgress,
          signal: controller.signal,
        }),
      );
    } catch (e) {
      if (!isSuperseded(e)) setError(e);
    } finally {
      if (abort.current === controller) setRunning(false);
    }
  };

  const field = (key: keyof typeof text, label: string, name: string, placeholder?: string) => (
    <label className="flex flex-col gap-0.5 text-xs text-ink-soft">
      {label}
      <input
        aria-label={name}
        className="field-input w-24! px-2! py-1! font-mono text-sm!"
        value={text[key]}
        placeholder={placeholder}
        onChange={(e) => setText({ ...text, [key]: e.target.value })}
      />
    </label>
  );

  return (
    <Card className="mt-5">
      <h2 className="mb-1 text-lg font-semibold text-ink-deep">Design sweep of a section</h2>
      <p className="mb-3 text-sm text-ink-soft">
        Each cell is a full 2-D analysis of the section: the worst verdict over its interfaces and
        the worst depth error of the crew&apos;s interpretation. Shots move with the spread.
      </p>
      <div className="flex flex-wrap items-end gap-3 text-sm">
        <label className="flex flex-col gap-0.5 text-xs text-ink-soft">
          Section
          <select
            aria-label="Section swept"
            className="field-input w-auto! py-1! text-sm!"
            value={modelIndex}
            onChange={(e) => setModelIndex(Number(e.target.value))}
          >
            {sections.map(({ m, i }) => (
              <option key={i} value={i}>
                {m.name}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-0.5 text-xs text-ink-soft">
          Vary
          <select
            aria-label="Vary"
            className="field-input w-auto! py-1! text-sm!"
            value={kind}
            onChange={(e) => setKind(e.target.value as "elevation" | "velocity")}
          >
            <option value="elevation">elevation of a point of a base</option>
            <option value="velocity">velocity of a layer</option>
          </select>
        </label>
        <label className="flex flex-col gap-0.5 text-xs text-ink-soft">
          {kind === "elevation" ? "Base of layer" : "Layer"}
          <select
            className="field-input w-auto! py-1! text-sm!"
            value={layer}
            onChange={(e) => setLayer(Number(e.target.value))}
          >
            {model.layers.map((l, k) =>
              kind === "velocity" || l.base ? (
                <option key={k} value={k + 1}>
                  {k + 1}: {l.name || `layer ${k + 1}`}
                </option>
              ) : null,
            )}
          </select>
        </label>
        {kind === "elevation" && base ? (
          <label className="flex flex-col gap-0.5 text-xs text-ink-soft">
            Point
            <select
              aria-label="Point"
              className="field-input w-auto! py-1! text-sm!"
              value={point}
              onChange={(e) => setPoint(Number(e.target.value))}
            >
              {base.map((p, i) => (
                <option key={i} value={i}>
                  {i + 1} at {formatQuantity("length", p[0], units)}
                </option>
              ))}
            </select>
          </label>
        ) : null}
      </div>
      <div className="mt-3 flex flex-wrap items-end gap-3">
        {field("sFrom", `Spacing from (${h})`, `Spacing from (${h})`)}
        {field("sTo", `to (${h})`, `Spacing to (${h})`)}
        {field("sN", "steps", "Spacing steps")}
        {field(
          "pFrom",
          `${kind === "elevation" ? "Elevation" : "Velocity"} from (${kind === "elevation" ? h : v})`,
          `${kind === "elevation" ? "Elevation" : "Velocity"} from (${kind === "elevation" ? h : v})`,
          defaultFrom,
        )}
        {field(
          "pTo",
          `to (${kind === "elevation" ? h : v})`,
          `${kind === "elevation" ? "Elevation" : "Velocity"} to (${kind === "elevation" ? h : v})`,
          defaultTo,
        )}
        {field("pN", "steps", `${kind === "elevation" ? "Elevation" : "Velocity"} steps`)}
        <Button onClick={() => void run()} disabled={running || problems.length > 0}>
          Run section sweep
        </Button>
        {running ? (
          <>
            <progress
              aria-label="Section sweep progress"
              value={progress}
              max={1}
              className="w-32"
            />
            <Button variant="secondary" onClick={() => abort.current?.abort()}>
              Cancel
            </Button>
          </>
        ) : null}
      </div>
      {problems.length > 0 ? (
        <p role="alert" className="mt-2 text-xs font-medium text-brick">
          {problems.join("; ")}
        </p>
      ) : null}
      {error ? <ErrorNotice error={error} title="The section sweep failed" /> : null}
      {result ? (
        <SweepTable result={result} units={units} />
      ) : !running ? (
        <div className="mt-3">
          <Notice>Choose what to vary and run the sweep.</Notice>
        </div>
      ) : null}
    </Card>
  );
}

function SweepTable({ result, units }: { result: SectionSweepResult; units: UnitSystem }) {
  const q = result.parameter.kind === "elevation" ? "length" : "velocity";
  const rowsLabel =
    result.parameter.kind === "elevation"
      ? `Elevation of point ${(result.parameter.point ?? 0) + 1} of the base of layer ${result.parameter.layer}`
      : `Velocity of layer ${result.parameter.layer}`;
  return (
    // On a phone (below sm) each row is a card: its value, then its cells four to a line, each
    // with its spacing, so every column stays in view without a box that scrolls sideways.
    <div className="mt-3 sm:overflow-x-auto">
      <table
        className="text-xs max-sm:block max-sm:w-full"
        aria-label="Section sweep: worst verdict and depth error"
      >
        <caption className="mb-1 text-left text-ink-soft max-sm:block">
          Rows: {rowsLabel.toLowerCase()}; columns: geophone spacing. Each cell: worst verdict and
          worst interpreted depth error.
        </caption>
        <thead className="max-sm:hidden">
          <tr>
            <th className="px-2 py-1 text-left font-semibold text-ink-soft">{rowsLabel}</th>
            {Array.from(result.axis.values).map((s, j) => (
              <th key={j} scope="col" className="px-2 py-1 font-mono font-semibold text-ink-deep">
                {formatQuantity("length", s, units)}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="max-sm:block">
          {Array.from(result.parameter.values).map((p, i) => (
            <tr
              key={i}
              className="max-sm:grid max-sm:grid-cols-4 max-sm:gap-0.5 max-sm:border-t max-sm:border-rule/60 max-sm:py-2"
            >
              <th
                scope="row"
                className="px-2 py-1 text-left font-mono font-semibold text-ink-deep max-sm:col-span-4 max-sm:px-0"
              >
                {formatQuantity(q, p, units)}
              </th>
              {Array.from(result.axis.values).map((s, j) => {
                const code = result.status[i * result.cols + j];
                const status = STATUSES[code];
                const fill = status
                  ? CELL_FILL[status]
                  : code === 255
                    ? CELL_FILL.invalid
                    : CELL_FILL.pending;
                const word = status
                  ? VERDICT_LABELS[status]
                  : code === 255
                    ? "invalid geometry"
                    : "not computed";
                const err = result.depthError[i * result.cols + j];
                return (
                  <td
                    key={j}
                    className="border border-card px-2 py-1.5 text-center max-sm:block max-sm:px-1"
                    style={{ background: fill }}
                  >
                    <span className="block font-mono text-ink-soft sm:hidden">
                      {formatQuantity("length", s, units)}
                    </span>
                    <span className="block font-medium text-ink-deep">{word}</span>
                    <span className="font-mono text-ink-soft">
                      {Number.isFinite(err) ? formatSigned("length", err, units) : "—"}
                    </span>
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
