import type { FieldChange, LayerDiff, ModelDiff, PlanDiff, VerdictChange } from "@/contracts/plans";
import type { Shot } from "@engine";
import { formatQuantity, type UnitSystem } from "@/lib/units";
import { fieldLabel, formatDiffValue, verdictTrend } from "../lib/diff-format";
import { VerdictTag } from "./badges";

/**
 * What changed between two revisions: verdicts first (that is what a reviewer signs), then the
 * ground models layer by layer, the spread and the acceptance criteria. Old values are struck
 * through, new ones highlighted; a word (added, removed, worse, better) always says the same
 * as the colour.
 */
export function DiffView({ diff, units }: { diff: PlanDiff; units: UnitSystem }) {
  if (diff.identical) {
    return (
      <p className="text-sm text-ink-soft">
        Revisions {diff.from} and {diff.to} have the same document and the same verdicts.
      </p>
    );
  }
  const verdicts = diff.verdicts;
  const worst = diff.worstVerdict;
  return (
    <div
      className="flex flex-col gap-5"
      aria-label={`Changes from revision ${diff.from} to ${diff.to}`}
    >
      {diff.name ? (
        <Section title="Name">
          <ChangeLine change={diff.name} units={units} />
        </Section>
      ) : null}

      {!worst && verdicts.length === 0 ? (
        <Section title="Verdicts">
          <p className="text-sm text-ink-soft">No verdict changed between these revisions.</p>
        </Section>
      ) : (
        <Section title="Verdicts that changed">
          {worst ? (
            <p className="mb-2 flex flex-wrap items-center gap-2 text-sm">
              <span className="font-medium">Worst over every model:</span>
              <VerdictTag verdict={worst.from} />
              <span aria-hidden>→</span>
              <span className="sr-only">became</span>
              <VerdictTag verdict={worst.to} />
              <Trend trend={verdictTrend(worst.from, worst.to)} />
            </p>
          ) : null}
          {verdicts.length > 0 ? <VerdictTable changes={verdicts} units={units} /> : null}
        </Section>
      )}

      {diff.models.length > 0 ? (
        <Section title="Ground models">
          <div className="flex flex-col gap-3">
            {diff.models.map((model, i) => (
              <ModelChanges key={i} model={model} units={units} />
            ))}
          </div>
        </Section>
      ) : null}

      {diff.spread.length > 0 || diff.shots.added.length > 0 || diff.shots.removed.length > 0 ? (
        <Section title="Spread">
          <ul className="flex flex-col gap-1">
            {diff.spread.map((change) => (
              <li key={change.field}>
                <ChangeLine change={change} units={units} />
              </li>
            ))}
            {diff.shots.removed.map((shot, i) => (
              <li key={`r${i}`} className="text-sm">
                <ChangeWord change="removed" /> shot{" "}
                <del className="rounded bg-brick-soft px-1 font-mono text-xs text-brick">
                  {shotText(shot, units)}
                </del>
              </li>
            ))}
            {diff.shots.added.map((shot, i) => (
              <li key={`a${i}`} className="text-sm">
                <ChangeWord change="added" /> shot{" "}
                <ins className="rounded bg-moss-soft px-1 font-mono text-xs text-moss no-underline">
                  {shotText(shot, units)}
                </ins>
              </li>
            ))}
          </ul>
        </Section>
      ) : null}

      {diff.criteria.length > 0 ? (
        <Section title="Acceptance criteria">
          <ul className="flex flex-col gap-1">
            {diff.criteria.map((change) => (
              <li key={change.field}>
                <ChangeLine change={change} units={units} />
              </li>
            ))}
          </ul>
        </Section>
      ) : null}
    </div>
  );
}

function Section({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <section>
      <h4 className="mb-1.5 text-xs font-semibold tracking-wide text-ink-soft uppercase">
        {title}
      </h4>
      {children}
    </section>
  );
}

const shotText = (shot: Shot, units: UnitSystem) =>
  `${shot.label ? `${shot.label} ` : ""}${formatQuantity("length", shot.position, units, 1)}`;

/** "velocity: 1,500 m/s → 1,800 m/s" with the old value struck and the new one marked. */
export function ChangeLine({ change, units }: { change: FieldChange; units: UnitSystem }) {
  return (
    <span className="inline-flex flex-wrap items-baseline gap-1.5 text-sm">
      <span className="text-ink">{fieldLabel(change.field)}:</span>
      <del className="rounded bg-brick-soft px-1 font-mono text-xs text-brick">
        {formatDiffValue(change.field, change.from, units)}
      </del>
      <span aria-hidden>→</span>
      <ins className="rounded bg-moss-soft px-1 font-mono text-xs text-moss no-underline">
        {formatDiffValue(change.field, change.to, units)}
      </ins>
    </span>
  );
}

function ChangeWord({ change }: { change: "added" | "removed" | "changed" }) {
  const tone =
    change === "added"
      ? "border-moss/40 bg-moss-soft text-moss"
      : change === "removed"
        ? "border-brick/40 bg-brick-soft text-brick"
        : "border-ochre/50 bg-ochre-soft text-ink-deep";
  return (
    <span className={`rounded border px-1.5 py-px text-[11px] font-semibold uppercase ${tone}`}>
      {change}
    </span>
  );
}

function Trend({ trend }: { trend: "worse" | "better" | "same" }) {
  if (trend === "same") return null;
  return (
    <span className={`text-xs font-semibold ${trend === "worse" ? "text-brick" : "text-moss"}`}>
      {trend === "worse" ? "▼ worse" : "▲ better"}
    </span>
  );
}

function VerdictTable({ changes, units }: { changes: VerdictChange[]; units: UnitSystem }) {
  const error = (v: number | null) =>
    v === null ? "—" : `${v > 0 ? "+" : ""}${formatQuantity("length", v, units, 2)}`;
  return (
    <table className="w-full text-sm" aria-label="Verdicts that changed">
      <thead className="text-left text-xs tracking-wide text-ink-soft uppercase">
        <tr className="border-b border-rule">
          <th scope="col" className="py-1 pr-3 font-semibold">
            Model
          </th>
          <th scope="col" className="py-1 pr-3 font-semibold">
            Refractor
          </th>
          <th scope="col" className="py-1 pr-3 font-semibold">
            Verdict
          </th>
          <th scope="col" className="py-1 text-right font-semibold">
            Depth error
          </th>
        </tr>
      </thead>
      <tbody>
        {changes.map((c, i) => {
          const trend = verdictTrend(c.from, c.to);
          return (
            <tr
              key={i}
              data-trend={trend}
              className={`border-b border-rule/60 ${trend === "worse" ? "bg-brick-soft/50" : trend === "better" ? "bg-moss-soft/50" : ""}`}
            >
              <td className="py-1.5 pr-3">{c.model}</td>
              <td className="py-1.5 pr-3">
                {c.layer === null ? "worst of the model" : `top of layer ${c.layer}`}
              </td>
              <td className="py-1.5 pr-3">
                <span className="inline-flex flex-wrap items-center gap-1.5">
                  <VerdictTag verdict={c.from} />
                  <span aria-hidden>→</span>
                  <VerdictTag verdict={c.to} />
                  <Trend trend={trend} />
                </span>
              </td>
              <td className="py-1.5 text-right font-mono text-xs">
                {c.errorFrom === null && c.errorTo === null
                  ? "—"
                  : `${error(c.errorFrom)} → ${error(c.errorTo)}`}
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}

function ModelChanges({ model, units }: { model: ModelDiff; units: UnitSystem }) {
  const renamed =
    model.fromName !== null && model.toName !== null && model.fromName !== model.toName;
  return (
    <div className="rounded-md border border-rule/70 p-2.5">
      <p className="mb-1 flex flex-wrap items-center gap-2 text-sm font-medium text-ink-deep">
        <ChangeWord change={model.change} />
        {renamed ? (
          <>
            <del className="text-brick">{model.fromName}</del>
            <span aria-hidden>→</span>
            <ins className="text-moss no-underline">{model.toName}</ins>
          </>
        ) : (
          (model.toName ?? model.fromName)
        )}
      </p>
      {model.change === "changed" ? (
        <ul className="flex flex-col gap-1.5">
          {model.layers.map((layer, i) => (
            <LayerChanges key={i} layer={layer} units={units} />
          ))}
        </ul>
      ) : null}
    </div>
  );
}

function LayerChanges({ layer, units }: { layer: LayerDiff; units: UnitSystem }) {
  const index = layer.toIndex ?? layer.fromIndex ?? 0;
  const name = (layer.to ?? layer.from)?.name;
  return (
    <li className="text-sm">
      <span className="mr-2 inline-flex items-center gap-1.5">
        <ChangeWord change={layer.change} />
        <span className="font-medium">
          Layer {index + 1}
          {name ? ` · ${name}` : ""}
        </span>
        {layer.change === "changed" && layer.fromIndex !== null && layer.fromIndex !== index ? (
          <span className="text-xs text-ink-soft">(was layer {layer.fromIndex + 1})</span>
        ) : null}
      </span>
      {layer.change === "changed" ? (
        <span className="mt-0.5 flex flex-col gap-0.5 pl-4">
          {layer.fields.map((change) => (
            <ChangeLine key={change.field} change={change} units={units} />
          ))}
        </span>
      ) : (
        <span className="font-mono text-xs text-ink-soft">
          {layer.fields
            .filter((f) => (layer.change === "added" ? f.to : f.from) !== null)
            .map(
              (f) =>
                `${fieldLabel(f.field)} ${formatDiffValue(f.field, layer.change === "added" ? f.to : f.from, units)}`,
            )
            .join(" · ")}
        </span>
      )}
    </li>
  );
}
