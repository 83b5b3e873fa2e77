/**
 * Where a shot stands when the spread changes. A shot is either fixed (its position along the
 * line, m, never moves) or anchored to the spread's start (first geophone), end (last
 * geophone) or centre (midway between them) with an offset in m. Anchored shots follow every
 * change of spacing, channel count or first geophone; fixed shots stay put. The designer, the
 * design sweep, Apply and the command line all resolve positions through `resolveShotPositions`.
 */

/** The point of the spread a shot is anchored to. */
export type ShotAnchorPoint = "start" | "end" | "centre";

/** A shot's anchor: `offset` m from the spread's `to` point (negative = towards the start). */
export interface ShotAnchor {
  to: ShotAnchorPoint;
  /** Distance along the line from the anchor point, m (signed). */
  offset: number;
}

/** The geophone geometry that anchors refer to (m, count). */
export interface SpreadGeometry {
  /** Geophone spacing, m. */
  spacing: number;
  /** Number of geophones. */
  channels: number;
  /** Position of the first geophone, m. */
  firstGeophone: number;
}

/** A shot as far as anchoring is concerned: its stored position (m) and optional anchor. */
export interface AnchoredShot {
  position: number;
  anchor?: ShotAnchor;
}

/** Position (m) of the spread's start, end or centre. */
export function anchorPoint(to: ShotAnchorPoint, geometry: SpreadGeometry): number {
  const { firstGeophone, spacing, channels } = geometry;
  const last = firstGeophone + (channels - 1) * spacing;
  return to === "start" ? firstGeophone : to === "end" ? last : (firstGeophone + last) / 2;
}

/** The position (m) of one shot on this spread: its anchor point plus offset, or its own position when fixed. */
export function resolveShotPosition(shot: AnchoredShot, geometry: SpreadGeometry): number {
  return shot.anchor ? anchorPoint(shot.anchor.to, geometry) + shot.anchor.offset : shot.position;
}

/**
 * Positions (m) of every shot on this spread, in order: anchored shots at anchor point plus
 * offset, fixed shots where they are. Pure; the inputs are not changed.
 */
export function resolveShotPositions(
  shots: readonly AnchoredShot[],
  geometry: SpreadGeometry,
): Float64Array {
  const out = new Float64Array(shots.length);
  for (let i = 0; i < shots.length; i++) out[i] = resolveShotPosition(shots[i], geometry);
  return out;
}

/** The anchor to `to` that puts a shot at `position` (m) on this spread (offset = position − point). */
export function anchorAt(
  position: number,
  to: ShotAnchorPoint,
  geometry: SpreadGeometry,
): ShotAnchor {
  return { to, offset: roundOffset(position - anchorPoint(to, geometry)) };
}

/**
 * The anchor a crew would give a new shot at `position` (m): at or beyond the first geophone →
 * the start, at or beyond the last → the end, at the centre (within a quarter spacing) → the
 * centre; any other interior shot is fixed (undefined).
 */
export function defaultAnchor(position: number, geometry: SpreadGeometry): ShotAnchor | undefined {
  const start = anchorPoint("start", geometry);
  const end = anchorPoint("end", geometry);
  const centre = anchorPoint("centre", geometry);
  const tolerance = geometry.spacing / 4;
  const lo = Math.min(start, end);
  const hi = Math.max(start, end);
  if (geometry.channels > 1 && Math.abs(position - centre) <= tolerance)
    return anchorAt(position, "centre", geometry);
  if (position <= lo + 1e-9) return anchorAt(position, start <= end ? "start" : "end", geometry);
  if (position >= hi - 1e-9) return anchorAt(position, start <= end ? "end" : "start", geometry);
  return undefined;
}

/** Offsets are stored to the micrometre so a round trip through feet does not grow noise. */
function roundOffset(offset: number): number {
  const r = Math.round(offset * 1e6) / 1e6;
  return r === 0 ? 0 : r;
}
