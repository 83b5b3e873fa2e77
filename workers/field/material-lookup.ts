/**
 * Velocity look-up by material name, for filling the velocities a borehole or probe log does
 * not state. The table is a parameter: the engine's material table (workers/engine/materials.ts,
 * not yet published when this was written) or any list the caller supplies, in either form:
 * - an array of entries `{ key, name?, aliases?, velocity?, velocityRange? }`, or
 * - a record `{ "dry sand": 600, clay: { velocity: 1800 }, till: { velocityRange: [1500, 2500] } }`.
 * An entry without a velocity but with a range gives the range's midpoint.
 */

/** One material of a velocity table. */
export interface MaterialEntry {
  /** Key stored on the layer (`material` in the plan schema). */
  key: string;
  /** Display name, matched like the key. */
  name?: string;
  /** Other names that mean this material. */
  aliases?: readonly string[];
  /** Typical P-wave velocity, m/s. */
  velocity?: number;
  /** Velocity range, m/s; its midpoint is used when `velocity` is absent. */
  velocityRange?: readonly [number, number];
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

function velocityOf(entry: MaterialEntry): number | null {
  if (typeof entry.velocity === "number" && Number.isFinite(entry.velocity) && entry.velocity > 0) {
    return entry.velocity;
  }
  const r = entry.velocityRange;
  if (r && Number.isFinite(r[0]) && Number.isFinite(r[1]) && r[0] > 0 && r[1] >= r[0]) {
    return (r[0] + r[1]) / 2;
  }
  return null;
}

/**
 * Makes a look-up function over a table. A material matches an entry when its normalised
 * text equals the entry's normalised key, name or one of its aliases.
 */
export function materialLookup(table: MaterialTable): (material: string) => MaterialMatch | null {
  const index = new Map<string, MaterialMatch>();
  for (const entry of entries(table)) {
    const velocity = velocityOf(entry);
    if (velocity === null) continue;
    for (const name of [entry.key, entry.name, ...(entry.aliases ?? [])]) {
      if (!name) continue;
      const k = materialName(name);
      if (k && !index.has(k)) index.set(k, { key: entry.key, velocity });
    }
  }
  return (material) => index.get(materialName(material)) ?? null;
}
