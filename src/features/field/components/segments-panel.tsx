import { useMemo, useRef, useState } from "react";
import type { FirstBreakPick } from "@/contracts/field";
import { Button } from "@/components/button";
import type { SpreadSide } from "../../../../workers/field/index";
import type { Candidate, SegmentRange } from "../lib/comparison";
import { fieldWorker } from "../lib/field-worker";
import { useFieldResult } from "../lib/use-field-result";
import { length, lengthNumber, localise, ms, speed } from "../lib/format";
import { fromDisplay, inputDigits, toDisplay, unitLabel, type UnitSystem } from "@/lib/units";

// Short enough that "shot at -100.00 m, geophones beyond (24 picks)" fits a 390 px phone.
const sideLabel = (side: SpreadSide) =>
  side === "forward" ? "geophones beyond" : "geophones before";

/**
 * User-chosen segments of one shot and side: a straight-line fit per offset range (apparent
 * velocity and intercept time) and, from two segments on, the intercept-time interpretation
 * as flat layers (Telford, Geldart & Sheriff 1990 §4.3).
 */
export function SegmentsPanel({
  picks,
  candidate,
  pickError,
  units,
}: {
  picks: readonly FirstBreakPick[];
  candidate: Candidate | undefined;
  /** The plan's pick error, s (scales the outlier check). */
  pickError: number;
  units: UnitSystem;
}) {
  // Grouping, line fits and the intercept-time reading run in the field worker.
  const observed = useMemo(
    () =>
      picks.map((p) => ({
        sourcePosition: p.sourcePosition,
        receiverPosition: p.receiverPosition,
        time: p.time,
      })),
    [picks],
  );
  const grouped = useFieldResult("shot-sides", observed, (o) => fieldWorker().shotSides(o)).data;
  const sides = useMemo(() => (grouped ?? []).filter((s) => s.count >= 2), [grouped]);
  const [choice, setChoice] = useState(0);
  const [ranges, setRanges] = useState<SegmentRange[]>([]);
  const suggestion = useRef(0);
  const current = sides[Math.min(choice, sides.length - 1)];
  const reading =
    useFieldResult(
      "segments",
      useMemo(
        () =>
          current && ranges.length > 0
            ? {
                observed,
                sourcePosition: current.sourcePosition,
                side: current.side,
                ranges,
                pickError,
              }
            : null,
        [observed, current, ranges, pickError],
      ),
      (i) =>
        fieldWorker().readSegments(i.observed, i.sourcePosition, i.side, i.ranges, i.pickError),
    ).data ?? null;
  if (!grouped) return null;
  if (!current) {
    return (
      <p className="text-sm text-ink-soft">
        Segments need at least two picks of one shot on one side.
      </p>
    );
  }
  const lenUnit = unitLabel("length", units);
  /** An offset box's text: the stored offset (m) in the user's unit, to the unit's box precision. */
  const shownOffset = (v: number) =>
    String(Number(toDisplay("length", v, units).toFixed(inputDigits("length", units))));
  const setRange = (i: number, k: 0 | 1, value: number) => {
    suggestion.current++; // a suggestion still on its way must not undo this edit
    setRanges((rs) =>
      rs.map((r, j) => (j === i ? ((k === 0 ? [value, r[1]] : [r[0], value]) as SegmentRange) : r)),
    );
  };

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3">
        {/* On a phone the choice takes the full width, so "(24 picks)" is not cut off. */}
        <label className="flex flex-col gap-1 text-sm max-sm:w-full">
          <span className="font-medium text-ink">Shot and side</span>
          <select
            className="field-input max-sm:text-sm"
            value={Math.min(choice, sides.length - 1)}
            onChange={(e) => {
              suggestion.current++;
              setChoice(Number(e.target.value));
              setRanges([]);
            }}
          >
            {sides.map((s, i) => (
              <option key={`${s.sourcePosition}-${s.side}`} value={i}>
                shot at {length(s.sourcePosition, units)}, {sideLabel(s.side)} ({s.count} picks)
              </option>
            ))}
          </select>
        </label>
        <Button
          variant="secondary"
          onClick={() =>
            setRanges((rs) => {
              const last = rs[rs.length - 1];
              const start = last ? last[1] : 0;
              // A new segment spans 10 m, or 30 ft for a feet user (a round span in the unit read).
              return [
                ...rs,
                [start, start + fromDisplay("length", units === "imperial" ? 30 : 10, units)],
              ];
            })
          }
        >
          Add segment
        </Button>
        {candidate ? (
          <Button
            variant="quiet"
            onClick={() => {
              // The model's arrivals are computed in the field worker; an answer that comes back
              // after another shot, side or suggestion was asked for is dropped.
              const ticket = ++suggestion.current;
              void fieldWorker()
                .suggestSegments(observed, current.sourcePosition, current.side, candidate.model)
                .then((ranges) => {
                  if (ticket === suggestion.current) setRanges(ranges);
                });
            }}
          >
            Suggest from {candidate.name}
          </Button>
        ) : null}
      </div>
      {ranges.length === 0 ? (
        <p className="text-sm text-ink-soft">
          Add one offset range per straight segment of the picks, nearest the shot first (the direct
          wave), then one per refractor.
        </p>
      ) : (
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Segments and their line fits</caption>
          <thead className="border-b border-rule text-xs tracking-wide text-ink-soft uppercase">
            <tr>
              <th className="py-1.5 pr-2 font-medium">Segment</th>
              <th className="py-1.5 pr-2 font-medium">Offsets from–to ({lenUnit})</th>
              <th className="py-1.5 pr-2 text-right font-medium">Picks</th>
              <th className="py-1.5 pr-2 text-right font-medium">Apparent velocity</th>
              <th className="py-1.5 pr-2 text-right font-medium">Intercept time</th>
              <th className="py-1.5 text-right font-medium">
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {ranges.map((r, i) => {
              const fit = reading?.fits[i];
              return (
                <tr key={i} className="border-b border-rule/60 align-top">
                  <td className="py-1.5 pr-2">
                    {i === 0 ? "1 (direct wave)" : `${i + 1} (refractor)`}
                  </td>
                  <td className="py-1.5 pr-2">
                    <div className="flex items-center gap-1">
                      <input
                        type="number"
                        step="any"
                        aria-label={`Segment ${i + 1} from offset (${lenUnit})`}
                        className="field-input py-0.5"
                        style={{ width: "5.5rem" }}
                        value={shownOffset(r[0])}
                        onChange={(e) =>
                          setRange(i, 0, fromDisplay("length", Number(e.target.value), units))
                        }
                      />
                      –
                      <input
                        type="number"
                        step="any"
                        aria-label={`Segment ${i + 1} to offset (${lenUnit})`}
                        className="field-input py-0.5"
                        style={{ width: "5.5rem" }}
                        value={shownOffset(r[1])}
                        onChange={(e) =>
                          setRange(i, 1, fromDisplay("length", Number(e.target.value), units))
                        }
                      />
                    </div>
                  </td>
                  {fit && fit.ok ? (
                    <>
                      <td className="py-1.5 pr-2 text-right font-mono">{fit.count}</td>
                      <td className="py-1.5 pr-2 text-right font-mono">
                        {speed(fit.velocity, units)}
                        {fit.velocityError !== null
                          ? ` ± ${Math.round(toDisplay("velocity", fit.velocityError, units))}`
                          : ""}
                      </td>
                      <td className="py-1.5 pr-2 text-right font-mono">
                        {ms(fit.intercept, 2)}
                        {fit.interceptError !== null
                          ? ` ± ${(fit.interceptError * 1000).toFixed(2)}`
                          : ""}
                      </td>
                    </>
                  ) : (
                    <td colSpan={3} className="py-1.5 pr-2 text-right text-ochre">
                      {fit && !fit.ok
                        ? localise(fit.reason, units)
                        : "the range must run from the smaller offset to the larger"}
                    </td>
                  )}
                  <td className="py-1.5 text-right">
                    <button
                      type="button"
                      className="text-xs text-brick underline"
                      onClick={() => setRanges((rs) => rs.filter((_, j) => j !== i))}
                      aria-label={`Remove segment ${i + 1}`}
                    >
                      Remove
                    </button>
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      )}
      {reading && reading.excluded.length > 0 && ranges.length > 0 ? (
        <p className="text-xs text-ochre">
          Left out of the line fits as far off their neighbours' trend: the pick
          {reading.excluded.length === 1 ? "" : "s"} at{" "}
          {reading.excluded.map((o) => length(o, units)).join(", ")} offset.
        </p>
      ) : null}
      {reading?.interpretation ? (
        reading.interpretation.ok ? (
          <div>
            <h4 className="text-sm font-semibold text-ink">
              Intercept-time interpretation (flat layers)
            </h4>
            <table className="mt-1 w-full text-left text-sm">
              <caption className="sr-only">Layers from the intercept-time method</caption>
              <thead className="border-b border-rule text-xs tracking-wide text-ink-soft uppercase">
                <tr>
                  <th className="py-1 pr-2 font-medium">Layer</th>
                  <th className="py-1 pr-2 text-right font-medium">Velocity</th>
                  <th className="py-1 pr-2 text-right font-medium">Depth to top</th>
                  <th className="py-1 text-right font-medium">Thickness</th>
                </tr>
              </thead>
              <tbody>
                {reading.interpretation.layers.map((l, i) => (
                  <tr key={i} className="border-b border-rule/60">
                    <td className="py-1 pr-2">{i + 1}</td>
                    <td className="py-1 pr-2 text-right font-mono">{speed(l.velocity, units)}</td>
                    <td className="py-1 pr-2 text-right font-mono">
                      {length(l.depth, units)}
                      {l.depthError ? ` ± ${lengthNumber(l.depthError, units)}` : ""}
                    </td>
                    <td className="py-1 text-right font-mono">
                      {l.thickness === null ? "half-space" : length(l.thickness, units)}
                      {l.thicknessError ? ` ± ${lengthNumber(l.thicknessError, units)}` : ""}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            {reading.interpretation.notes.map((n) => (
              <p key={n} className="mt-1 text-xs text-ochre">
                {localise(n, units)}
              </p>
            ))}
            <p className="mt-1 text-xs text-ink-soft">
              Depths under this shot, assuming flat layers whose velocities increase with depth. A
              blind layer or a velocity inversion stays invisible to this method.
            </p>
          </div>
        ) : (
          <p
            role="status"
            className="rounded-md border border-ochre/50 bg-ochre-soft px-4 py-2 text-sm"
          >
            No interpretation: {localise(reading.interpretation.reason, units)}.
          </p>
        )
      ) : null}
    </div>
  );
}
