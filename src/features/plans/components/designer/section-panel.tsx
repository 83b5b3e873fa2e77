import { useId, useState } from "react";
import { formatQuantity, type UnitSystem } from "@/lib/units";
import { ErrorNotice } from "@/components/feedback";
import { useElementWidth } from "@/hooks/use-element-width";
import { useLatestResult } from "../../hooks/use-latest-result";
import { layeredModel, type Plan } from "../../lib/engine";
import { modeller } from "../../lib/modeller-client";
import { objectId } from "../../lib/object-id";
import { SectionChart } from "../charts/section-chart";

const EXAGGERATIONS = ["auto", 1, 2, 5, 10] as const;

/** The geophone farthest from the shot: its first arrival dives deepest. */
export function farthestGeophone(plan: Plan, shotIndex: number): number {
  const { spread } = plan;
  const shot = spread.shots[shotIndex].position;
  const first = Math.abs(spread.firstGeophone - shot);
  const last = Math.abs(spread.firstGeophone + (spread.channels - 1) * spread.spacing - shot);
  return last >= first ? spread.channels : 1;
}

export function SectionPanel({
  plan,
  modelIndex,
  shotIndex,
  units,
}: {
  plan: Plan;
  modelIndex: number;
  shotIndex: number;
  units: UnitSystem;
}) {
  const { ref, width } = useElementWidth<HTMLDivElement>(720);
  const [chosen, setChosen] = useState<number | null>(null);
  const [exaggeration, setExaggeration] = useState<(typeof EXAGGERATIONS)[number]>("auto");
  const geophoneId = useId();
  const exaggerationId = useId();
  const geophone = Math.min(chosen ?? farthestGeophone(plan, shotIndex), plan.spread.channels);
  const model = layeredModel(plan.models[modelIndex]);
  const shot = plan.spread.shots[shotIndex];
  const position = plan.spread.firstGeophone + (geophone - 1) * plan.spread.spacing;
  const ray = useLatestResult(
    { model, shot: shot.position, position },
    `${objectId(plan)}:${modelIndex}:${shotIndex}:${geophone}`,
    (r) => modeller().rayPath(r.model, r.shot, r.position),
  );

  return (
    <div ref={ref} className="min-w-0 print:break-inside-avoid">
      <div className="mb-2 flex flex-wrap items-center gap-4 text-sm">
        <label htmlFor={geophoneId} className="flex items-center gap-2">
          Ray path to geophone
        </label>
        <select
          id={geophoneId}
          className="field-input w-auto! py-1! text-sm!"
          value={geophone}
          onChange={(e) => setChosen(Number(e.target.value))}
        >
          {Array.from({ length: plan.spread.channels }, (_, i) => (
            <option key={i} value={i + 1}>
              {i + 1} at{" "}
              {formatQuantity("length", plan.spread.firstGeophone + i * plan.spread.spacing, units)}
            </option>
          ))}
        </select>
        <label htmlFor={exaggerationId} className="ml-auto">
          Vertical scale
        </label>
        <select
          id={exaggerationId}
          className="field-input w-auto! py-1! text-sm!"
          value={String(exaggeration)}
          onChange={(e) => {
            const v = e.target.value;
            setExaggeration(v === "auto" ? "auto" : (Number(v) as 1 | 2 | 5 | 10));
          }}
        >
          {EXAGGERATIONS.map((e) => (
            <option key={e} value={String(e)}>
              {e === "auto" ? "automatic" : e === 1 ? "true scale" : `×${e}`}
            </option>
          ))}
        </select>
      </div>
      {ray.error ? (
        <ErrorNotice error={ray.error} title="The ray path could not be traced" />
      ) : null}
      <SectionChart
        title={`Section, ${model.name}, shot ${shotIndex + 1}`}
        input={{
          model,
          spread: plan.spread,
          shotIndex,
          ray: ray.current ? ray.result : null,
          geophone,
          width: Math.max(320, width),
          units,
          exaggeration,
        }}
      />
    </div>
  );
}
