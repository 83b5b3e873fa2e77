/**
 * Velocity look-up by material name, for filling the velocities a borehole or probe log does
 * not state. The table is a parameter (the borehole reader defaults to the engine's
 * `MATERIALS`), in either form:
 * - an array of entries `{ key, name? | label?, aliases?, velocity? | typical?,
 *   velocityRange? | min? & max? }` — the engine's `Material` fits this shape; or
 * - a record `{ "dry sand": 600, clay: { velocity: 1800 }, till: { velocityRange: [1500, 2500] } }`.
 * The velocity used is `velocity`, else `typical`, else the midpoint of the range.
 */

/** One material of a velocity table. */
export interface MaterialEntry {
  /** Key stored on the layer (`material` in the plan schema). */
  key: string;
  /** Display name, matched like the key. */
  name?: string;
  /** Display name (the engine's spelling), matched like the key. */
  label?: string;
  /** Other names that mean this material. */
  aliases?: readonly string[];
  /** Typical P-wave velocity, m/s. */
  velocity?: number;
  /** Typical velocity (the engine's spelling), m/s. */
  typical?: number;
  /** Velocity range, m/s; its midpoint is used when no velocity is given. */
  velocityRange?: readonly [number, number];
  /** Velocity range as two fields (the engine's spelling), m/s. */
  min?: number;
  max?: number;
}

/** A velocity table in one of the accepted forms. */
export type MaterialTable =
  readonly MaterialEntry[] | Readonly<Record<string, number | Omit<MaterialEntry, "key">>>;

/** A material matched in the table, with the velocity to use, m/s. */
export interface MaterialMatch {
  key: string;
  velocity: number;
}

/** Lower case, letters and digits only, single blanks: "Dry-Sand " → "dry sand". */
export function materialName(text: string): string {
  return text
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, " ")
    .trim();
}

function entries(table: MaterialTable): MaterialEntry[] {
  if (Array.isArray(table)) return table as MaterialEntry[];
  return Object.entries(table as Record<string, number | Omit<MaterialEntry, "key">>).map(
    ([key, v]) => (typeof v === "number" ? { key, velocity: v } : { key, ...v }),
  );
}

const positive = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v) && v > 0;

function velocityOf(entry: MaterialEntry): number | null {
  if (positive(entry.velocity)) return entry.velocity;
  if (positive(entry.typical)) return entry.typical;
  const r =
    entry.velocityRange ??
    (entry.min !== undefined && entry.max !== undefined ? [entry.min, entry.max] : null);
  if (r && positive(r[0]) && positive(r[1]) && r[1] >= r[0]) return (r[0] + r[1]) / 2;
  return null;
}

/**
 * Makes a look-up function over a table. A material matches an entry when its normalised
 * text equals the entry's normalised key, name or one of its aliases; failing that, when one of
 * those occurs in it as whole words, so a log's qualifiers ("soft clay", "dense sandy gravel",
 * "brown silty CLAY, wet") still find the material. The longest such name wins ("dry till"
 * before "till"); a text naming nothing in the table gives null.
 */
export function materialLookup(table: MaterialTable): (material: string) => MaterialMatch | null {
  const index = new Map<string, MaterialMatch>();
  for (const entry of entries(table)) {
    const velocity = velocityOf(entry);
    if (velocity === null) continue;
    for (const name of [entry.key, entry.name, entry.label, ...(entry.aliases ?? [])]) {
      if (!name) continue;
      const k = materialName(name);
      if (k && !index.has(k)) index.set(k, { key: entry.key, velocity });
    }
  }
  // Longest names first, so the first whole-word hit is the most specific.
  const byLength = [...index.keys()].sort((a, b) => b.length - a.length);
  return (material) => {
    const name = materialName(material);
    const exact = index.get(name);
    if (exact) return exact;
    if (!name) return null;
    const padded = ` ${name} `;
    const hit = byLength.find((k) => padded.includes(` ${k} `));
    return hit ? index.get(hit)! : null;
  };
}
