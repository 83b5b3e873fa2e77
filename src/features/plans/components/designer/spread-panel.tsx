import { useFieldArray, useFormContext, useFormState, useWatch } from "react-hook-form";
import { MAX_SHOTS, defaultAnchor } from "@engine";
import { Button } from "@/components/button";
import { Field } from "@/components/field";
import { formatInput, formatQuantity, parseInput, unitLabel, type UnitSystem } from "@/lib/units";
import type { PlanForm } from "../../lib/plan-form";
import { patternShots, spreadFigures, type ShotPattern } from "../../lib/spread-figures";
import { useDesignerSlots } from "../../designer-slots";
import { AnchorCommentsChip } from "./anchor-comments";
import { CellInput, PhoneLabel } from "./cell-input";
import { SourceReachPanel } from "./source-reach-panel";
import { RollAlongFields } from "./roll-along-panel";
import { ANCHOR_CHOICES, anchorChange, rowPosition } from "../../lib/shot-rows";
import { errorAt } from "./ground-models-panel";
import { useTypedNumber } from "../../hooks/use-typed-number";

const PATTERNS: Array<{ pattern: ShotPattern; label: string }> = [
  { pattern: "ends", label: "End shots" },
  { pattern: "off-end", label: "Off-end shots" },
  { pattern: "centre", label: "Centre shot" },
  { pattern: "interior", label: "Interior shots" },
];

/** Spread: geophone spacing and count, where the line starts, the shots, and the criteria. */
export function SpreadPanel({ units, readOnly }: { units: UnitSystem; readOnly: boolean }) {
  const { control, register, setValue } = useFormContext<PlanForm>();
  const { errors } = useFormState({ control });
  const shots = useFieldArray({ control, name: "spread.shots" });
  const spread = useWatch({ control, name: "spread" });
  const m = unitLabel("length", units);
  const comments = useDesignerSlots() !== null;

  // Unchanged boxes stand for their stored SI values, as in the analysis (use-typed-number.ts).
  const parse = useTypedNumber();
  const geometry = {
    spacing: parse("length", spread?.spacing, units),
    channels: parseInput("count", spread?.channels, units),
    firstGeophone: parse("length", spread?.firstGeophone, units),
  };
  const sound =
    geometry.spacing !== undefined &&
    geometry.spacing > 0 &&
    geometry.channels !== undefined &&
    Number.isInteger(geometry.channels) &&
    geometry.channels >= 1 &&
    geometry.firstGeophone !== undefined &&
    Number.isFinite(geometry.firstGeophone);
  const shotPositions = (spread?.shots ?? []).map((s) =>
    rowPosition(s, sound ? (geometry as never) : null, units, parse),
  );
  const figures = sound
    ? spreadFigures(
        geometry as { spacing: number; channels: number; firstGeophone: number },
        shotPositions.map((p) => (p !== undefined && Number.isFinite(p) ? p : Number.NaN)),
      )
    : null;

  const addPattern = (pattern: ShotPattern) => {
    if (!sound) return;
    // A shot within a tenth of a spacing of one already there is the same shot: boxes in
    // feet round to 0.01 ft, so positions worked out from them differ by a few millimetres.
    const key = (p: number) => formatInput("length", p, units);
    const near = (geometry.spacing as number) / 10;
    const taken = shotPositions.filter((p): p is number => p !== undefined && Number.isFinite(p));
    for (const shot of patternShots(geometry as never, pattern)) {
      const position = key(shot.position);
      if (taken.some((p) => Math.abs(p - shot.position) < near)) continue;
      if (shots.fields.length >= MAX_SHOTS) break;
      // End, off-end and centre shots follow the spread (shot-anchors.ts).
      const anchor = defaultAnchor(shot.position, geometry as never);
      shots.append(
        anchor
          ? {
              position,
              label: shot.label,
              anchor: anchor.to,
              offset: formatInput("length", anchor.offset, units),
            }
          : { position, label: shot.label },
      );
      taken.push(shot.position);
    }
  };

  const shotsError = errorAt(errors, "spread.shots");

  return (
    <div className="flex flex-col gap-5">
      <fieldset>
        <legend className="mb-2 text-sm font-semibold text-ink">Geophones</legend>
        <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
          <Field label={`Spacing (${m})`} error={errorAt(errors, "spread.spacing")}>
            <input
              className="field-input font-mono"
              inputMode="decimal"
              {...register("spread.spacing")}
            />
          </Field>
          <Field label="Channels" error={errorAt(errors, "spread.channels")}>
            <input
              className="field-input font-mono"
              inputMode="numeric"
              {...register("spread.channels")}
            />
          </Field>
          <Field label={`First geophone at (${m})`} error={errorAt(errors, "spread.firstGeophone")}>
            <input
              className="field-input font-mono"
              inputMode="decimal"
              {...register("spread.firstGeophone")}
            />
          </Field>
        </div>
        {figures ? (
          <p className="mt-2 font-mono text-xs text-ink-soft" aria-live="polite">
            Spread length {formatQuantity("length", figures.length, units)} · geophones from{" "}
            {formatQuantity("length", figures.first, units)} to{" "}
            {formatQuantity("length", figures.last, units)}
            {spread?.rollAlong?.on ? " · spread 1 of the line, as are the shot offsets below" : ""}
          </p>
        ) : null}
      </fieldset>

      <RollAlongFields units={units} />

      <fieldset>
        <legend className="mb-2 text-sm font-semibold text-ink">Shots</legend>
        {!readOnly ? (
          <div className="mb-2 flex flex-wrap gap-1.5" aria-label="Add shots">
            {PATTERNS.map(({ pattern, label }) => (
              <Button
                key={pattern}
                variant="secondary"
                className="px-2.5! py-1! text-xs!"
                disabled={!sound || shots.fields.length >= MAX_SHOTS}
                onClick={() => addPattern(pattern)}
              >
                + {label}
              </Button>
            ))}
            <Button
              variant="quiet"
              className="px-2.5! py-1! text-xs!"
              disabled={shots.fields.length >= MAX_SHOTS}
              onClick={() => shots.append({ position: "", label: "" })}
            >
              + Shot at…
            </Button>
          </div>
        ) : null}
        <table className="w-full text-sm max-sm:block">
          <thead className="text-left text-xs tracking-wide text-ink-soft uppercase max-sm:hidden">
            <tr className="border-b border-rule">
              <th scope="col" className="w-8 py-1.5 font-semibold">
                #
              </th>
              <th scope="col" className="w-44 py-1.5 pr-2 font-semibold">
                Where ({m})
              </th>
              <th scope="col" className="py-1.5 pr-2 font-semibold">
                Label
              </th>
              <th scope="col" className="py-1.5 pr-2 font-semibold">
                Offsets it records
              </th>
              <th scope="col">
                <span className="sr-only">
                  {!comments ? "Remove" : readOnly ? "Comments" : "Comments and removal"}
                </span>
              </th>
            </tr>
          </thead>
          <tbody className="max-sm:block">
            {shots.fields.map((field, i) => {
              const f = figures?.shots[i];
              return (
                <tr
                  key={field.id}
                  className="border-b border-rule/60 align-top max-sm:grid max-sm:grid-cols-[1.25rem_minmax(0,1fr)_auto] max-sm:gap-x-2 max-sm:gap-y-1 max-sm:py-2"
                >
                  <td className="py-1.5 pt-2.5 font-mono text-xs text-ink-soft max-sm:p-0 max-sm:pt-1.5">
                    {i + 1}
                  </td>
                  <td className="py-1.5 pr-2 max-sm:p-0">
                    <PhoneLabel>Where ({m})</PhoneLabel>
                    <div className="flex items-start gap-1">
                      <select
                        aria-label={`Shot ${i + 1} placed`}
                        title="Fixed, or following the spread's start, end or centre"
                        className="field-input w-auto! px-1! py-1! text-xs!"
                        disabled={readOnly}
                        value={spread?.shots?.[i]?.anchor ?? ""}
                        onChange={(e) => {
                          const next = anchorChange(
                            spread.shots[i],
                            e.target.value as never,
                            sound ? (geometry as never) : null,
                            units,
                            parse,
                          );
                          setValue(`spread.shots.${i}`, next, { shouldDirty: true });
                        }}
                      >
                        {ANCHOR_CHOICES.map((c) => (
                          <option key={c.value} value={c.value}>
                            {c.label}
                          </option>
                        ))}
                      </select>
                      {spread?.shots?.[i]?.anchor ? (
                        <CellInput
                          key="offset"
                          label={`Shot ${i + 1} offset from the ${spread.shots[i].anchor} (${m})`}
                          inputMode="decimal"
                          error={
                            errorAt(errors, `spread.shots.${i}.offset`) ??
                            errorAt(errors, `spread.shots.${i}.anchor.offset`)
                          }
                          {...register(`spread.shots.${i}.offset`)}
                        />
                      ) : (
                        <CellInput
                          key="position"
                          label={`Shot ${i + 1} position (${m})`}
                          inputMode="decimal"
                          error={errorAt(errors, `spread.shots.${i}.position`)}
                          {...register(`spread.shots.${i}.position`)}
                        />
                      )}
                    </div>
                    {spread?.shots?.[i]?.anchor && f && Number.isFinite(f.position) ? (
                      <span className="mt-0.5 block font-mono text-xs text-ink-soft">
                        at {formatQuantity("length", f.position, units)}
                      </span>
                    ) : null}
                  </td>
                  <td className="py-1.5 pr-2 max-sm:col-start-2 max-sm:p-0">
                    <PhoneLabel>Label</PhoneLabel>
                    <CellInput
                      label={`Shot ${i + 1} label`}
                      className="font-sans!"
                      error={errorAt(errors, `spread.shots.${i}.label`)}
                      {...register(`spread.shots.${i}.label`)}
                    />
                  </td>
                  <td className="py-1.5 pt-2 pr-2 font-mono text-xs text-ink-soft max-sm:col-start-2 max-sm:p-0">
                    <PhoneLabel>Offsets it records</PhoneLabel>
                    {f && Number.isFinite(f.position) ? (
                      <>
                        {formatQuantity("length", f.nearestOffset, units)} to{" "}
                        {formatQuantity("length", f.farthestOffset, units)}
                        <span className="block font-sans">
                          {f.where === "inside"
                            ? "inside the spread"
                            : `${formatQuantity("length", f.outside, units)} ${f.where === "before" ? "before the first" : "beyond the last"} geophone`}
                        </span>
                      </>
                    ) : (
                      "—"
                    )}
                  </td>
                  <td className="py-1.5 max-sm:col-start-3 max-sm:row-start-1 max-sm:p-0">
                    <div className="flex justify-end gap-1">
                      <AnchorCommentsChip
                        anchor={{ kind: "shot", model: 0, index: i }}
                        label={`shot ${i + 1}`}
                      />
                      {!readOnly ? (
                        <button
                          type="button"
                          aria-label={`Remove shot ${i + 1}`}
                          title={`Remove shot ${i + 1}`}
                          disabled={shots.fields.length <= 1}
                          onClick={() => shots.remove(i)}
                          className="h-7 w-7 rounded-md border border-rule bg-card text-sm text-ink hover:bg-paper-deep disabled:opacity-40 max-sm:h-9 max-sm:w-9"
                        >
                          ✕
                        </button>
                      ) : null}
                    </div>
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
        {shotsError ? (
          <p role="alert" className="mt-2 text-xs font-medium text-brick">
            {shotsError}
          </p>
        ) : null}
      </fieldset>

      <SourceReachPanel units={units} readOnly={readOnly} />

      <fieldset>
        <legend className="mb-2 text-sm font-semibold text-ink">What counts as resolved</legend>
        <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
          <Field
            label="Minimum geophones per segment"
            hint="At least 3 gives a velocity with a residual (common practice)."
            error={errorAt(errors, "criteria.minGeophones")}
          >
            <input
              className="field-input font-mono"
              inputMode="numeric"
              {...register("criteria.minGeophones")}
            />
          </Field>
          <Field
            label="Pick error (ms)"
            hint="Hammer data: about 0.5–1 ms (common practice)."
            error={errorAt(errors, "criteria.pickError")}
          >
            <input
              className="field-input font-mono"
              inputMode="decimal"
              {...register("criteria.pickError")}
            />
          </Field>
          <Field
            label={`Depth tolerance (${m})`}
            hint="Largest acceptable depth error or uncertainty."
            error={errorAt(errors, "criteria.depthTolerance")}
          >
            <input
              className="field-input font-mono"
              inputMode="decimal"
              {...register("criteria.depthTolerance")}
            />
          </Field>
        </div>
      </fieldset>
    </div>
  );
}
