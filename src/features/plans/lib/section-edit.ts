/**
 * Editing a section draft (the designer's SI copy of a section model) as pure functions: move,
 * insert and remove polyline points, and the spread's extent a new section must cover. Every
 * function returns a new draft and never mutates its input. Geometry rules (bases below the
 * surface, no crossing) are judged by the plan schema, which names the offending point; these
 * functions only keep each polyline's positions in order.
 */
import type { Spread } from "./engine";
import type { SectionDraft } from "./plan-form";
import { lineAt } from "./section-view";

type Point = [number, number];

/** The polyline `line` of a draft: -1 the surface, k the base of layer k + 1. */
export function polylineOf(draft: SectionDraft, line: number): Point[] {
  return line < 0 ? draft.surface : (draft.layers[line]?.base ?? []);
}

function withLine(draft: SectionDraft, line: number, points: Point[]): SectionDraft {
  if (line < 0) return { ...draft, surface: points };
  return {
    ...draft,
    layers: draft.layers.map((l, k) => (k === line ? { ...l, base: points } : l)),
  };
}

const round = (v: number) => Math.round(v * 1000) / 1000;

/**
 * Move point `index` of a polyline to (x, z), m. The first and last points keep their
 * position (the section's ends) and move only up or down; inner points stay between their
 * neighbours' positions.
 */
export function movePoint(
  draft: SectionDraft,
  line: number,
  index: number,
  x: number,
  z: number,
): SectionDraft {
  const points = polylineOf(draft, line);
  if (!points[index]) return draft;
  const last = points.length - 1;
  const px =
    index === 0 || index === last
      ? points[index][0]
      : Math.min(Math.max(x, points[index - 1][0]), points[index + 1][0]);
  const next = points.map((p, i) => (i === index ? ([round(px), round(z)] as Point) : p));
  return withLine(draft, line, next);
}

/** Insert a point on a polyline at position x (on the line, so the ground is unchanged). */
export function insertPoint(
  draft: SectionDraft,
  line: number,
  x: number,
): { draft: SectionDraft; index: number } {
  const points = polylineOf(draft, line);
  let index = points.findIndex((p) => p[0] > x);
  if (index <= 0) index = index === 0 ? 1 : points.length - 1;
  const at: Point = [round(x), round(lineAt(points, x))];
  const next = [...points.slice(0, index), at, ...points.slice(index)];
  return { draft: withLine(draft, line, next), index };
}

/** Remove a polyline point; the ends and the last two points cannot be removed (returns null). */
export function removePoint(draft: SectionDraft, line: number, index: number): SectionDraft | null {
  const points = polylineOf(draft, line);
  if (points.length <= 2 || index <= 0 || index >= points.length - 1) return null;
  return withLine(
    draft,
    line,
    points.filter((_, i) => i !== index),
  );
}

/** The stretch of line a section must cover for a spread: every geophone and shot, with a spacing to spare, m. */
export function spreadExtent(spread: Spread): [number, number] {
  const last = spread.firstGeophone + (spread.channels - 1) * spread.spacing;
  const all = [spread.firstGeophone, last, ...spread.shots.map((s) => s.position)];
  return [Math.min(...all) - spread.spacing, Math.max(...all) + spread.spacing];
}

/** A new section for a spread: flat ground at 100 m, 5 m of soil over rock (values to edit). */
export function newSectionDraft(spread: Spread): SectionDraft {
  const [from, to] = spreadExtent(spread);
  const a = round(from);
  const b = round(to);
  return {
    surface: [
      [a, 100],
      [b, 100],
    ],
    layers: [
      {
        name: "soil",
        velocity: 500,
        base: [
          [a, 95],
          [b, 95],
        ],
      },
      { name: "rock", velocity: 2500 },
    ],
  };
}
