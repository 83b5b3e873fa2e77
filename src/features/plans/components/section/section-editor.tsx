import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { get, useFormContext, useFormState, useWatch } from "react-hook-form";
import { Button } from "@/components/button";
import { useElementWidth } from "@/hooks/use-element-width";
import { formatInput, parseInput, unitLabel, type UnitSystem } from "@/lib/units";
import type { Spread } from "../../lib/engine";
import type { PlanForm, SectionDraft } from "../../lib/plan-form";
import { insertPoint, movePoint, polylineOf, removePoint } from "../../lib/section-edit";
import { buildSectionView, lineLabel, layerName } from "../../lib/section-view";
import { boreholeTop, deepestDepth } from "../../lib/section-boreholes";
import { CellInput, PhoneLabel } from "../designer/cell-input";
import { SectionFigure, type PointRef } from "./section-figure";
import { SectionImport } from "./section-import-box";
import { SectionBoreholeList } from "./section-borehole-list";
import { BoreholeLogs } from "./section-overlays";

/** Least time between two models sent to the modeller while a point is dragged, ms. */
const DRAG_SEND_MS = 150;

/** A problem the plan schema found in a section, with the point it names. */
export interface SectionProblem {
  where: string;
  message: string;
  point: PointRef | null;
}

/** Flatten the form errors of model `index` into readable problems naming the point. */
export function sectionProblems(
  errors: unknown,
  index: number,
  draft: SectionDraft,
): SectionProblem[] {
  const out: SectionProblem[] = [];
  const walk = (node: unknown, path: string[]) => {
    if (!node || typeof node !== "object") return;
    for (const [key, value] of Object.entries(node)) {
      if (key === "ref" || key === "type" || key === "types") continue;
      if (key === "message" && typeof value === "string") {
        out.push({ ...describe(path, draft), message: value });
      } else walk(value, key === "root" ? path : [...path, key]);
    }
  };
  walk(get(errors, `models.${index}`), []);
  return out;
}

function describe(path: string[], draft: SectionDraft): Omit<SectionProblem, "message"> {
  if (path[0] === "surface") {
    const i = path[1] === undefined ? null : Number(path[1]);
    return {
      where: i === null ? "surface" : `surface, point ${i + 1}`,
      point: i === null ? null : { line: -1, index: i },
    };
  }
  // the schema's borehole messages name the borehole themselves
  if (path[0] === "boreholes") return { where: "boreholes", point: null };
  if (path[0] === "layers" && path[1] !== undefined) {
    const k = Number(path[1]);
    const name = layerName(draft, k);
    if (path[2] === "base") {
      const i = path[3] === undefined ? null : Number(path[3]);
      return {
        where: i === null ? `base of ${name}` : `base of ${name}, point ${i + 1}`,
        point: i === null ? null : { line: k, index: i },
      };
    }
    return { where: `${name}${path[2] ? `, ${path[2]}` : ""}`, point: null };
  }
  return { where: path.join(" ") || "section", point: null };
}

/** The spread as typed, in SI, or null while any of its boxes is not a number. */
function useSpreadSI(units: UnitSystem): Spread | null {
  const spread = useWatch<PlanForm, "spread">({ name: "spread" });
  return useMemo(() => {
    if (!spread) return null;
    const spacing = parseInput("length", spread.spacing, units);
    const channels = parseInput("count", spread.channels, units);
    const first = parseInput("length", spread.firstGeophone, units);
    const shots = spread.shots.map((s) => ({
      position: parseInput("length", s.position, units),
      label: s.label,
      depth: parseInput("length", s.depth ?? "", units) ?? 0,
    }));
    const ok = (v: number | undefined): v is number => v !== undefined && Number.isFinite(v);
    if (!ok(spacing) || !ok(channels) || !ok(first) || channels < 1 || channels > 1024) return null;
    if (!shots.every((s) => ok(s.position))) return null;
    return {
      spacing,
      channels: Math.round(channels),
      firstGeophone: first,
      shots: shots.map((s) => ({ position: s.position as number, label: s.label, depth: s.depth })),
    } as Spread;
  }, [spread, units]);
}

/**
 * The section editor of one model: the section drawn to scale with draggable points, a table
 * per polyline, the layers' velocities, shot depths, and imports from survey files. Every
 * change goes to the form at once (and so to the modeller); a drag redraws here first.
 */
export function SectionEditor({
  index,
  units,
  readOnly,
}: {
  index: number;
  units: UnitSystem;
  readOnly: boolean;
}) {
  const { control, register, setValue, getValues, trigger } = useFormContext<PlanForm>();
  const path = `models.${index}.section` as const;
  const stored = useWatch({ control, name: path }) as SectionDraft | undefined;
  const { errors } = useFormState({ control });
  const spread = useSpreadSI(units);
  const [dragged, setDragged] = useState<SectionDraft | null>(null);
  const draft = dragged ?? stored;
  const [selected, setSelected] = useState<PointRef | null>(null);
  const [line, setLine] = useState(-1);
  const { ref, width } = useElementWidth<HTMLDivElement>(640);
  const frame = useRef(0);
  const lastSent = useRef(0);
  useEffect(() => () => cancelAnimationFrame(frame.current), []);

  const commit = useCallback(
    (next: SectionDraft, validate = true) => {
      setValue(path, next, { shouldDirty: true });
      // the schema's messages land on the points (models.i.layers.k.base.j), not on `path`
      if (validate) void trigger();
    },
    [setValue, trigger, path],
  );

  const problems = useMemo(
    () => (draft ? sectionProblems(errors, index, draft) : []),
    [errors, index, draft],
  );
  const flagged = useMemo(
    () => new Set(problems.flatMap((p) => (p.point ? [`${p.point.line}:${p.point.index}`] : []))),
    [problems],
  );
  const view = useMemo(
    () =>
      draft && draft.surface.length >= 2
        ? buildSectionView({
            section: draft,
            spread,
            shotIndex: null,
            // below 360 px the axis labels collide; a narrower box scales the figure down
            width: Math.max(360, width),
            units,
            exaggeration: "auto",
            include: (draft.boreholes ?? []).map(
              (b) => boreholeTop(draft.surface, b) - deepestDepth(b),
            ),
          })
        : null,
    [draft, spread, width, units],
  );

  if (!draft) return null;
  const h = unitLabel("length", units);
  const v = unitLabel("velocity", units);
  const current = (getValues(path) as SectionDraft | undefined) ?? draft;

  const editing = readOnly
    ? undefined
    : {
        selected,
        flagged,
        onSelect: (p: PointRef | null) => {
          setSelected(p);
          if (p) setLine(p.line);
        },
        onMove: (p: PointRef, x: number, z: number, done: boolean) => {
          const base = dragged ?? current;
          const next = movePoint(base, p.line, p.index, x, z);
          if (done) {
            cancelAnimationFrame(frame.current);
            setDragged(null);
            commit(next);
            return;
          }
          setDragged(next);
          // The chart follows every move; the modeller hears of the drag at most every
          // DRAG_SEND_MS (a 2-D analysis takes about a tenth of a second and a worker cannot
          // drop a request once sent, so sending every frame would queue stale work).
          cancelAnimationFrame(frame.current);
          frame.current = requestAnimationFrame(() => {
            const now = performance.now();
            if (now - lastSent.current < DRAG_SEND_MS) return;
            lastSent.current = now;
            commit(next, false);
          });
        },
        onInsert: (l: number, x: number) => {
          const { draft: next, index: at } = insertPoint(current, l, x);
          commit(next);
          setSelected({ line: l, index: at });
          setLine(l);
        },
        onRemove: (p: PointRef) => {
          const next = removePoint(current, p.line, p.index);
          if (next) {
            commit(next);
            setSelected(null);
          }
        },
      };

  const lines = [-1, ...draft.layers.slice(0, -1).map((_, k) => k)];
  const updateLayer = (k: number, patch: Partial<SectionDraft["layers"][number]>) =>
    commit({
      ...current,
      layers: current.layers.map((l, i) => (i === k ? { ...l, ...patch } : l)),
    });

  return (
    <div ref={ref} className="min-w-0">
      <div className="mb-3 max-w-sm">
        <CellInput
          label="Model name"
          placeholder="Model name"
          className="font-sans!"
          {...register(`models.${index}.name`)}
        />
      </div>
      {problems.length > 0 ? (
        <div
          role="alert"
          className="mb-3 rounded-md border border-brick/50 bg-brick-soft px-3 py-2 text-sm text-brick"
        >
          <p className="font-semibold">
            This section cannot be analysed or saved until{" "}
            {problems.length === 1 ? "this is fixed" : "these are fixed"}:
          </p>
          <ul className="mt-1 list-disc pl-5">
            {problems.map((p, i) => (
              <li key={i}>
                {p.point ? (
                  <button
                    type="button"
                    className="font-medium underline"
                    onClick={() => {
                      setSelected(p.point);
                      setLine(p.point!.line);
                    }}
                  >
                    {p.where}
                  </button>
                ) : (
                  <span className="font-medium">{p.where}</span>
                )}
                : {p.message}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {view ? (
        <SectionFigure
          view={view}
          title={`Section being edited: ${getValues(`models.${index}.name`) || "section"}`}
          units={units}
          editing={editing}
          caption={
            readOnly
              ? undefined
              : "Drag a point; click a line to add one; select a point and press Delete to remove it, arrow keys to nudge it (Shift: ×10)."
          }
        >
          <BoreholeLogs
            view={view}
            boreholes={draft.boreholes ?? []}
            surface={draft.surface}
            units={units}
          />
        </SectionFigure>
      ) : null}

      <h3 className="mt-4 mb-1 text-sm font-semibold text-ink-deep">Layers</h3>
      {/* On a phone (below sm) each layer is a card (name across, velocities under it). */}
      <div className="sm:overflow-x-auto">
        <table className="w-full text-sm max-sm:block sm:min-w-[30rem]" aria-label="Section layers">
          <thead className="text-left text-xs tracking-wide text-ink-soft uppercase max-sm:hidden">
            <tr className="border-b border-rule">
              <th className="w-6 py-1 font-semibold">#</th>
              <th className="py-1 pr-2 font-semibold">Layer</th>
              <th className="w-28 py-1 pr-2 font-semibold">Velocity ({v})</th>
              <th className="py-1 font-semibold">Velocity along the line</th>
            </tr>
          </thead>
          <tbody className="max-sm:block">
            {draft.layers.map((layer, k) => (
              <tr
                key={k}
                className="align-top max-sm:grid max-sm:grid-cols-[1.25rem_minmax(0,2fr)_minmax(0,3fr)] max-sm:gap-x-2 max-sm:gap-y-1.5 max-sm:border-t max-sm:border-rule/60 max-sm:py-2"
              >
                <td className="py-1 pt-2 font-mono text-xs text-ink-soft max-sm:p-0 max-sm:pt-1.5">
                  {k + 1}
                </td>
                <td className="py-1 pr-2 max-sm:col-span-2 max-sm:p-0">
                  <TextCell
                    label={`Layer ${k + 1} name`}
                    value={layer.name ?? ""}
                    placeholder={k === draft.layers.length - 1 ? "half-space" : `layer ${k + 1}`}
                    onCommit={(name) => updateLayer(k, { name: name || undefined })}
                  />
                </td>
                <td className="py-1 pr-2 max-sm:col-start-2 max-sm:p-0">
                  <PhoneLabel>Velocity ({v})</PhoneLabel>
                  <NumberCell
                    label={`Layer ${k + 1} velocity (${v})`}
                    quantity="velocity"
                    value={layer.velocity}
                    units={units}
                    onCommit={(velocity) => updateLayer(k, { velocity })}
                  />
                </td>
                <td className="py-1 max-sm:p-0">
                  <PhoneLabel>Along the line</PhoneLabel>
                  <VelocityLaw
                    label={`Layer ${k + 1} velocity along the line`}
                    value={layer.velocityAt}
                    units={units}
                    onCommit={(velocityAt) => updateLayer(k, { velocityAt })}
                  />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {!readOnly ? (
        <div className="mt-2 flex flex-wrap gap-2">
          <Button
            variant="secondary"
            className="text-xs!"
            disabled={draft.layers.length >= 12}
            onClick={() => {
              // a new layer above the half-space, 2 m thick under the deepest base
              const n = current.layers.length;
              const above =
                n >= 2 ? (current.layers[n - 2].base ?? current.surface) : current.surface;
              const base = above.map(([x, z]) => [x, Math.round((z - 2) * 1000) / 1000]) as [
                number,
                number,
              ][];
              const layers = [...current.layers];
              layers.splice(n - 1, 0, { velocity: 1500, base });
              commit({ ...current, layers });
            }}
          >
            Add layer above the half-space
          </Button>
          {draft.layers.length > 1 ? (
            <Button
              variant="quiet"
              className="text-xs!"
              onClick={() => {
                const n = current.layers.length;
                const layers = current.layers.filter((_, k) => k !== n - 2);
                commit({ ...current, layers });
              }}
            >
              Remove the layer above the half-space
            </Button>
          ) : null}
        </div>
      ) : null}

      <div className="mt-4 mb-1 flex flex-wrap items-center gap-2">
        <h3 className="text-sm font-semibold text-ink-deep">Points of</h3>
        <select
          aria-label="Polyline shown in the table"
          className="field-input w-auto! py-1! text-sm!"
          value={line}
          onChange={(e) => setLine(Number(e.target.value))}
        >
          {lines.map((l) => (
            <option key={l} value={l}>
              {lineLabel(draft, l)}
            </option>
          ))}
        </select>
      </div>
      <PolylineTable
        key={line}
        label={lineLabel(draft, line)}
        points={polylineOf(draft, line)}
        units={units}
        readOnly={readOnly}
        selected={selected?.line === line ? selected.index : null}
        flagged={flagged}
        line={line}
        onSelect={(i) => setSelected({ line, index: i })}
        onChange={(points) =>
          commit(
            line < 0
              ? { ...current, surface: points }
              : {
                  ...current,
                  layers: current.layers.map((l, k) => (k === line ? { ...l, base: points } : l)),
                },
          )
        }
      />

      <ShotDepths units={units} />
      <div className="mt-4 flex flex-wrap items-end gap-3 text-sm">
        <div className="w-36">
          <NumberCell
            label={`Grid cell size (${h}), empty: chosen from the geometry`}
            quantity="length"
            value={draft.cellSize}
            units={units}
            optional
            placeholder="automatic"
            onCommit={(cellSize) => {
              const next = { ...current };
              if (cellSize === undefined) delete next.cellSize;
              else next.cellSize = cellSize;
              commit(next);
            }}
          />
        </div>
        <span className="pb-1.5 text-xs text-ink-soft">
          Grid cell size ({h}); leave empty to let the modeller choose it from the thinnest layer
          and the spacing.
        </span>
      </div>
      <SectionBoreholeList
        section={draft}
        units={units}
        readOnly={readOnly}
        onRemove={(i) => {
          const boreholes = (current.boreholes ?? []).filter((_, k) => k !== i);
          const next: SectionDraft = { ...current, boreholes };
          if (boreholes.length === 0) delete next.boreholes;
          commit(next);
        }}
      />
      {!readOnly ? (
        <SectionImport
          draft={current}
          units={units}
          onSurface={(surface) => commit({ ...current, surface })}
          onBases={(bases, logs) => {
            const layers = current.layers.map((l, k) =>
              k < current.layers.length - 1 && bases[k] ? { ...l, base: bases[k] } : l,
            );
            // the logs are kept with the model (replacing any stored before): the evidence the
            // bases were interpolated from, saved with the plan and covered by undo
            commit({ ...current, layers, boreholes: logs });
          }}
        />
      ) : null}
    </div>
  );
}

/** A number box holding an SI value shown in the user's units; commits each valid number. */
export function NumberCell({
  label,
  quantity,
  value,
  units,
  onCommit,
  optional = false,
  placeholder,
}: {
  label: string;
  quantity: "length" | "velocity";
  value: number | undefined;
  units: UnitSystem;
  onCommit: (value: number | undefined) => void;
  optional?: boolean;
  placeholder?: string;
}) {
  const shown = formatInput(quantity, value, units);
  const [text, setText] = useState(shown);
  const [error, setError] = useState<string | undefined>();
  useEffect(() => {
    // follow changes made elsewhere (a drag, an import) unless the box says the same
    setText((t) => (parseInput(quantity, t, units) === value ? t : shown));
    setError(undefined);
  }, [shown, value, quantity, units]);
  return (
    <CellInput
      label={label}
      inputMode="decimal"
      value={text}
      placeholder={placeholder}
      error={error}
      onChange={(e) => {
        const t = e.target.value;
        setText(t);
        const parsed = parseInput(quantity, t, units);
        if (parsed === undefined) {
          if (optional) {
            setError(undefined);
            onCommit(undefined);
          } else setError(`${label.replace(/ \(.*$/, "")} is required`);
        } else if (!Number.isFinite(parsed)) setError("not a number");
        else {
          setError(undefined);
          if (parsed !== value) onCommit(parsed);
        }
      }}
    />
  );
}

function TextCell({
  label,
  value,
  placeholder,
  onCommit,
}: {
  label: string;
  value: string;
  placeholder?: string;
  onCommit: (value: string) => void;
}) {
  const [text, setText] = useState(value);
  useEffect(() => setText(value), [value]);
  return (
    <CellInput
      label={label}
      value={text}
      placeholder={placeholder}
      className="font-sans!"
      maxLength={80}
      onChange={(e) => setText(e.target.value)}
      onBlur={() => text.trim() !== value && onCommit(text.trim())}
    />
  );
}

/** "position:velocity" pairs, e.g. "0:550, 80:700"; empty for a constant velocity. */
function VelocityLaw({
  label,
  value,
  units,
  onCommit,
}: {
  label: string;
  value: [number, number][] | undefined;
  units: UnitSystem;
  onCommit: (value: [number, number][] | undefined) => void;
}) {
  const shown = (value ?? [])
    .map(([x, vel]) => `${formatInput("length", x, units)}:${formatInput("velocity", vel, units)}`)
    .join(", ");
  const [text, setText] = useState(shown);
  const [error, setError] = useState<string>();
  useEffect(() => setText(shown), [shown]);
  const apply = () => {
    if (text.trim() === "") {
      setError(undefined);
      if (value) onCommit(undefined);
      return;
    }
    const pairs = text.split(/[,;]\s*/).filter(Boolean);
    const out: [number, number][] = [];
    for (const [i, pair] of pairs.entries()) {
      const [a, b] = pair.split(":");
      const x = parseInput("length", a, units);
      const vel = parseInput("velocity", b, units);
      if (x === undefined || vel === undefined || !Number.isFinite(x) || !Number.isFinite(vel)) {
        setError(`pair ${i + 1} ("${pair.trim()}") is not position:velocity`);
        return;
      }
      out.push([x, vel]);
    }
    setError(undefined);
    onCommit(out);
  };
  return (
    <CellInput
      label={label}
      value={text}
      placeholder="constant (e.g. 0:550, 80:700)"
      error={error}
      onChange={(e) => setText(e.target.value)}
      onBlur={apply}
      onKeyDown={(e) => {
        if (e.key === "Enter") {
          e.preventDefault();
          apply();
        }
      }}
    />
  );
}

function PolylineTable({
  label,
  points,
  units,
  readOnly,
  selected,
  flagged,
  line,
  onSelect,
  onChange,
}: {
  label: string;
  points: [number, number][];
  units: UnitSystem;
  readOnly: boolean;
  selected: number | null;
  flagged: ReadonlySet<string>;
  line: number;
  onSelect: (index: number) => void;
  onChange: (points: [number, number][]) => void;
}) {
  const h = unitLabel("length", units);
  const set = (i: number, j: 0 | 1, value: number | undefined) => {
    if (value === undefined) return;
    onChange(points.map((p, k) => (k === i ? (j === 0 ? [value, p[1]] : [p[0], value]) : p)));
  };
  return (
    <div className="max-h-72 overflow-y-auto">
      <table className="w-full text-sm" aria-label={`Points of the ${label}`}>
        <thead className="sticky top-0 bg-card text-left text-xs tracking-wide text-ink-soft uppercase">
          <tr className="border-b border-rule">
            <th className="w-8 py-1 font-semibold">#</th>
            <th className="py-1 pr-2 font-semibold">Position ({h})</th>
            <th className="py-1 pr-2 font-semibold">Elevation ({h})</th>
            <th className="w-20 py-1">
              <span className="sr-only">Add or remove</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {points.map((p, i) => (
            <tr
              key={i}
              className={`align-top ${selected === i ? "bg-ochre-soft" : ""} ${flagged.has(`${line}:${i}`) ? "outline outline-brick/60" : ""}`}
              onFocus={() => onSelect(i)}
            >
              <td className="py-1 pt-2 font-mono text-xs text-ink-soft">{i + 1}</td>
              <td className="py-1 pr-2">
                <NumberCell
                  label={`${label} point ${i + 1} position (${h})`}
                  quantity="length"
                  value={p[0]}
                  units={units}
                  onCommit={(v) => set(i, 0, v)}
                />
              </td>
              <td className="py-1 pr-2">
                <NumberCell
                  label={`${label} point ${i + 1} elevation (${h})`}
                  quantity="length"
                  value={p[1]}
                  units={units}
                  onCommit={(v) => set(i, 1, v)}
                />
              </td>
              <td className="py-1 whitespace-nowrap">
                {!readOnly ? (
                  <span className="flex gap-0.5">
                    <button
                      type="button"
                      aria-label={`Add a point after point ${i + 1} of the ${label}`}
                      title="Add a point after this one"
                      className="h-7 w-7 rounded-md border border-rule bg-card text-sm text-ink hover:bg-paper-deep disabled:opacity-40 max-sm:h-9 max-sm:w-9"
                      disabled={i === points.length - 1}
                      onClick={() => {
                        const q = points[i + 1];
                        const mid: [number, number] = [
                          Math.round(((p[0] + q[0]) / 2) * 1000) / 1000,
                          Math.round(((p[1] + q[1]) / 2) * 1000) / 1000,
                        ];
                        onChange([...points.slice(0, i + 1), mid, ...points.slice(i + 1)]);
                      }}
                    >
                      +
                    </button>
                    <button
                      type="button"
                      aria-label={`Remove point ${i + 1} of the ${label}`}
                      title="Remove this point"
                      className="h-7 w-7 rounded-md border border-rule bg-card text-sm text-ink hover:bg-paper-deep disabled:opacity-40 max-sm:h-9 max-sm:w-9"
                      disabled={points.length <= 2}
                      onClick={() => onChange(points.filter((_, k) => k !== i))}
                    >
                      ✕
                    </button>
                  </span>
                ) : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** Depth of each shot below the surface (buried charges); blank is on the surface. */
function ShotDepths({ units }: { units: UnitSystem }) {
  const { register } = useFormContext<PlanForm>();
  const shots = useWatch<PlanForm, "spread.shots">({ name: "spread.shots" }) ?? [];
  const h = unitLabel("length", units);
  return (
    <details className="mt-4 text-sm">
      <summary className="cursor-pointer font-semibold text-ink-deep">
        Shot depths (buried charges)
      </summary>
      <p className="mt-1 text-xs text-ink-soft">
        Depth below the surface, {h}; leave blank for a surface source. Explosive sources need a
        licensed blaster and local permits; clear buried utilities before drilling shot holes.
      </p>
      <div className="mt-2 grid grid-cols-[repeat(auto-fill,minmax(10rem,1fr))] gap-2">
        {shots.map((s, i) => (
          <label key={i} className="flex items-center gap-2 text-xs text-ink">
            <span className="whitespace-nowrap">
              S{i + 1} at {s.position} {h}
            </span>
            <input
              aria-label={`Shot ${i + 1} depth (${h})`}
              inputMode="decimal"
              placeholder="0"
              className="field-input px-2! py-1! font-mono text-sm!"
              {...register(`spread.shots.${i}.depth`)}
            />
          </label>
        ))}
      </div>
    </details>
  );
}
