import { useState } from "react";
import { useFormContext } from "react-hook-form";
import { sectionFromLayered } from "@engine";
import { Button } from "@/components/button";
import type { UnitSystem } from "@/lib/units";
import {
  parsePlanForm,
  type ModelForm,
  type PlanForm,
  type SectionDraft,
} from "../../lib/plan-form";
import { newSectionDraft, spreadExtent } from "../../lib/section-edit";

/** Ground surface elevation given to a converted or new section, m (a datum to edit). */
const DATUM = 100;

/**
 * "Convert to section" (a section copy of the chosen layered model: flat ground at a 100 m
 * datum over the spread with a spacing to spare, each planar base as a straight line) and
 * "New section". Both add a model and leave the others as they are.
 */
export function SectionModelButtons({
  current,
  units,
  full,
  onAdd,
}: {
  current: number;
  units: UnitSystem;
  full: boolean;
  onAdd: (model: ModelForm) => void;
}) {
  const { getValues } = useFormContext<PlanForm>();
  const [problem, setProblem] = useState<string | null>(null);
  const isSection = !!getValues(`models.${current}.section`);

  const planNow = () => {
    const plan = parsePlanForm(getValues(), units, "plan");
    if (!plan) setProblem("Fix the marked fields first: the section is drawn over the spread.");
    return plan;
  };

  return (
    <>
      {!isSection ? (
        <Button
          variant="quiet"
          className="text-xs!"
          disabled={full}
          title="Adds a section copy of this layered model (the layered model stays), to bend its interfaces"
          onClick={() => {
            const plan = planNow();
            if (!plan) return;
            const model = plan.models[current];
            if (model.kind === "section") return;
            const [from, to] = spreadExtent(plan.spread);
            const section = sectionFromLayered(model, from, to, DATUM);
            setProblem(null);
            onAdd({
              name: `${model.name} (section)`.slice(0, 80),
              layers: [],
              section: structuredClone({
                surface: section.surface,
                layers: section.layers,
              }) as SectionDraft,
            });
          }}
        >
          Convert to section
        </Button>
      ) : null}
      <Button
        variant="quiet"
        className="text-xs!"
        disabled={full}
        onClick={() => {
          const plan = planNow();
          if (!plan) return;
          setProblem(null);
          onAdd({ name: "New section", layers: [], section: newSectionDraft(plan.spread) });
        }}
      >
        + New section
      </Button>
      {problem ? (
        <p role="alert" className="w-full text-xs font-medium text-brick">
          {problem}
        </p>
      ) : null}
    </>
  );
}
