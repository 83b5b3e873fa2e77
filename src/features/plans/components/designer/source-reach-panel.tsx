import { useFormContext, useWatch } from "react-hook-form";
import {
  SITE_NOISE_LEVELS,
  SOURCE_TYPES,
  reachFlags,
  sourceReach,
  type SiteNoise,
  type SourceType,
} from "@engine";
import { formatQuantity, parseInput, type UnitSystem } from "@/lib/units";
import type { PlanForm } from "../../lib/plan-form";
import { rowPosition } from "../../lib/shot-rows";
import { useTypedNumber } from "../../hooks/use-typed-number";

const SOURCE_LABELS: Record<SourceType, string> = {
  sledgehammer: "sledgehammer",
  "weight-drop": "weight drop",
  "seismic-gun": "seismic gun",
  "buried-charge": "buried charge",
};

/**
 * Source reach: a source per shot and the site's noise give each shot a usable offset range
 * (workers/engine/source-reach.ts); a shot whose farthest geophone lies beyond it is flagged
 * with the stacking that would help. Carries the safety cautions for each kind of source.
 */
export function SourceReachPanel({ units, readOnly }: { units: UnitSystem; readOnly: boolean }) {
  const { control, register } = useFormContext<PlanForm>();
  const spread = useWatch({ control, name: "spread" });
  const parse = useTypedNumber();
  const geometry = {
    spacing: parse("length", spread?.spacing, units) ?? Number.NaN,
    channels: parseInput("count", spread?.channels, units) ?? Number.NaN,
    firstGeophone: parse("length", spread?.firstGeophone, units) ?? Number.NaN,
  };
  const sound =
    geometry.spacing > 0 && Number.isInteger(geometry.channels) && geometry.channels >= 1;
  const noise = (spread?.noise || "") as SiteNoise | "";
  const shots = spread?.shots ?? [];
  const last = geometry.firstGeophone + (geometry.channels - 1) * geometry.spacing;
  const stated = shots
    .map((row, i) => ({
      i,
      source: (row.source || "") as SourceType | "",
      at: rowPosition(row, sound ? geometry : null, units, parse),
    }))
    .filter(
      (s): s is { i: number; source: SourceType; at: number } =>
        s.source !== "" && s.at !== undefined && Number.isFinite(s.at),
    );
  const flags =
    noise && sound
      ? reachFlags(
          stated.map((s) =>
            Math.max(Math.abs(s.at - geometry.firstGeophone), Math.abs(s.at - last)),
          ),
          stated.map((s) => s.source),
          noise,
        ).map((f) => ({ ...f, shot: stated[f.shot].i }))
      : [];
  const used = new Set(stated.map((s) => s.source));
  const m = (v: number) => formatQuantity("length", v, units);
  // A source's reach is a rough figure (common practice): whole metres or feet, not 196.85 ft.
  const rough = (v: number) => formatQuantity("length", v, units, 0);

  return (
    <fieldset aria-label="Source reach">
      <legend className="mb-2 text-sm font-semibold text-ink">Sources and reach</legend>
      <div className="flex flex-wrap items-end gap-3 text-sm">
        <label className="flex flex-col gap-1">
          <span className="text-xs text-ink-soft">Site noise</span>
          <select
            className="field-input py-1! text-sm!"
            disabled={readOnly}
            {...register("spread.noise")}
          >
            <option value="">not stated</option>
            {SITE_NOISE_LEVELS.map((n) => (
              <option key={n} value={n}>
                {n}
              </option>
            ))}
          </select>
        </label>
        {shots.map((row, i) => (
          <label key={i} className="flex flex-col gap-1">
            <span className="text-xs text-ink-soft">
              Shot {i + 1}
              {row.label ? ` (${row.label})` : ""} source
            </span>
            <select
              aria-label={`Shot ${i + 1} source`}
              className="field-input py-1! text-sm!"
              disabled={readOnly}
              {...register(`spread.shots.${i}.source`)}
            >
              <option value="">not stated</option>
              {SOURCE_TYPES.map((t) => (
                <option key={t} value={t}>
                  {SOURCE_LABELS[t]}
                  {noise ? ` (to ${rough(sourceReach(t, noise))})` : ""}
                </option>
              ))}
            </select>
          </label>
        ))}
      </div>
      {flags.length > 0 ? (
        <ul className="mt-2 space-y-1 text-xs font-medium text-brick" aria-label="Reach flags">
          {flags.map((f) => (
            <li key={f.shot}>
              ⚠ Shot {f.shot + 1} must record out to {m(f.offset)}, beyond the {rough(f.reach)} a{" "}
              {SOURCE_LABELS[shots[f.shot].source as SourceType]} reaches on a {noise} site:{" "}
              {f.stacks === null
                ? "no practical stack reaches it; use a stronger source or shorten the branch."
                : `stack ${f.stacks} shots (√N gain, Yilmaz 2001) or use a stronger source.`}
            </li>
          ))}
        </ul>
      ) : null}
      <p className="mt-2 text-xs text-ink-soft">
        Single-shot reach by source and site noise is common practice (from memory); a test shot on
        site decides.
      </p>
      {used.size > 0 ? (
        <ul
          className="mt-2 list-disc space-y-0.5 pl-5 text-xs text-ink-deep"
          aria-label="Source cautions"
        >
          {used.has("sledgehammer") || used.has("weight-drop") ? (
            <li>
              Hammer and weight drop: eye and hearing protection, safety boots, keep bystanders
              clear of the strike plate; follow the manufacturer&rsquo;s lifting limits.
            </li>
          ) : null}
          {used.has("seismic-gun") ? (
            <li>
              Seismic gun: handled as a firearm under local law; only trained operators, muzzle in
              the hole, hearing protection.
            </li>
          ) : null}
          {used.has("buried-charge") ? (
            <li>
              Buried charges: only a licensed shotfirer, with the permits, storage and exclusion
              zones local law requires; check for buried utilities before drilling.
            </li>
          ) : null}
          <li>Defer to local codes and licensed practice in every case.</li>
        </ul>
      ) : null}
    </fieldset>
  );
}
