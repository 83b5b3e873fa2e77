/**
 * "Under the line": the reversed-profile interpretation of the picks (plus-minus, delay times
 * or the generalized reciprocal method) run in the field worker by the same function as the
 * `interpret` command. The user chooses the method and the datum, may load station elevations,
 * and assigns picks to refractors by segment (suggested by the best-fitting candidate). Shows
 * the interpreted interfaces on a section over the candidate models, a table per geophone, the
 * misfit of each candidate and the reciprocal-time checks, in the user's units. The choices
 * (method, GRM XY, datum, station elevations, the user's assignment) are restored from the
 * saved picks and, for a user who may change field data, kept with them a moment after they
 * change, so the report and interpretation.csv use the same interpretation.
 */
import { useEffect, useMemo, useState, type ReactNode } from "react";
import type { FirstBreakPick, InterpretationChoices } from "@/contracts/field";
import { Button } from "@/components/button";
import { Notice } from "@/components/feedback";
import { errorMessage } from "@/lib/api-client";
import {
  formatQuantity,
  fromDisplay,
  inputDigits,
  toDisplay,
  unitLabel,
  type UnitSystem,
} from "@/lib/units";
import type {
  ElevationPoint,
  LayerAssignment,
  LineMethod,
  PlanInterpretation,
} from "../../../../workers/field/index";
import { usePicks } from "../api/get-picks";
import { exportUrls } from "../api/exports";
import { useSaveInterpretation } from "../api/save-interpretation";
import type { Candidate } from "../lib/comparison";
import { fieldWorker } from "../lib/field-worker";
import { LINE_METHODS, lengthDigits } from "../lib/format";
import { InterpretedSection } from "./interpreted-section";

/** A length to 0.01 m or 0.1 ft (lengthDigits), as on the rest of the Field check. */
const length = (v: number | null | undefined, units: UnitSystem, digits = lengthDigits(units)) =>
  formatQuantity("length", v, units, digits);

/** A stored length in the user's unit for an input box ("" for none). */
const lengthText = (v: number | null | undefined, units: UnitSystem) =>
  v === null || v === undefined
    ? ""
    : String(Number(toDisplay("length", v, units).toFixed(inputDigits("length", units))));

/** A number typed in an input box (comma or point), null when empty, NaN when not a number. */
/** A table row drawn as a small card below 640 px: its cells flow side by side and wrap whole. */
const PHONE_CARD =
  "max-sm:flex max-sm:flex-wrap max-sm:gap-x-4 max-sm:gap-y-1 max-sm:border-b max-sm:border-rule/60 max-sm:py-2";

/** A cell's column name, shown above its value only on a phone (where the table head is hidden). */
function PhoneLabel({ children }: { children: ReactNode }) {
  return <span className="block font-sans text-xs text-ink-soft sm:hidden">{children}</span>;
}

const typed = (text: string) => (text.trim() === "" ? null : Number(text.replace(",", ".")));

/** Choices in one comparable form; null when they are all the defaults. */
function canonicalChoices(c: InterpretationChoices | null | undefined): string | null {
  if (!c) return null;
  const round = (v: number | null | undefined) =>
    v === null || v === undefined ? null : Math.round(v * 1e4) / 1e4;
  const form = {
    method: c.method,
    datum: round(c.datum),
    xy: c.method === "grm" ? round(c.xy) : null,
    assignments: c.assignments ?? null,
    elevations: c.elevations ?? null,
  };
  const isDefault =
    form.method === "plus-minus" &&
    form.datum === null &&
    form.assignments === null &&
    form.elevations === null;
  return isDefault ? null : JSON.stringify(form);
}

/** Wait after the last change before the choices are saved, ms. */
const SAVE_DELAY = 700;

/** The interpretation card of the Field check. */
export function InterpretationPanel({
  planId,
  canSave = false,
  picks,
  models,
  candidates,
  pickError,
  units,
}: {
  /** The plan whose saved picks hold the choices. */
  planId: string;
  /** Whether the user may change the plan's field data (the choices are then saved). */
  canSave?: boolean;
  picks: readonly FirstBreakPick[];
  /** The plan's models as stored (layered and section). */
  models: readonly unknown[];
  candidates: readonly Candidate[];
  pickError: number;
  units: UnitSystem;
}) {
  const savedSet = usePicks(planId).data;
  const stored = savedSet?.interpretation ?? null;
  const [method, setMethod] = useState<LineMethod>(stored?.method ?? "plus-minus");
  const [datumText, setDatumText] = useState(() => lengthText(stored?.datum, units));
  const [xyText, setXyText] = useState(() =>
    stored?.method === "grm" ? lengthText(stored.xy, units) : "",
  );
  const [elevations, setElevations] = useState<ElevationPoint[] | null>(stored?.elevations ?? null);
  const [elevationNote, setElevationNote] = useState<string | null>(
    stored?.elevations?.length
      ? `${stored.elevations.length} station elevations saved with the picks.`
      : null,
  );
  const [assignments, setAssignments] = useState<LayerAssignment[] | null>(
    stored?.assignments ?? null,
  );
  const [result, setResult] = useState<PlanInterpretation | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [running, setRunning] = useState(false);
  const saveChoices = useSaveInterpretation(planId);
  /** Whether the user changed a choice here (a restored one in feet must not be re-saved). */
  const [touched, setTouched] = useState(false);

  const datum = typed(datumText);
  const datumBad = datum !== null && !Number.isFinite(datum);
  const xyShown = typed(xyText);
  const xyMetres =
    method === "grm" && xyShown !== null && Number.isFinite(xyShown)
      ? fromDisplay("length", xyShown, units)
      : null;
  const xyBad =
    method === "grm" &&
    xyShown !== null &&
    (!Number.isFinite(xyShown) || xyMetres === null || xyMetres < 0 || xyMetres > 1000);
  const observed = useMemo(
    () =>
      picks.map((p) => ({
        sourcePosition: p.sourcePosition,
        receiverPosition: p.receiverPosition,
        time: p.time,
      })),
    [picks],
  );

  const datumMetres = datum === null || datumBad ? null : fromDisplay("length", datum, units);
  const xyUsed = xyBad ? null : xyMetres;

  useEffect(() => {
    if (datumBad || xyBad || observed.length === 0) return;
    let live = true;
    setRunning(true);
    fieldWorker()
      .interpret({ models: [...models], criteria: { pickError } }, observed, {
        method,
        assignments,
        elevations,
        datum: datumMetres,
        xy: xyUsed,
      })
      .then((r) => {
        if (!live) return;
        setResult(r);
        setError(null);
      })
      .catch((e: unknown) => {
        if (!live) return;
        setResult(null);
        setError(errorMessage(e));
      })
      .finally(() => live && setRunning(false));
    return () => {
      live = false;
    };
  }, [
    observed,
    models,
    pickError,
    method,
    assignments,
    elevations,
    datumMetres,
    datumBad,
    xyUsed,
    xyBad,
  ]);

  // Keep the choices with the saved picks a moment after they change (not while a box is bad).
  const pickSetSaved = savedSet?.revision !== null && savedSet?.revision !== undefined;
  const current: InterpretationChoices = {
    method,
    datum: datumMetres,
    xy: method === "grm" ? xyUsed : null,
    assignments,
    elevations,
  };
  const currentKey = canonicalChoices(current);
  const storedKey = canonicalChoices(stored);
  const unsaved = touched && currentKey !== storedKey;
  const { mutate: mutateChoices } = saveChoices;
  useEffect(() => {
    if (!canSave || !pickSetSaved || !unsaved || datumBad || xyBad) return;
    const timer = setTimeout(() => {
      mutateChoices({
        interpretation:
          currentKey === null ? null : (JSON.parse(currentKey) as InterpretationChoices),
      });
    }, SAVE_DELAY);
    return () => clearTimeout(timer);
  }, [canSave, pickSetSaved, unsaved, datumBad, xyBad, currentKey, mutateChoices]);

  const shown = assignments ?? result?.assignments ?? [];
  const maxLayer = Math.max(2, ...candidates.map((c) => c.model.layers.length));
  const editAssignment = (i: number, patch: Partial<LayerAssignment>) => {
    const next = shown.map((a, k) => (k === i ? { ...a, ...patch } : a));
    setTouched(true);
    setAssignments(next);
  };

  const loadElevations = async (file: File | undefined) => {
    if (!file) return;
    const read = await fieldWorker().parseElevationCsv(await file.text());
    if (!read.ok) {
      setElevationNote(`${file.name}: ${read.errors.map((e) => e.message).join("; ")}`);
      return;
    }
    setTouched(true);
    setElevations(read.points);
    setElevationNote(`${read.points.length} station elevations from ${file.name}.`);
  };

  const unitL = unitLabel("length", units);
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-4 text-sm">
        <label className="flex flex-col gap-1">
          <span className="font-medium text-ink">Method</span>
          <select
            className="field-input py-1"
            value={method}
            onChange={(e) => {
              setTouched(true);
              setMethod(e.target.value as LineMethod);
            }}
          >
            {(Object.keys(LINE_METHODS) as LineMethod[]).map((m) => (
              <option key={m} value={m}>
                {LINE_METHODS[m]}
              </option>
            ))}
          </select>
        </label>
        {method === "grm" ? (
          <label className="flex flex-col gap-1">
            <span className="font-medium text-ink">XY distance ({unitL})</span>
            <input
              className="field-input w-28 py-1"
              inputMode="decimal"
              placeholder="optimum"
              value={xyText}
              aria-invalid={xyBad}
              onChange={(e) => {
                setTouched(true);
                setXyText(e.target.value);
              }}
            />
          </label>
        ) : null}
        <label className="flex flex-col gap-1">
          <span className="font-medium text-ink">Datum elevation ({unitL})</span>
          <input
            className="field-input w-32 py-1"
            inputMode="decimal"
            placeholder="lowest station"
            value={datumText}
            aria-invalid={datumBad}
            onChange={(e) => {
              setTouched(true);
              setDatumText(e.target.value);
            }}
          />
        </label>
        <label className="flex flex-col gap-1">
          <span className="font-medium text-ink">
            Station elevations (CSV: position_m, elevation_m)
          </span>
          <input
            type="file"
            accept=".csv,.txt"
            className="text-sm"
            onChange={(e) => void loadElevations(e.target.files?.[0])}
          />
        </label>
        {elevations ? (
          <Button
            variant="quiet"
            onClick={() => {
              setTouched(true);
              setElevations(null);
            }}
          >
            Use the plan's surface
          </Button>
        ) : null}
      </div>
      {datumBad ? <Notice tone="caution">The datum must be a number of {unitL}.</Notice> : null}
      {xyBad ? (
        <Notice tone="caution">
          The XY distance must be a number of {unitL} from 0 to{" "}
          {formatQuantity("length", 1000, units, 0)}, or empty for the optimum.
        </Notice>
      ) : null}
      <p className="text-xs text-ink-soft" role="status">
        {!canSave
          ? "Your choices here are for this view only: the report and interpretation.csv use the ones saved with the picks."
          : !pickSetSaved
            ? "Save the picks to keep these choices for the report and interpretation.csv."
            : saveChoices.isPending || (unsaved && !datumBad && !xyBad)
              ? "Keeping your choices with the picks…"
              : stored
                ? "Your choices are kept with the picks; the report and interpretation.csv use them."
                : "The defaults are in use; the report and interpretation.csv use them too."}
      </p>
      {pickSetSaved && !unsaved ? (
        <a
          className="self-start text-sm font-medium text-ink underline decoration-rule underline-offset-2 hover:decoration-ink print:hidden"
          href={exportUrls(planId).interpretation}
          download
        >
          Download the interpreted section (CSV)
        </a>
      ) : null}
      {saveChoices.isError ? (
        <Notice tone="caution">
          Your choices could not be kept: {errorMessage(saveChoices.error)}
        </Notice>
      ) : null}
      {elevationNote ? <p className="text-xs text-ink-soft">{elevationNote}</p> : null}

      <div>
        <h3 className="mb-1 text-sm font-semibold text-ink">Picks assigned to refractors</h3>
        <p className="mb-2 text-xs text-ink-soft">
          {assignments
            ? "Your assignment. "
            : result?.suggestedFrom
              ? `Suggested by “${result.suggestedFrom}”, the best-fitting candidate. `
              : ""}
          Layer 1 is the direct wave; layer 2 the head wave along the top of layer 2, and so on.
          Geophones between “from” and “to” of a shot belong to that layer.
        </p>
        {/* A table on wider screens; on a phone each segment is a small block (shot, then from
            and to side by side, then the layer) so no box is squeezed or cut off. */}
        <table className="text-sm max-sm:block max-sm:w-full">
          <caption className="sr-only">Segments assigned to refractors</caption>
          <thead className="max-sm:hidden">
            <tr className="text-left text-ink-soft">
              <th className="pr-4 font-medium">Shot ({unitL})</th>
              <th className="pr-4 font-medium">From ({unitL})</th>
              <th className="pr-4 font-medium">To ({unitL})</th>
              <th className="pr-4 font-medium">Layer</th>
            </tr>
          </thead>
          <tbody className="max-sm:block">
            {shown.map((a, i) => (
              <tr
                key={`${a.shot}-${a.from}-${i}`}
                className="max-sm:grid max-sm:grid-cols-2 max-sm:gap-x-3 max-sm:gap-y-1 max-sm:border-b max-sm:border-rule/60 max-sm:py-2"
              >
                <td className="pr-4 font-mono max-sm:col-span-2">
                  <span className="font-sans text-xs text-ink-soft sm:hidden">Shot at </span>
                  {length(a.shot, units)}
                </td>
                {(["from", "to"] as const).map((key) => (
                  <td key={key} className="pr-4 max-sm:pr-0">
                    <span className="block text-xs text-ink-soft sm:hidden" aria-hidden>
                      {key === "from" ? "From" : "To"} ({unitL})
                    </span>
                    <input
                      className="field-input w-24 py-0.5 font-mono"
                      aria-label={`Segment ${i + 1} ${key}`}
                      defaultValue={String(
                        Number(
                          toDisplay("length", a[key], units).toFixed(inputDigits("length", units)),
                        ),
                      )}
                      onBlur={(e) => {
                        const v = Number(e.target.value.replace(",", "."));
                        if (Number.isFinite(v)) {
                          editAssignment(i, { [key]: fromDisplay("length", v, units) });
                        }
                      }}
                    />
                  </td>
                ))}
                <td className="pr-4 max-sm:col-span-2 max-sm:pr-0">
                  <span className="block text-xs text-ink-soft sm:hidden" aria-hidden>
                    Layer
                  </span>
                  <select
                    className="field-input py-0.5"
                    aria-label={`Segment ${i + 1} layer`}
                    value={a.layer}
                    onChange={(e) => editAssignment(i, { layer: Number(e.target.value) })}
                  >
                    {Array.from({ length: maxLayer }, (_, k) => k + 1).map((l) => (
                      <option key={l} value={l}>
                        {l === 1 ? "1 (direct wave)" : `${l}`}
                      </option>
                    ))}
                  </select>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        {assignments ? (
          <Button
            variant="quiet"
            onClick={() => {
              setTouched(true);
              setAssignments(null);
            }}
          >
            Back to the suggestion
          </Button>
        ) : null}
      </div>

      {running && !result ? <p className="text-sm text-ink-soft">Interpreting…</p> : null}
      {error ? <Notice tone="caution">{error}</Notice> : null}
      {result ? (
        <InterpretationResult result={result} candidates={candidates} units={units} />
      ) : null}
    </div>
  );
}

function InterpretationResult({
  result,
  candidates,
  units,
}: {
  result: PlanInterpretation;
  candidates: readonly Candidate[];
  units: UnitSystem;
}) {
  const r = result.result;
  const positions = [
    ...new Set(r.refractors.flatMap((ref) => ref.depth.map((d) => d.position))),
  ].sort((a, b) => a - b);
  const at = (layer: number, x: number) =>
    r.refractors
      .find((ref) => ref.layer === layer)
      ?.depth.find((d) => Math.abs(d.position - x) < 0.001);
  const velocityAt = (layer: number, x: number) =>
    r.refractors
      .find((ref) => ref.layer === layer)
      ?.velocity.find((v) => Math.abs(v.position - x) < 0.001)?.value;
  return (
    <div className="flex flex-col gap-4">
      <p className="text-sm text-ink-soft">
        Top layer {formatQuantity("velocity", r.topVelocity, units, 0)} (direct wave); datum{" "}
        {length(r.datum, units)}; elevations{" "}
        {result.elevationSource === "csv"
          ? "from your CSV"
          : result.elevationSource === "plan"
            ? "from the plan's section surface"
            : "flat (no elevations given)"}
        . Depths are below the ground; ± is one standard error from the plan's pick error.
      </p>
      {r.notes.map((n) => (
        <Notice key={n} tone="caution">
          {n}
        </Notice>
      ))}
      <ul className="text-sm" aria-label="Refractor velocities">
        {r.refractors.map((ref) => (
          <li key={ref.layer}>
            Top of layer {ref.layer}: {formatQuantity("velocity", ref.meanVelocity, units, 0)} ±{" "}
            {formatQuantity("velocity", ref.meanVelocitySigma, units, 0)} over the whole stretch
            between the shots at {length(ref.shots[0], units)} and {length(ref.shots[1], units)}
            {ref.xy
              ? `; XY ${length(ref.xy.used, units)} (two-layer estimate ${length(ref.xy.expected, units)})`
              : ""}
            . The table's velocities come from{" "}
            {ref.method === "grm" ? "the velocity analysis function" : "the minus times"} of five
            neighbouring geophones and scatter more.
          </li>
        ))}
      </ul>
      {r.refractors.flatMap((ref) =>
        ref.notes.map((n) => (
          <p key={`${ref.layer}-${n}`} className="text-xs text-ink-soft">
            Layer {ref.layer}: {n}
          </p>
        )),
      )}
      {r.refractors.length > 0 ? (
        <InterpretedSection result={result} candidates={candidates} units={units} />
      ) : null}

      {r.refractors.length > 0 ? (
        <div>
          {/* Below 640 px each geophone is a small card (as the segments above), and no value
              is split from its unit. */}
          <table className="w-full text-sm max-sm:block">
            <caption className="mb-1 text-left text-sm font-semibold text-ink max-sm:block">
              Under every geophone
            </caption>
            <thead className="max-sm:hidden">
              <tr className="text-left text-ink-soft">
                <th className="pr-3 font-medium">Geophone</th>
                {r.refractors.map((ref) => (
                  <th key={ref.layer} className="pr-3 font-medium" colSpan={3}>
                    Top of layer {ref.layer} ({LINE_METHODS[ref.method]})
                  </th>
                ))}
              </tr>
              <tr className="text-left text-xs text-ink-soft">
                <th />
                {r.refractors.map((ref) => [
                  <th key={`${ref.layer}d`} className="pr-3 font-normal">
                    depth ± σ
                  </th>,
                  <th key={`${ref.layer}e`} className="pr-3 font-normal">
                    elevation
                  </th>,
                  <th key={`${ref.layer}v`} className="pr-3 font-normal">
                    velocity
                  </th>,
                ])}
              </tr>
            </thead>
            <tbody className="font-mono max-sm:block">
              {positions.map((x) => (
                <tr key={x} className={PHONE_CARD}>
                  <td className="pr-3 whitespace-nowrap max-sm:basis-full max-sm:font-semibold">
                    <span className="font-sans font-normal text-ink-soft sm:hidden">
                      Geophone at{" "}
                    </span>
                    {length(x, units)}
                  </td>
                  {r.refractors.map((ref) => {
                    const d = at(ref.layer, x);
                    const layer = r.refractors.length > 1 ? `layer ${ref.layer} ` : "";
                    return [
                      <td key={`${ref.layer}d`} className="pr-3 whitespace-nowrap max-sm:pr-0">
                        <PhoneLabel>{layer}depth ± σ</PhoneLabel>
                        {d
                          ? `${length(d.depth, units)} ± ${formatQuantity("length", d.sigma, units, lengthDigits(units))}${d.phantom ? " *" : ""}`
                          : "—"}
                      </td>,
                      <td key={`${ref.layer}e`} className="pr-3 whitespace-nowrap max-sm:pr-0">
                        <PhoneLabel>{layer}elevation</PhoneLabel>
                        {d ? length(d.elevation, units) : "—"}
                      </td>,
                      <td key={`${ref.layer}v`} className="pr-3 whitespace-nowrap max-sm:pr-0">
                        <PhoneLabel>{layer}velocity</PhoneLabel>
                        {formatQuantity("velocity", velocityAt(ref.layer, x), units, 0)}
                      </td>,
                    ];
                  })}
                </tr>
              ))}
            </tbody>
          </table>
          {r.refractors.some((ref) => ref.depth.some((d) => d.phantom)) ? (
            <p className="mt-1 text-xs text-ink-soft">
              * phantomed: a time from a farther shot on the same side, shifted onto this shot's
              branch.
            </p>
          ) : null}
        </div>
      ) : null}

      {result.misfits.length > 0 && r.refractors.length > 0 ? (
        <table className="text-sm">
          <caption className="mb-1 text-left text-sm font-semibold text-ink">
            Interpreted depths against each candidate (RMS difference)
          </caption>
          <thead>
            <tr className="text-left text-ink-soft">
              <th className="pr-4 font-medium">Candidate</th>
              {r.refractors.map((ref) => (
                <th key={ref.layer} className="pr-4 font-medium">
                  Top of layer {ref.layer}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {result.misfits.map((m) => (
              <tr key={m.name}>
                <td className="pr-4">{m.name}</td>
                {r.refractors.map((ref) => (
                  <td key={ref.layer} className="pr-4 font-mono whitespace-nowrap">
                    {length(m.layers.find((l) => l.layer === ref.layer)?.rms ?? null, units)}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}

      <table className="text-sm max-sm:block">
        <caption className="mb-1 text-left text-sm font-semibold text-ink max-sm:block">
          Reciprocal times (each pair of shots)
        </caption>
        <thead className="max-sm:hidden">
          <tr className="text-left text-ink-soft">
            <th className="pr-4 font-medium">Shots</th>
            <th className="pr-4 font-medium">A at B</th>
            <th className="pr-4 font-medium">B at A</th>
            <th className="pr-4 font-medium">Difference</th>
            <th className="pr-4 font-medium">Check</th>
          </tr>
        </thead>
        <tbody className="max-sm:block">
          {r.reciprocal.length === 0 ? (
            <tr className="max-sm:block">
              <td colSpan={5} className="text-ink-soft">
                No pair of shots records the other's position.
              </td>
            </tr>
          ) : (
            r.reciprocal.map((c) => (
              <tr key={`${c.shots[0]}-${c.shots[1]}`} className={PHONE_CARD}>
                <td className="pr-4 font-mono whitespace-nowrap max-sm:basis-full max-sm:font-semibold">
                  <span className="font-sans font-normal text-ink-soft sm:hidden">Shots </span>
                  {length(c.shots[0], units)} ↔ {length(c.shots[1], units)}
                </td>
                <td className="pr-4 font-mono whitespace-nowrap max-sm:pr-0">
                  <PhoneLabel>A at B</PhoneLabel>
                  {formatQuantity("time", c.forward, units, 2)}
                </td>
                <td className="pr-4 font-mono whitespace-nowrap max-sm:pr-0">
                  <PhoneLabel>B at A</PhoneLabel>
                  {formatQuantity("time", c.reverse, units, 2)}
                </td>
                <td className="pr-4 font-mono whitespace-nowrap max-sm:pr-0">
                  <PhoneLabel>Difference</PhoneLabel>
                  {formatQuantity("time", c.difference, units, 2)}
                </td>
                <td
                  className={`pr-4 max-sm:basis-full ${c.agrees ? "text-moss" : "font-semibold text-brick"}`}
                >
                  {c.agrees
                    ? "agree"
                    : `differ by more than ${formatQuantity("time", c.tolerance, units, 1)}: check the picks, shot positions or trigger`}
                  {c.extrapolated ? " (extended beyond the picks)" : ""}
                </td>
              </tr>
            ))
          )}
        </tbody>
      </table>
      <p className="text-xs text-ink-soft">
        Allowed difference: the larger of 2 ms and three times the error of a difference of two
        picks (a few milliseconds is common practice). An interpretation is a model, not ground
        truth: boreholes and a qualified geophysicist's review decide.
      </p>
    </div>
  );
}
