/**
 * Typical P-wave velocities of near-surface materials, for the material picker and the
 * borehole-log import. Ranges after Kearey, Brooks & Hill (2002), *An Introduction to
 * Geophysical Exploration*, 3rd ed., Table 3.1 — recalled from memory, not copied; check the
 * printed table before relying on a value. Topsoil and gravel follow Burger, Sheehan & Jones
 * (2006), *Introduction to Applied Geophysics*, Table 3.1 ("weathered surface material",
 * "gravel or dry sand"), also from memory; fill, weathered rock, dry till, ice and concrete are
 * common practice from memory (each entry's `source` says which). `typical` is the middle of
 * the range (common practice, not a value from the table).
 */

/** One material: velocity range and a typical value, m/s. */
export interface Material {
  /** Stable key stored in plans (layer.material). */
  readonly key: string;
  /** Label shown to users. */
  readonly label: string;
  readonly group:
    "unconsolidated" | "sedimentary rock" | "igneous and metamorphic rock" | "fluid" | "other";
  /** Lowest and highest P-wave velocity, m/s. */
  readonly min: number;
  readonly max: number;
  /** Middle of the range, m/s. */
  readonly typical: number;
  /** Lower-case words that identify it in a borehole-log description. */
  readonly aliases: readonly string[];
  /** Where this entry's range comes from when it is not the table's main source. */
  readonly source?: string;
}

/** Where the table comes from, for display beside it. */
export const MATERIALS_SOURCE =
  "Kearey, Brooks & Hill (2002) Table 3.1, from memory; topsoil and gravel after Burger, Sheehan & Jones (2006) Table 3.1, from memory; fill, weathered rock, dry till, ice and concrete: common practice, from memory; typical = middle of the range (common practice)";

const BURGER = "Burger, Sheehan & Jones (2006) Table 3.1, from memory";
const COMMON = "common practice, from memory";

const m = (
  key: string,
  label: string,
  group: Material["group"],
  min: number,
  max: number,
  aliases: string[],
  source?: string,
): Material => ({
  key,
  label,
  group,
  min,
  max,
  typical: Math.round((min + max) / 2 / 10) * 10,
  aliases,
  ...(source ? { source } : {}),
});

/** The table, slowest first within each group. */
export const MATERIALS: readonly Material[] = [
  m(
    "topsoil",
    "Topsoil, weathered surface layer",
    "unconsolidated",
    240,
    610,
    ["topsoil", "top soil", "soil", "weathered surface material", "surface layer"],
    BURGER,
  ),
  m(
    "fill",
    "Fill (made ground)",
    "unconsolidated",
    200,
    900,
    ["fill", "made ground", "backfill", "rubble", "embankment fill"],
    COMMON,
  ),
  m("dry-sand", "Sand, dry", "unconsolidated", 200, 1000, ["dry sand", "sand", "dune sand"]),
  m("saturated-sand", "Sand, water-saturated", "unconsolidated", 1500, 2000, [
    "saturated sand",
    "wet sand",
    "sand below water table",
  ]),
  m("gravel", "Gravel, dry", "unconsolidated", 460, 915, ["gravel", "dry gravel"], BURGER),
  m("clay", "Clay", "unconsolidated", 1000, 2500, ["clay", "silty clay"]),
  m(
    "dry-till",
    "Glacial till, dry",
    "unconsolidated",
    500,
    1500,
    ["dry till", "dry glacial till", "dry boulder clay"],
    COMMON,
  ),
  m("saturated-till", "Glacial till, water-saturated", "unconsolidated", 1500, 2500, [
    "till",
    "boulder clay",
    "glacial till",
  ]),
  m("permafrost", "Permafrost", "unconsolidated", 3500, 4000, ["permafrost", "frozen ground"]),
  m(
    "weathered-rock",
    "Weathered rock",
    "other",
    800,
    2500,
    [
      "weathered rock",
      "weathered bedrock",
      "weathered sandstone",
      "weathered limestone",
      "weathered granite",
      "weathered mudstone",
      "weathered shale",
      "highly weathered",
      "completely weathered",
      "saprolite",
    ],
    COMMON,
  ),
  m("chalk", "Chalk", "sedimentary rock", 2000, 2500, ["chalk"]),
  m("sandstone", "Sandstone", "sedimentary rock", 2000, 6000, ["sandstone"]),
  m("limestone", "Limestone", "sedimentary rock", 2000, 6000, ["limestone"]),
  m("dolomite", "Dolomite", "sedimentary rock", 2500, 6500, ["dolomite", "dolostone"]),
  m("gypsum", "Gypsum", "sedimentary rock", 2000, 3500, ["gypsum"]),
  m("anhydrite", "Anhydrite", "sedimentary rock", 4500, 6500, ["anhydrite"]),
  m("salt", "Rock salt", "sedimentary rock", 4500, 5000, ["salt", "halite"]),
  m("granite", "Granite", "igneous and metamorphic rock", 5500, 6000, ["granite"]),
  m("gabbro", "Gabbro", "igneous and metamorphic rock", 6500, 7000, ["gabbro"]),
  m("water", "Water", "fluid", 1450, 1500, ["water"]),
  m("ice", "Ice", "fluid", 3400, 3800, ["ice"], COMMON),
  m("concrete", "Concrete", "other", 3000, 4500, ["concrete"], COMMON),
];

/** The material with this key, or undefined. */
export function findMaterial(key: string): Material | undefined {
  return MATERIALS.find((x) => x.key === key);
}

/**
 * Best material for a free-text description (e.g. a borehole-log line such as
 * "Firm brown silty CLAY"): the entry whose longest alias occurs as whole words in the
 * text; undefined when none does.
 */
export function matchMaterial(description: string): Material | undefined {
  const text = ` ${description.toLowerCase().replace(/[^a-z]+/g, " ")} `;
  let best: Material | undefined;
  let bestLength = 0;
  for (const material of MATERIALS) {
    for (const alias of material.aliases) {
      if (alias.length > bestLength && text.includes(` ${alias} `)) {
        best = material;
        bestLength = alias.length;
      }
    }
  }
  return best;
}
