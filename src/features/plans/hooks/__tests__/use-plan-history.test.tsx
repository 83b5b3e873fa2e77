import { describe, expect, it } from "vitest";
import { act, renderHook } from "@testing-library/react";
import { useForm } from "react-hook-form";
import { PlanHistory, historyKey, usePlanHistory } from "../use-plan-history";

interface Values {
  spacing: string;
  models: Array<{ name: string; section?: { surface: [number, number][] } }>;
}

const start: Values = {
  spacing: "3",
  models: [
    { name: "layered" },
    {
      name: "section",
      section: {
        surface: [
          [0, 100],
          [50, 101],
        ],
      },
    },
  ],
};

function setup() {
  return renderHook(() => {
    const form = useForm<Values>({ defaultValues: structuredClone(start) });
    const history = usePlanHistory(form, true);
    return { form, history };
  });
}

const press = (key: string, opts: KeyboardEventInit = {}) =>
  act(() => {
    window.dispatchEvent(new KeyboardEvent("keydown", { key, ctrlKey: true, ...opts }));
  });

describe("usePlanHistory", () => {
  it("undoes and redoes a layered edit and a dragged section point with the keys", () => {
    const { result } = setup();
    act(() => result.current.form.setValue("spacing", "5"));
    act(() =>
      result.current.form.setValue("models.1.section.surface", [
        [0, 100],
        [50, 97],
      ]),
    );
    expect(result.current.history.getState()).toEqual({ canUndo: true, canRedo: false });
    press("z");
    expect(result.current.form.getValues("models.1.section.surface")).toEqual(
      start.models[1].section!.surface,
    );
    expect(result.current.form.getValues("spacing")).toBe("5");
    press("z");
    expect(result.current.form.getValues("spacing")).toBe("3");
    expect(result.current.history.getState()).toEqual({ canUndo: false, canRedo: true });
    press("Z", { shiftKey: true });
    expect(result.current.form.getValues("spacing")).toBe("5");
    press("y");
    expect(result.current.form.getValues("models.1.section.surface")?.[1]).toEqual([50, 97]);
    expect(result.current.history.getState()).toEqual({ canUndo: true, canRedo: false });
  });

  it("keeps the loaded values as the baseline of unsaved changes", () => {
    const { result } = setup();
    act(() => result.current.form.setValue("spacing", "5", { shouldDirty: true }));
    act(() => void result.current.history.undo());
    expect(result.current.form.formState.defaultValues?.spacing).toBe("3");
    expect(result.current.form.getValues("spacing")).toBe("3");
  });

  it("drops the redo branch after a new edit", () => {
    const { result } = setup();
    act(() => result.current.form.setValue("spacing", "5"));
    act(() => void result.current.history.undo());
    act(() => result.current.form.setValue("spacing", "4"));
    expect(result.current.history.redo()).toBe(false);
    expect(result.current.form.getValues("spacing")).toBe("4");
  });
});

describe("PlanHistory", () => {
  it("makes keystrokes in one field one step, and starts a new step when the box loses focus", () => {
    let values = { spacing: "" };
    const form = {
      getValues: () => values,
      reset: (v: typeof values) => {
        values = v;
      },
    };
    const h = new PlanHistory(form as never);
    for (const text of ["2", "2.", "2.4"]) {
      values = { spacing: text };
      h.record("spacing");
    }
    h.breakStep();
    values = { spacing: "2.45" };
    h.record("spacing");
    h.undo();
    expect(values.spacing).toBe("2.4");
    h.undo();
    expect(values.spacing).toBe("");
    expect(h.undo()).toBe(false);
  });

  it("reads Ctrl+Z as undo, Ctrl+Shift+Z and Ctrl+Y as redo, and nothing else", () => {
    const k = (key: string, o: KeyboardEventInit = {}) =>
      historyKey(new KeyboardEvent("keydown", { key, ...o }));
    expect(k("z", { ctrlKey: true })).toBe("undo");
    expect(k("z", { metaKey: true })).toBe("undo");
    expect(k("Z", { ctrlKey: true, shiftKey: true })).toBe("redo");
    expect(k("y", { ctrlKey: true })).toBe("redo");
    expect(k("z")).toBeNull();
    expect(k("s", { ctrlKey: true })).toBeNull();
  });
});
