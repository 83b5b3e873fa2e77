import { useFormContext, useFormState, useWatch } from "react-hook-form";
import { useSearchParams } from "react-router-dom";
import { formatQuantity, unitLabel, type UnitSystem } from "@/lib/units";
import { Field } from "@/components/field";
import type { Plan, PlanAnalysis } from "../../lib/engine";
import type { PlanForm } from "../../lib/plan-form";
import { DEFAULT_ROLL_ALONG_OVERLAP } from "../../lib/apply-choices";
import { SHOWN_SPREAD_PARAM, rollAlongRows, typedRollAlongLine } from "../../lib/roll-along-view";
import { VerdictBadge } from "../verdict-badge";
import { errorAt } from "./ground-models-panel";
import { PhoneLabel } from "./cell-input";

/** A table row on a phone: the spread across the top, the values two by two under it. */
const PHONE_ROW = "max-sm:grid max-sm:grid-cols-2 max-sm:gap-x-3 max-sm:gap-y-1 max-sm:py-1.5";
const PHONE_HEAD = "max-sm:col-span-2 max-sm:p-0";
const PHONE_CELL = "max-sm:p-0 max-sm:text-left max-sm:whitespace-normal";

/**
 * Roll-along boxes of the Spread panel: off by default; on, the number of spreads and the
 * geophone stations neighbours share, with the line they make (stations, length, numbers).
 */
export function RollAlongFields({ units }: { units: UnitSystem }) {
  const { control, register, setValue } = useFormContext<PlanForm>();
  const { errors } = useFormState({ control, name: "spread.rollAlong" });
  const spread = useWatch({ control, name: "spread" });
  const roll = spread?.rollAlong;
  const line = typedRollAlongLine(spread, units);
  const len = (m: number) => formatQuantity("length", m, units);
  const m = unitLabel("length", units);
  const spacing = line ? line.length / Math.max(1, line.stations - 1) : 0;
  const fixedShots = (spread?.shots ?? []).filter((row) => !row.anchor).length;
  return (
    <fieldset>
      <legend className="mb-2 text-sm font-semibold text-ink">Roll-along</legend>
      <label className="flex items-center gap-2 text-sm text-ink">
        <input
          type="checkbox"
          checked={!!roll?.on}
          onChange={(e) =>
            setValue(
              "spread.rollAlong",
              {
                on: e.target.checked,
                spreads: roll?.spreads || "2",
                overlap: roll?.overlap || String(DEFAULT_ROLL_ALONG_OVERLAP),
              },
              { shouldDirty: true, shouldValidate: true },
            )
          }
        />
        Lay the line as several spreads (the Channels above are per spread)
      </label>
      {roll?.on ? (
        <>
          <div className="mt-2 grid grid-cols-1 gap-3 sm:grid-cols-2">
            <Field label="Spreads" error={errorAt(errors, "spread.rollAlong.spreads")}>
              <input
                className="field-input font-mono"
                inputMode="numeric"
                {...register("spread.rollAlong.spreads")}
              />
            </Field>
            <Field
              label="Overlap (geophones shared)"
              hint={`Stations two neighbouring spreads share; ${DEFAULT_ROLL_ALONG_OVERLAP} is common practice.`}
              error={errorAt(errors, "spread.rollAlong.overlap")}
            >
              <input
                className="field-input font-mono"
                inputMode="numeric"
                {...register("spread.rollAlong.overlap")}
              />
            </Field>
          </div>
          {line ? (
            <p className="mt-2 text-xs text-ink-soft" aria-live="polite">
              Line of {line.spreads} spreads: {line.stations} stations, numbered 1–{line.stations},
              over {len(line.length)} from {len(line.firstGeophone)} to {len(line.lastGeophone)};
              each spread moves on {line.step} stations ({len(line.step * spacing)}).
            </p>
          ) : (
            <p className="mt-2 text-xs text-ink-soft">
              Fill in spacing ({m}), channels, spreads and overlap to see the line.
            </p>
          )}
          {fixedShots > 0 ? (
            <p className="mt-2 text-xs text-ink" data-testid="roll-along-fixed-shots">
              {fixedShots === 1 ? "1 shot is" : `${fixedShots} shots are`} fixed: a fixed shot is
              recorded by one spread only (the one whose centre is nearest). Place end and off-end
              shots from the spread&rsquo;s start or end (Where, below) to shoot them on every
              spread.
            </p>
          ) : null}
        </>
      ) : null}
    </fieldset>
  );
}

/**
 * The spreads of a roll-along line: stations, geophone positions, the shots each records and,
 * when the analysis judged them, each spread's verdict; a choice of the spread the charts show
 * (only when the analysis carries the spreads). Nothing for a plan without roll-along.
 */
export function RollAlongTable({
  plan,
  analysis,
  units,
}: {
  plan: Plan;
  analysis: PlanAnalysis | null;
  units: UnitSystem;
}) {
  const [search, setSearch] = useSearchParams();
  // The page asks the modeller for the spread named in the URL (see shownSpreadParam).
  const onShow = (spread: number) =>
    setSearch(
      (prev) => {
        const next = new URLSearchParams(prev);
        next.set(SHOWN_SPREAD_PARAM, String(spread));
        return next;
      },
      { replace: true },
    );
  const rows = rollAlongRows(plan, analysis);
  if (rows.length === 0) return null;
  const len = (m: number) => formatQuantity("length", m, units);
  const roll = analysis?.rollAlong;
  // The choice shows at once; the analysis of that spread follows a moment later.
  const requested = Number(search.get(SHOWN_SPREAD_PARAM));
  const selected = rows.some((r) => r.index === requested && r.shots.length > 0)
    ? requested
    : roll?.shown;
  const judged = rows.some((r) => r.worstStatus);
  const stations = rows[rows.length - 1].lastStation;
  return (
    <section aria-label="Roll-along spreads" className="mb-3 rounded-md border border-rule p-2">
      <div className="mb-1 flex flex-wrap items-center justify-between gap-2">
        <h3 className="text-sm font-semibold text-ink-deep">
          Roll-along: {rows.length} spreads, stations 1–{stations}
        </h3>
        {roll ? (
          <label className="flex items-center gap-2 text-xs text-ink">
            Charts show spread
            <select
              className="field-input w-auto! px-1! py-0.5! text-xs!"
              value={selected}
              onChange={(e) => onShow(Number(e.target.value))}
            >
              {rows.map((r) => (
                <option key={r.index} value={r.index} disabled={r.shots.length === 0}>
                  {r.index}
                </option>
              ))}
            </select>
          </label>
        ) : null}
      </div>
      <div className="sm:overflow-x-auto">
        <table className="w-full text-xs max-sm:block">
          <thead className="text-left tracking-wide text-ink-soft uppercase max-sm:hidden">
            <tr className="border-b border-rule">
              <th scope="col" className="py-1 pr-2 font-semibold">
                Spread
              </th>
              <th scope="col" className="py-1 pr-2 font-semibold">
                Stations
              </th>
              <th scope="col" className="py-1 pr-2 font-semibold">
                Geophones
              </th>
              <th scope="col" className="py-1 pr-2 font-semibold">
                Shots it records
              </th>
              {judged ? (
                <th scope="col" className="py-1 font-semibold">
                  Verdict
                </th>
              ) : null}
            </tr>
          </thead>
          <tbody className="max-sm:block">
            {rows.map((r) => (
              <tr
                key={r.index}
                className={`border-b border-rule/60 align-top ${PHONE_ROW} ${
                  roll?.shown === r.index ? "bg-paper-deep" : ""
                }`}
                aria-current={roll?.shown === r.index ? "true" : undefined}
              >
                <th
                  scope="row"
                  className={`py-1 pr-2 text-left font-mono font-medium ${PHONE_HEAD}`}
                >
                  <span className="sm:hidden">Spread </span>
                  {r.index}
                </th>
                <td className={`py-1 pr-2 font-mono whitespace-nowrap ${PHONE_CELL}`}>
                  <PhoneLabel>Stations</PhoneLabel>
                  {r.firstStation}–{r.lastStation}
                </td>
                <td className={`py-1 pr-2 font-mono whitespace-nowrap ${PHONE_CELL}`}>
                  <PhoneLabel>Geophones</PhoneLabel>
                  {len(r.firstGeophone)} to {len(r.lastGeophone)}
                </td>
                <td className={`py-1 pr-2 ${PHONE_CELL}`}>
                  <PhoneLabel>Shots it records</PhoneLabel>
                  {r.shots.length === 0
                    ? "none"
                    : r.shots.map((s) => `${s.label} at ${len(s.position)}`).join(", ")}
                </td>
                {judged ? (
                  <td className={`py-1 ${PHONE_CELL}`}>
                    <PhoneLabel>Verdict</PhoneLabel>
                    {r.worstStatus ? <VerdictBadge verdict={r.worstStatus} /> : "—"}
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
