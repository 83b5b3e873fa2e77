import { useState } from "react";
import { Button } from "@/components/button";
import type { UnitSystem } from "@/lib/units";
import { applyChoices, type AppliedChoice, type ApplyOption } from "../../lib/apply-choices";
import type { Spread } from "../../lib/engine";
import { useSeismographChannels } from "../../hooks/use-seismograph-channels";
import { formatQuantity } from "@/lib/units";

/**
 * Apply the recommendation in one of three ways (keep spacing, keep spread length, keep
 * channel count), each with its one-line consequence and any practical flags. An option that
 * needs more channels than the seismograph records is offered again as roll-along: spreads of
 * the seismograph's channel count along the same line.
 */
export function ApplyChoicesPanel({
  spread,
  recommendation,
  units,
  current,
  onApply,
}: {
  spread: Spread;
  recommendation: { maxSpacing: number | null; spreadLength: number };
  units: UnitSystem;
  current: boolean;
  onApply: (spread: AppliedChoice) => void;
}) {
  const [channels, setChannels, mayChange] = useSeismographChannels();
  const [typed, setTyped] = useState<string | null>(null);
  const options = applyChoices(spread, recommendation, units, channels);
  return (
    <div className="mt-2 print:hidden">
      <ul className="flex flex-col gap-2" aria-label="Ways to apply">
        {options.map((o) => (
          <li key={o.choice} className="flex flex-col gap-1">
            <ApplyRow option={o} id={`apply-${o.choice}`} {...{ units, current, onApply }} />
            {o.asRollAlong ? (
              <div className="ml-4 border-l-2 border-rule pl-3">
                <ApplyRow
                  option={o.asRollAlong}
                  id={`apply-${o.choice}-roll`}
                  {...{ units, current, onApply }}
                />
              </div>
            ) : null}
          </li>
        ))}
      </ul>
      {mayChange ? (
        <div className="mt-2 flex flex-wrap items-center gap-2 text-xs text-ink-soft">
          <label htmlFor="seismograph-channels">Seismograph channels (team setting)</label>
          <input
            id="seismograph-channels"
            className="field-input w-20! px-2! py-0.5! font-mono text-xs!"
            inputMode="numeric"
            value={typed ?? String(channels)}
            onChange={(e) => {
              setTyped(e.target.value);
              const n = Number(e.target.value);
              if (Number.isInteger(n) && n >= 2) setChannels(n);
            }}
            onBlur={() => setTyped(null)}
          />
          <span>saved for the whole team, also on the Team page</span>
        </div>
      ) : (
        <p className="mt-2 text-xs text-ink-soft" data-testid="seismograph-channels">
          The team&rsquo;s seismograph records {channels} channels (a team setting an admin changes
          on the Team page).
        </p>
      )}
    </div>
  );
}

function ApplyRow({
  option: o,
  id,
  units,
  current,
  onApply,
}: {
  option: ApplyOption;
  id: string;
  units: UnitSystem;
  current: boolean;
  onApply: (spread: AppliedChoice) => void;
}) {
  return (
    <div className="flex flex-wrap items-start gap-x-3 gap-y-1">
      <Button
        variant="secondary"
        className="px-2.5! py-1! text-xs!"
        onClick={() =>
          onApply({
            spacing: o.spacing,
            channels: o.channels,
            shots: o.shots,
            rollAlong: o.rollAlong,
          })
        }
        disabled={!current || o.unchanged}
        aria-describedby={id}
      >
        {o.title}: {formatQuantity("length", o.spacing, units)} ×{" "}
        {o.rollAlong ? `${o.rollAlong.spreads} spreads of ${o.channels}` : o.channels}
      </Button>
      <span id={id} className="min-w-0 grow basis-48 text-xs text-ink-soft">
        {o.unchanged ? "The spread already is this. " : ""}
        {o.consequence}
        {o.flags.map((f) => (
          <span key={f} role="note" className="block font-medium text-brick">
            ⚠ {f}
          </span>
        ))}
      </span>
    </div>
  );
}
