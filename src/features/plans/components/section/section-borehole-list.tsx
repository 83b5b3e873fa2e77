import { formatQuantity, unitLabel, type UnitSystem } from "@/lib/units";
import type { SectionDraft } from "../../lib/plan-form";
import {
  boreholeMismatches,
  boreholeTop,
  deepestDepth,
  mismatchNote,
  type StoredBorehole,
} from "../../lib/section-boreholes";

/**
 * The boreholes stored with a section (name, position, top, deepest log), each removable
 * unless read-only, and a note for each logged base the model's interface disagrees with.
 */
export function SectionBoreholeList({
  section,
  units,
  readOnly,
  onRemove,
}: {
  section: SectionDraft;
  units: UnitSystem;
  readOnly: boolean;
  onRemove: (index: number) => void;
}) {
  const boreholes: readonly StoredBorehole[] = section.boreholes ?? [];
  if (boreholes.length === 0) return null;
  const h = unitLabel("length", units);
  const f = (v: number) => formatQuantity("length", v, units, 1);
  const mismatches = boreholeMismatches(section);
  return (
    <section className="mt-4 text-sm" aria-label="Boreholes stored with this section">
      <h3 className="mb-1 font-semibold text-ink-deep">Boreholes ({boreholes.length})</h3>
      <p className="text-xs text-ink-soft">
        Kept with the plan as the evidence for the interfaces; they do not change the analysis.
      </p>
      <div className="overflow-x-auto">
        <table className="mt-1 w-full text-sm sm:w-auto" aria-label="Stored boreholes">
          <thead className="text-left text-xs tracking-wide text-ink-soft uppercase">
            <tr className="border-b border-rule">
              <th className="py-1 pr-3 font-semibold">Borehole</th>
              <th className="py-1 pr-3 font-semibold">Position ({h})</th>
              <th className="py-1 pr-3 font-semibold">Top ({h})</th>
              <th className="py-1 pr-3 font-semibold">Logged to ({h})</th>
              {!readOnly ? (
                <th className="py-1">
                  <span className="sr-only">Remove</span>
                </th>
              ) : null}
            </tr>
          </thead>
          <tbody>
            {boreholes.map((b, i) => (
              <tr key={`${i}:${b.name}`} className="border-b border-rule/50">
                <td className="py-1 pr-3 font-medium">{b.name}</td>
                <td className="py-1 pr-3 font-mono text-xs">{f(b.position)}</td>
                <td className="py-1 pr-3 font-mono text-xs">
                  {f(boreholeTop(section.surface, b))}
                  {b.top === undefined ? (
                    <span className="ml-1 font-sans text-ink-soft">(surface)</span>
                  ) : null}
                </td>
                <td className="py-1 pr-3 font-mono text-xs">
                  {f(deepestDepth(b))} <span className="font-sans text-ink-soft">deep</span>
                </td>
                {!readOnly ? (
                  <td className="py-1">
                    <button
                      type="button"
                      aria-label={`Remove borehole ${b.name}`}
                      title="Remove this borehole from the plan (the layer bases stay as they are)"
                      className="h-7 rounded-md border border-rule bg-card px-2 text-xs text-ink hover:bg-paper-deep max-sm:h-9"
                      onClick={() => onRemove(i)}
                    >
                      Remove
                    </button>
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {mismatches.length > 0 ? (
        <div className="mt-2 rounded-md border border-ochre/60 bg-ochre-soft px-3 py-2 text-xs text-ink">
          <p className="font-semibold">
            The model disagrees with {mismatches.length === 1 ? "a log" : "the logs"} (by more than{" "}
            {f(0.5)} or 10 % of the logged depth):
          </p>
          <ul className="mt-1 list-disc pl-5">
            {mismatches.map((m, i) => (
              <li key={i}>{mismatchNote(m, section, units)}</li>
            ))}
          </ul>
        </div>
      ) : null}
    </section>
  );
}
