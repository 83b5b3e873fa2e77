/**
 * A refused plan document's problems as the screens count: from 1, with names a survey lead
 * reads ("Model 1, layer 2: thickness must be a number"). The API keeps its machine-readable
 * keys (`fields["models.0.layers.1.thickness"]`, zero-based); only the sentence changes.
 */

/** Plural path words of the plan document (docs/plan-format.md) and how one item reads. */
const ITEMS: Record<string, string> = {
  models: "Model",
  layers: "layer",
  shots: "shot",
  geophones: "geophone",
  points: "point",
  interfaces: "interface",
  sections: "section",
};

/** Top-level objects that read as a place on their own. */
const PLACES: Record<string, string> = {
  spread: "Spread",
  criteria: "Criteria",
  sweep: "Design sweep",
};

/** "pickError" → "pick error". */
const words = (key: string) => key.replace(/([a-z0-9])([A-Z])/g, "$1 $2").toLowerCase();

/**
 * Where a dotted, zero-based field path points, in the screen's words, e.g.
 * `models.0.layers.0.velocity` → `{ place: "Model 1, layer 1", leaf: "velocity" }`. A path
 * with no numbered or known part gives `place: ""`.
 */
export function describeFieldPath(path: string): { place: string; leaf: string } {
  const parts = path.split(".").filter((p) => p !== "");
  const place: string[] = [];
  let leaf = "";
  for (let i = 0; i < parts.length; i++) {
    const part = parts[i];
    const next = parts[i + 1];
    if (ITEMS[part] && next !== undefined && /^\d+$/.test(next)) {
      const label = ITEMS[part];
      const text = `${label} ${Number(next) + 1}`;
      place.push(place.length === 0 ? text[0].toUpperCase() + text.slice(1) : text);
      i++;
    } else if (PLACES[part] && i < parts.length - 1 && place.length === 0) {
      place.push(PLACES[part]);
    } else if (/^\d+$/.test(part)) {
      place.push(place.length === 0 ? `Item ${Number(part) + 1}` : `item ${Number(part) + 1}`);
    } else {
      leaf = leaf ? `${leaf} ${words(part)}` : words(part);
    }
  }
  return { place: place.join(", "), leaf };
}

/**
 * One problem of a refused plan as a sentence counting from 1: `models.0.layers.0.velocity`
 * with "velocity must be > 0" reads "Model 1, layer 1: velocity must be > 0"; the field's name
 * is added when the message does not start with it. `root` (the whole document) keeps the
 * message as it is.
 */
export function describePlanProblem(path: string, message: string): string {
  if (path === "root" || path === "") return message;
  const { place, leaf } = describeFieldPath(path);
  const lastWord = leaf.split(" ").at(-1) ?? "";
  const named =
    leaf === "" || message.toLowerCase().includes(lastWord) ? message : `${leaf}: ${message}`;
  return place ? `${place}: ${named}` : named;
}
