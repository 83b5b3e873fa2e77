/**
 * The designer's shot rows and their anchors (workers/engine/shot-anchors.ts): where a row
 * stands on the spread as typed, and what a row becomes when its anchor changes (the shot
 * stays where it is; only the box it is typed in changes).
 */
import { anchorAt, anchorPoint, type ShotAnchorPoint, type SpreadGeometry } from "@engine";
import { formatInput, parseInput, type UnitSystem } from "@/lib/units";
import type { ShotRow } from "./plan-form";

/** The anchor choices, in the order the select lists them ("" = fixed). */
export const ANCHOR_CHOICES: ReadonlyArray<{ value: "" | ShotAnchorPoint; label: string }> = [
  { value: "", label: "fixed" },
  { value: "start", label: "from start" },
  { value: "end", label: "from end" },
  { value: "centre", label: "from centre" },
];

/**
 * A row's position on the spread (SI m): anchor point + offset for an anchored row, the typed
 * position for a fixed one; undefined when empty or when the spread itself is not sound.
 */
export function rowPosition(
  row: ShotRow | undefined,
  geometry: SpreadGeometry | null,
  units: UnitSystem,
  parse: typeof parseInput = parseInput,
): number | undefined {
  if (!row) return undefined;
  if (!row.anchor) return parse("length", row.position, units);
  const offset = parse("length", row.offset ?? "", units);
  if (offset === undefined || geometry === null) return undefined;
  return anchorPoint(row.anchor, geometry) + offset;
}

/**
 * The row after choosing `to` ("" = fixed): the shot keeps its current position, expressed as
 * an offset from the new anchor point, or as a fixed position.
 */
export function anchorChange(
  row: ShotRow,
  to: "" | ShotAnchorPoint,
  geometry: SpreadGeometry | null,
  units: UnitSystem,
  parse: typeof parseInput = parseInput,
): ShotRow {
  const at = rowPosition(row, geometry, units, parse);
  const { anchor: _anchor, offset: _offset, ...rest } = row;
  void _anchor;
  void _offset;
  if (to === "") {
    return {
      ...rest,
      position:
        at !== undefined && Number.isFinite(at) ? formatInput("length", at, units) : row.position,
    };
  }
  const offset =
    at !== undefined && Number.isFinite(at) && geometry
      ? formatInput("length", anchorAt(at, to, geometry).offset, units)
      : "0";
  return { ...rest, position: row.position, anchor: to, offset };
}
