import { Fragment, useState } from "react";
import { get, useFieldArray, useFormContext, useFormState, useWatch } from "react-hook-form";
import { MAX_LAYERS, MAX_MODELS } from "@engine";
import { Button } from "@/components/button";
import { unitLabel, type UnitSystem } from "@/lib/units";
import { emptyLayer, type PlanForm } from "../../lib/plan-form";
import { SectionModelButtons } from "../section/section-model-buttons";
import { SectionEditor } from "../section/section-editor";
import { useDesignerSlots } from "../../designer-slots";
import { AnchorCommentsChip } from "./anchor-comments";
import { CellInput, PhoneLabel } from "./cell-input";
import { MaterialPicker } from "./material-picker";

/** Error message at a form path, whether zod put it on the field or on its array root. */
export function errorAt(errors: unknown, path: string): string | undefined {
  const node = get(errors, path) as { message?: string; root?: { message?: string } } | undefined;
  return node?.message ?? node?.root?.message;
}

/**
 * Ground models: the candidate layer models of the plan, one table of layers each. The last
 * layer is the half-space (no thickness, no dip).
 */
export function GroundModelsPanel({
  units,
  selected,
  onSelect,
  readOnly,
}: {
  units: UnitSystem;
  selected: number;
  onSelect: (index: number) => void;
  readOnly: boolean;
}) {
  const { control, getValues } = useFormContext<PlanForm>();
  const models = useFieldArray({ control, name: "models" });
  const { errors } = useFormState({ control });
  const names = useWatch({ control, name: "models" })?.map((m) => m.name) ?? [];
  const current = Math.min(selected, models.fields.length - 1);

  return (
    <div>
      <div
        className="mb-3 flex flex-wrap items-center gap-1"
        role="tablist"
        aria-label="Candidate ground models"
      >
        {models.fields.map((field, i) => {
          const invalid = !!get(errors, `models.${i}`);
          return (
            <button
              key={field.id}
              type="button"
              role="tab"
              aria-selected={i === current}
              onClick={() => onSelect(i)}
              className={`rounded-md border px-3 py-1 text-sm ${
                i === current
                  ? "border-ink bg-ink text-card"
                  : "border-rule bg-card text-ink hover:bg-paper-deep"
              } ${invalid ? "ring-2 ring-brick/60" : ""}`}
            >
              {names[i] || `Model ${i + 1}`}
              {invalid ? <span className="sr-only"> (has errors)</span> : null}
            </button>
          );
        })}
        {!readOnly ? (
          <Button
            variant="quiet"
            className="text-xs!"
            disabled={models.fields.length >= MAX_MODELS}
            onClick={() => {
              models.append(models.fields[current] ? copyOf(current) : blank());
              onSelect(models.fields.length);
            }}
          >
            + Copy as new model
          </Button>
        ) : null}
        {!readOnly ? (
          <SectionModelButtons
            current={current}
            units={units}
            full={models.fields.length >= MAX_MODELS}
            onAdd={(model) => {
              models.append(model);
              onSelect(models.fields.length);
            }}
          />
        ) : null}
      </div>
      {getValues(`models.${current}.section`) ? (
        <SectionEditor
          key={models.fields[current]?.id}
          index={current}
          units={units}
          readOnly={readOnly}
        />
      ) : (
        <ModelEditor
          key={models.fields[current]?.id}
          index={current}
          units={units}
          readOnly={readOnly}
        />
      )}
      {!readOnly && models.fields.length > 1 ? (
        <div className="mt-3 flex justify-end">
          <Button
            variant="danger"
            className="text-xs!"
            onClick={() => {
              models.remove(current);
              onSelect(Math.max(0, current - 1));
            }}
          >
            Remove model “{names[current] || `Model ${current + 1}`}”
          </Button>
        </div>
      ) : null}
    </div>
  );

  function copyOf(i: number) {
    const model = structuredClone(getValues(`models.${i}`));
    return { ...model, name: `${model.name || `Model ${i + 1}`} (variant)`.slice(0, 80) };
  }
}

const blank = () => ({
  name: "New model",
  layers: [{ ...emptyLayer("500"), thickness: "5" }, emptyLayer("2000")],
});

function ModelEditor({
  index,
  units,
  readOnly,
}: {
  index: number;
  units: UnitSystem;
  readOnly: boolean;
}) {
  const { control, register, setValue } = useFormContext<PlanForm>();
  const layers = useFieldArray({ control, name: `models.${index}.layers` });
  const { errors } = useFormState({ control });
  const rows = useWatch({ control, name: `models.${index}.layers` }) ?? [];
  const modelName = useWatch({ control, name: `models.${index}.name` });
  const [bounds, setBounds] = useState(() =>
    rows.some((r) => r.velocityRange.some(Boolean) || r.thicknessRange.some(Boolean)),
  );
  const base = `models.${index}` as const;
  const v = unitLabel("velocity", units);
  const h = unitLabel("length", units);
  const count = layers.fields.length;
  const layersError = errorAt(errors, `${base}.layers`);
  const comments = useDesignerSlots() !== null;

  return (
    <div>
      <div className="mb-3 max-w-sm">
        <CellInput
          label="Model name"
          placeholder="Model name"
          className="font-sans!"
          error={errorAt(errors, `${base}.name`)}
          {...register(`${base}.name`)}
        />
      </div>
      {/* On a phone (below sm) each layer is a card: name on top, the numbers under it with
          their own labels, the buttons below; no box that scrolls sideways. */}
      <div className="sm:overflow-x-auto">
        <table
          className="w-full table-fixed text-sm max-sm:block sm:min-w-[30rem]"
          aria-label={`Layers of ${modelName || `model ${index + 1}`}`}
        >
          <thead className="text-left text-xs tracking-wide text-ink-soft uppercase max-sm:hidden">
            <tr className="border-b border-rule">
              <th scope="col" className="w-6 py-1.5 pr-1 font-semibold">
                #
              </th>
              <th scope="col" className="py-1.5 pr-2 font-semibold">
                Layer
              </th>
              <th scope="col" className="w-24 py-1.5 pr-2 font-semibold">
                Velocity ({v})
              </th>
              <th scope="col" className="w-24 py-1.5 pr-2 font-semibold">
                Thickness ({h})
              </th>
              <th scope="col" className="w-16 py-1.5 pr-2 font-semibold">
                Dip (°)
              </th>
              <th scope="col" className="w-24 py-1.5 font-semibold">
                <span className="sr-only">
                  {!comments
                    ? "Order and removal"
                    : readOnly
                      ? "Comments"
                      : "Order, removal and comments"}
                </span>
              </th>
            </tr>
          </thead>
          <tbody className="max-sm:block">
            {layers.fields.map((field, i) => {
              const p = `${base}.layers.${i}` as const;
              const last = i === count - 1;
              const n = i + 1;
              return (
                <Fragment key={field.id}>
                  <tr className={`align-top ${PHONE_ROW}`}>
                    <td className="py-1.5 pt-2.5 pr-2 font-mono text-xs text-ink-soft max-sm:p-0 max-sm:pt-1.5">
                      {n}
                    </td>
                    <td className="py-1.5 pr-2 max-sm:col-span-3 max-sm:p-0">
                      <div className="flex flex-col gap-1">
                        <CellInput
                          label={`Layer ${n} name`}
                          placeholder={last ? "half-space" : `layer ${n}`}
                          className="font-sans!"
                          error={errorAt(errors, `${p}.name`)}
                          {...register(`${p}.name`)}
                        />
                        {!readOnly ? (
                          <MaterialPicker
                            layerNumber={n}
                            value={rows[i]?.material ?? ""}
                            units={units}
                            onPick={(m) => {
                              const opts = { shouldDirty: true, shouldValidate: true };
                              setValue(`${p}.material`, m.key, opts);
                              setValue(`${p}.velocity`, m.typical, opts);
                              setValue(`${p}.velocityRange`, m.range, opts);
                              if (!rows[i]?.name) setValue(`${p}.name`, m.label, opts);
                              if (m.range[0]) setBounds(true);
                            }}
                          />
                        ) : rows[i]?.material ? (
                          <span className="text-xs text-ink-soft">
                            material: {rows[i].material}
                          </span>
                        ) : null}
                      </div>
                    </td>
                    <td className="py-1.5 pr-2 max-sm:col-start-2 max-sm:p-0">
                      <PhoneLabel>Velocity ({v})</PhoneLabel>
                      <CellInput
                        label={`Layer ${n} velocity (${v})`}
                        inputMode="decimal"
                        error={errorAt(errors, `${p}.velocity`)}
                        {...register(`${p}.velocity`)}
                      />
                    </td>
                    <td className="py-1.5 pr-2 max-sm:p-0">
                      <PhoneLabel>Thickness ({h})</PhoneLabel>
                      {last ? (
                        <span className="block pt-1.5 text-xs text-ink-soft italic">
                          half-space
                        </span>
                      ) : (
                        <CellInput
                          label={`Layer ${n} thickness (${h})`}
                          inputMode="decimal"
                          error={errorAt(errors, `${p}.thickness`)}
                          {...register(`${p}.thickness`)}
                        />
                      )}
                    </td>
                    <td className="py-1.5 pr-2 max-sm:p-0">
                      <PhoneLabel>Dip (°)</PhoneLabel>
                      {last ? (
                        <span className="block pt-1.5 text-xs text-ink-soft">—</span>
                      ) : (
                        <CellInput
                          label={`Layer ${n} base dip (degrees)`}
                          inputMode="decimal"
                          placeholder="0"
                          error={errorAt(errors, `${p}.dip`)}
                          {...register(`${p}.dip`)}
                        />
                      )}
                    </td>
                    <td className="py-1.5 whitespace-nowrap max-sm:col-span-3 max-sm:col-start-2 max-sm:p-0">
                      <div className="flex flex-col items-start gap-1 max-sm:flex-row max-sm:items-center max-sm:gap-2">
                        {!readOnly ? (
                          <div className="flex gap-0.5">
                            <IconButton
                              label={`Move layer ${n} up`}
                              disabled={i === 0}
                              onClick={() => layers.move(i, i - 1)}
                            >
                              ↑
                            </IconButton>
                            <IconButton
                              label={`Move layer ${n} down`}
                              disabled={last}
                              onClick={() => layers.move(i, i + 1)}
                            >
                              ↓
                            </IconButton>
                            <IconButton
                              label={`Remove layer ${n}`}
                              disabled={count <= 1}
                              onClick={() => layers.remove(i)}
                            >
                              ✕
                            </IconButton>
                          </div>
                        ) : null}
                        <AnchorCommentsChip
                          anchor={{ kind: "layer", model: index, index: i }}
                          label={`layer ${n}`}
                        />
                      </div>
                    </td>
                  </tr>
                  {bounds ? (
                    <tr className="border-b border-rule/60 align-top max-sm:block">
                      <td className="max-sm:hidden" />
                      <td colSpan={5} className="pb-2 max-sm:block">
                        <div className="flex flex-wrap items-start gap-x-4 gap-y-1 text-xs text-ink-soft">
                          <span className="pt-1.5">Sweep bounds:</span>
                          <RangeInputs
                            label={`Layer ${n} velocity`}
                            unit={v}
                            path={`${p}.velocityRange`}
                            error={errorAt(errors, `${p}.velocityRange`)}
                          />
                          {!last ? (
                            <RangeInputs
                              label={`Layer ${n} thickness`}
                              unit={h}
                              path={`${p}.thicknessRange`}
                              error={errorAt(errors, `${p}.thicknessRange`)}
                            />
                          ) : null}
                        </div>
                      </td>
                    </tr>
                  ) : null}
                </Fragment>
              );
            })}
          </tbody>
        </table>
      </div>
      {layersError ? (
        <p role="alert" className="mt-2 text-xs font-medium text-brick">
          {layersError}
        </p>
      ) : null}
      <div className="mt-3 flex flex-wrap items-center gap-2">
        {!readOnly ? (
          <Button
            variant="secondary"
            disabled={count >= MAX_LAYERS}
            onClick={() => layers.insert(Math.max(0, count - 1), emptyLayer())}
          >
            Add layer above the half-space
          </Button>
        ) : null}
        <label className="ml-auto flex items-center gap-2 text-sm text-ink-soft">
          <input type="checkbox" checked={bounds} onChange={(e) => setBounds(e.target.checked)} />
          Show sweep bounds
        </label>
      </div>
    </div>
  );
}

/**
 * A layer row on a phone: a grid of the number, then the name across, the three numbers
 * side by side under it, and the buttons at the bottom.
 */
const PHONE_ROW =
  "max-sm:grid max-sm:grid-cols-[1.25rem_repeat(3,minmax(0,1fr))] max-sm:gap-x-2 max-sm:gap-y-1.5 max-sm:border-t max-sm:border-rule/60 max-sm:py-2";

function RangeInputs({
  label,
  unit,
  path,
  error,
}: {
  label: string;
  unit: string;
  path:
    | `models.${number}.layers.${number}.velocityRange`
    | `models.${number}.layers.${number}.thicknessRange`;
  error?: string;
}) {
  const { register, formState } = useFormContext<PlanForm>();
  const e0 = errorAt(formState.errors, `${path}.0`);
  const e1 = errorAt(formState.errors, `${path}.1`);
  return (
    <div className="flex flex-col gap-0.5">
      <div className="flex items-center gap-1">
        <span>{label.replace(/^Layer \d+ /, "")}</span>
        <div className="w-24">
          <CellInput
            label={`${label} lower bound (${unit})`}
            inputMode="decimal"
            placeholder="from"
            error={e0}
            {...register(`${path}.0`)}
          />
        </div>
        <span>–</span>
        <div className="w-24">
          <CellInput
            label={`${label} upper bound (${unit})`}
            inputMode="decimal"
            placeholder="to"
            error={e1}
            {...register(`${path}.1`)}
          />
        </div>
        <span>{unit}</span>
      </div>
      {error ? (
        <p role="alert" className="text-xs font-medium text-brick">
          {error}
        </p>
      ) : null}
    </div>
  );
}

function IconButton({
  label,
  children,
  ...props
}: React.ButtonHTMLAttributes<HTMLButtonElement> & { label: string }) {
  return (
    <button
      type="button"
      aria-label={label}
      title={label}
      className="h-7 w-7 rounded-md border border-rule bg-card text-sm text-ink hover:bg-paper-deep disabled:opacity-40 max-sm:h-9 max-sm:w-9"
      {...props}
    >
      {children}
    </button>
  );
}
