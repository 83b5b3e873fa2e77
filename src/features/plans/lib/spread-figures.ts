/**
 * What a spread implies, for the Spread panel: its length, the geophone span and, per shot,
 * where it stands and the nearest and farthest offsets it records. Geometry only (SI, m);
 * the physics stays in the engine.
 */
export interface SpreadGeometry {
  spacing: number;
  channels: number;
  firstGeophone: number;
}

export interface ShotFigures {
  position: number;
  /** Where the shot stands relative to the geophones. */
  where: "before" | "inside" | "beyond";
  /** Distance outside the geophone span, m (0 inside). */
  outside: number;
  nearestOffset: number;
  farthestOffset: number;
}

export interface SpreadFigures {
  /** Distance from the first to the last geophone, m. */
  length: number;
  first: number;
  last: number;
  shots: ShotFigures[];
}

export function spreadFigures(spread: SpreadGeometry, shots: number[]): SpreadFigures {
  const length = (spread.channels - 1) * spread.spacing;
  const first = spread.firstGeophone;
  const last = first + length;
  return {
    length,
    first,
    last,
    shots: shots.map((position) => {
      const where = position < first ? "before" : position > last ? "beyond" : "inside";
      const outside =
        where === "before" ? first - position : where === "beyond" ? position - last : 0;
      let nearest: number;
      if (where === "inside") {
        const k = Math.round((position - first) / spread.spacing);
        const clamped = Math.min(Math.max(k, 0), spread.channels - 1);
        nearest = Math.abs(first + clamped * spread.spacing - position);
      } else {
        nearest = outside;
      }
      const farthest = Math.max(Math.abs(position - first), Math.abs(position - last));
      return { position, where, outside, nearestOffset: nearest, farthestOffset: farthest };
    }),
  };
}

export type ShotPattern = "ends" | "off-end" | "centre" | "interior";

/**
 * Shot positions for a quick-add pattern (common practice, from memory: end shots half a
 * spacing beyond the end geophones; off-end shots a quarter of the spread length beyond them;
 * a centre shot; interior shots at the quarter points), each placed midway between two
 * geophones so that no geophone sits on a shot.
 */
export function patternShots(
  spread: SpreadGeometry,
  pattern: ShotPattern,
): Array<{ position: number; label: string }> {
  const { spacing } = spread;
  const length = (spread.channels - 1) * spacing;
  const first = spread.firstGeophone;
  const last = first + length;
  const between = (x: number) => {
    // Snap to the nearest point midway between geophones, inside the spread.
    const k = Math.floor((x - first) / spacing);
    const clamped = Math.min(Math.max(k, 0), Math.max(spread.channels - 2, 0));
    return first + (clamped + 0.5) * spacing;
  };
  const round = (x: number) => Number(x.toFixed(6));
  switch (pattern) {
    case "ends":
      return [
        { position: round(first - spacing / 2), label: "end, start" },
        { position: round(last + spacing / 2), label: "end, far" },
      ];
    case "off-end": {
      const off = Math.max(spacing, Math.round(length / 4 / spacing) * spacing);
      return [
        { position: round(first - off), label: "off-end, start" },
        { position: round(last + off), label: "off-end, far" },
      ];
    }
    case "centre":
      return spread.channels < 2
        ? []
        : [{ position: round(between((first + last) / 2)), label: "centre" }];
    case "interior":
      return spread.channels < 4
        ? []
        : [
            { position: round(between(first + length / 4)), label: "quarter" },
            { position: round(between(first + (3 * length) / 4)), label: "three-quarter" },
          ];
  }
}
