import type { Plan } from "@engine";
import { formatQuantity, type UnitSystem } from "@/lib/units";

/** The revision's document, read-only: ground models, spread and acceptance criteria. */
export function PlanDocumentView({ document, units }: { document: Plan; units: UnitSystem }) {
  const { spread, criteria } = document;
  // A roll-along line's stations (workers/engine/roll-along.ts lineStations; kept out of this chunk).
  const roll = spread.rollAlong;
  const stations = roll
    ? spread.channels + (roll.spreads - 1) * (spread.channels - roll.overlap)
    : 0;
  return (
    <div className="flex flex-col gap-4 text-sm">
      <div className="grid gap-4 md:grid-cols-2">
        {document.models.map((model) => (
          <div key={model.name}>
            <h3 className="mb-1 text-sm font-semibold text-ink-deep">
              {model.name}
              {model.kind === "section" ? (
                <span className="font-normal text-ink-soft">
                  {" "}
                  · section, surface of {model.surface.length} points
                </span>
              ) : null}
            </h3>
            <table className="w-full" aria-label={`Layers of ${model.name}`}>
              <thead className="text-left text-xs tracking-wide text-ink-soft uppercase">
                <tr className="border-b border-rule">
                  <th scope="col" className="py-1 pr-2 font-semibold">
                    Layer
                  </th>
                  <th scope="col" className="py-1 pr-2 text-right font-semibold">
                    Velocity
                  </th>
                  <th scope="col" className="py-1 text-right font-semibold">
                    {model.kind === "section" ? "Base" : "Thickness"}
                  </th>
                </tr>
              </thead>
              <tbody className="font-mono text-xs">
                {model.layers.map((layer, i) => (
                  <tr key={i} className="border-b border-rule/50">
                    <td className="py-1 pr-2 font-sans">
                      {i + 1}. {layer.name || layer.material || "unnamed"}
                      {layer.dip ? (
                        <span className="text-ink-soft">
                          {" "}
                          · dip {formatQuantity("angle", layer.dip, units, 1)}
                        </span>
                      ) : null}
                    </td>
                    <td className="py-1 pr-2 text-right">
                      {formatQuantity("velocity", layer.velocity, units)}
                    </td>
                    <td className="py-1 text-right">
                      {model.kind === "section"
                        ? "base" in layer && layer.base
                          ? `${layer.base.length} points`
                          : "half-space"
                        : layer.thickness == null
                          ? "half-space"
                          : formatQuantity("length", layer.thickness, units, 2)}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        ))}
      </div>
      <dl className="grid grid-cols-2 gap-x-4 gap-y-1 sm:grid-cols-4">
        <Fact label="Spacing" value={formatQuantity("length", spread.spacing, units, 2)} />
        <Fact label="Channels" value={String(spread.channels)} />
        <Fact
          label="First geophone"
          value={formatQuantity("length", spread.firstGeophone, units, 1)}
        />
        <Fact
          label="Spread length"
          value={formatQuantity("length", spread.spacing * (spread.channels - 1), units, 1)}
        />
        {spread.rollAlong ? (
          <Fact
            label="Roll-along"
            value={`${spread.rollAlong.spreads} spreads of ${spread.channels}, overlap ${spread.rollAlong.overlap}: stations 1–${stations} over ${formatQuantity("length", spread.spacing * (stations - 1), units, 1)}`}
            wide
          />
        ) : null}
        <Fact
          label="Shots"
          value={spread.shots.map((s) => formatQuantity("length", s.position, units, 1)).join(", ")}
          wide
        />
        <Fact label="Min. geophones" value={String(criteria.minGeophones)} />
        <Fact label="Pick error" value={formatQuantity("time", criteria.pickError, units, 2)} />
      </dl>
    </div>
  );
}

function Fact({ label, value, wide }: { label: string; value: string; wide?: boolean }) {
  return (
    <div className={wide ? "col-span-2" : undefined}>
      <dt className="text-xs text-ink-soft">{label}</dt>
      <dd className="font-mono text-xs text-ink-deep">{value}</dd>
    </div>
  );
}
