import { useEffect, useState, useSyncExternalStore } from "react";
import type { FieldValues, UseFormReturn } from "react-hook-form";

/**
 * Undo and redo over every edit of the designer's form since load: each change of the form's
 * values (typing, adding or removing a row, Apply, a dragged section point) is a step, and
 * consecutive keystrokes in one field make a single step until another field changes or the
 * box loses focus (`breakStep`). Snapshots are the form's values as
 * JSON (a plan form is a few kilobytes), compared so that no-op changes add nothing.
 */
export class PlanHistory<T extends FieldValues = FieldValues> {
  private past: string[] = [];
  private future: string[] = [];
  private current: string;
  private lastName: string | undefined;
  private applying = false;
  private listeners = new Set<() => void>();
  private state = { canUndo: false, canRedo: false };

  constructor(private readonly form: Pick<UseFormReturn<T>, "getValues" | "reset">) {
    this.current = JSON.stringify(form.getValues());
  }

  /** Note a change of the form (call from `form.watch`); `name` is the field that changed. */
  record(name?: string): void {
    if (this.applying) return;
    const next = JSON.stringify(this.form.getValues());
    if (next === this.current) return;
    const coalesce =
      name !== undefined &&
      name === this.lastName &&
      this.past.length > 0 &&
      this.future.length === 0;
    if (!coalesce) this.past.push(this.current);
    this.current = next;
    this.future = [];
    this.lastName = name;
    this.emit();
  }

  /** End the current step: the next change starts a new one (a box lost focus). */
  breakStep(): void {
    this.lastName = undefined;
  }

  /** Go back one step; false when there is nothing to undo. */
  undo(): boolean {
    const previous = this.past.pop();
    if (previous === undefined) return false;
    this.future.push(this.current);
    this.restore(previous);
    return true;
  }

  /** Go forward one step; false when there is nothing to redo. */
  redo(): boolean {
    const next = this.future.pop();
    if (next === undefined) return false;
    this.past.push(this.current);
    this.restore(next);
    return true;
  }

  subscribe = (listener: () => void): (() => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  getState = (): { canUndo: boolean; canRedo: boolean } => this.state;

  private restore(json: string): void {
    this.applying = true;
    try {
      // keepDefaultValues: the saved plan stays the baseline of "unsaved changes".
      this.form.reset(JSON.parse(json) as T, { keepDefaultValues: true });
    } finally {
      this.applying = false;
    }
    this.current = json;
    this.lastName = undefined;
    this.emit();
  }

  private emit(): void {
    const canUndo = this.past.length > 0;
    const canRedo = this.future.length > 0;
    if (canUndo === this.state.canUndo && canRedo === this.state.canRedo) return;
    this.state = { canUndo, canRedo };
    this.listeners.forEach((l) => l());
  }
}

/** True when a key event is undo (Ctrl/Cmd+Z) or redo (Ctrl/Cmd+Shift+Z, Ctrl+Y). */
export function historyKey(event: KeyboardEvent): "undo" | "redo" | null {
  if (!(event.ctrlKey || event.metaKey) || event.altKey) return null;
  const key = event.key.toLowerCase();
  if (key === "z") return event.shiftKey ? "redo" : "undo";
  if (key === "y" && !event.shiftKey) return "redo";
  return null;
}

/**
 * The designer's history: records every form change since the form was created and binds
 * Ctrl+Z / Ctrl+Shift+Z / Ctrl+Y (Cmd on a Mac) while `enabled`. The caller does not
 * re-render on edits; `useHistoryState` gives the buttons their state.
 */
export function usePlanHistory<T extends FieldValues>(
  form: Pick<UseFormReturn<T>, "getValues" | "reset" | "watch">,
  enabled: boolean,
): PlanHistory<T> {
  const [history] = useState(() => new PlanHistory<T>(form));
  useEffect(() => {
    const subscription = form.watch((_values, { name }) => history.record(name));
    return () => subscription.unsubscribe();
  }, [form, history]);
  useEffect(() => {
    if (!enabled) return;
    const onKey = (event: KeyboardEvent) => {
      const action = historyKey(event);
      if (!action) return;
      // Our history replaces the text box's own undo, so one Ctrl+Z means one thing.
      event.preventDefault();
      if (action === "undo") history.undo();
      else history.redo();
    };
    const onBlur = () => history.breakStep();
    window.addEventListener("keydown", onKey);
    window.addEventListener("focusout", onBlur);
    return () => {
      window.removeEventListener("keydown", onKey);
      window.removeEventListener("focusout", onBlur);
    };
  }, [enabled, history]);
  return history;
}

/** Whether undo and redo are possible now (re-renders only when that changes). */
export function useHistoryState(history: PlanHistory<FieldValues>) {
  return useSyncExternalStore(history.subscribe, history.getState, history.getState);
}
