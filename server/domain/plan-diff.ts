/**
 * The structured difference between two plan revisions: models matched by name (then by
 * position), layers aligned on the unchanged ones, spread and criteria fields, shots, and the
 * verdicts that changed. Pure: no database, no engine run (verdicts come from the stored
 * summaries).
 */
import type {
  DiffValue,
  FieldChange,
  LayerDiff,
  ModelDiff,
  PlanDiff,
  RevisionAnalysisSummary,
  Verdict,
  VerdictChange,
} from "@/contracts/plans";
import type { CandidateModel, Layer, Plan as PlanDocument, Shot } from "@engine";

export interface DiffSide {
  document: PlanDocument;
  summary: RevisionAnalysisSummary | null;
}

type LayerField = { field: string; value: (layer: Layer) => DiffValue };

const LAYER_FIELDS: LayerField[] = [
  { field: "name", value: (l) => l.name ?? null },
  { field: "material", value: (l) => l.material ?? null },
  { field: "velocity", value: (l) => l.velocity },
  { field: "thickness", value: (l) => l.thickness ?? null },
  { field: "dip", value: (l) => l.dip ?? null },
  { field: "velocityRange.min", value: (l) => l.velocityRange?.[0] ?? null },
  { field: "velocityRange.max", value: (l) => l.velocityRange?.[1] ?? null },
  { field: "thicknessRange.min", value: (l) => l.thicknessRange?.[0] ?? null },
  { field: "thicknessRange.max", value: (l) => l.thicknessRange?.[1] ?? null },
];

function layerFields(from: Layer | null, to: Layer | null): FieldChange[] {
  const changes: FieldChange[] = [];
  for (const { field, value } of LAYER_FIELDS) {
    const a = from ? value(from) : null;
    const b = to ? value(to) : null;
    if (a !== b) changes.push({ field, from: a, to: b });
  }
  return changes;
}

/** Cost of calling `a` → `b` one changed layer: its differing fields, a new name counting double. */
function changeCost(a: Layer, b: Layer): number {
  return layerFields(a, b).reduce((sum, c) => sum + (c.field === "name" ? 2 : 1), 0);
}
/** Cost of a layer added or removed: a changed layer is preferred while fewer fields differ. */
const INDEL = 3;

/**
 * Aligns two layer lists by the cheapest edit (Wagner–Fischer edit distance): identical
 * layers cost nothing, a changed layer costs its differing fields, an added or removed layer
 * costs 3. So inserting a thin layer in the middle reads as one "added" layer and a layer
 * whose thickness changed reads as "changed". Pairs come out in order of both lists.
 */
export function alignLayers(from: Layer[], to: Layer[]): [number | null, number | null][] {
  const n = from.length;
  const m = to.length;
  const cost: number[][] = Array.from({ length: n + 1 }, () => new Array<number>(m + 1).fill(0));
  for (let i = n; i >= 0; i--) {
    for (let j = m; j >= 0; j--) {
      if (i === n && j === m) continue;
      let best = Infinity;
      if (i < n && j < m) best = changeCost(from[i], to[j]) + cost[i + 1][j + 1];
      if (i < n) best = Math.min(best, INDEL + cost[i + 1][j]);
      if (j < m) best = Math.min(best, INDEL + cost[i][j + 1]);
      cost[i][j] = best;
    }
  }
  const pairs: [number | null, number | null][] = [];
  let i = 0;
  let j = 0;
  while (i < n || j < m) {
    if (i < n && j < m && cost[i][j] === changeCost(from[i], to[j]) + cost[i + 1][j + 1]) {
      pairs.push([i++, j++]);
    } else if (i < n && cost[i][j] === INDEL + cost[i + 1][j]) {
      pairs.push([i++, null]);
    } else {
      pairs.push([null, j++]);
    }
  }
  return pairs;
}

/** Models matched by identical name first, the rest by order; surplus added or removed. */
export function matchModels(
  from: CandidateModel[],
  to: CandidateModel[],
): [number | null, number | null][] {
  const pairs: [number | null, number | null][] = [];
  const usedTo = new Set<number>();
  const unmatchedFrom: number[] = [];
  from.forEach((model, i) => {
    const j = to.findIndex((other, k) => !usedTo.has(k) && other.name === model.name);
    if (j >= 0) {
      usedTo.add(j);
      pairs.push([i, j]);
    } else unmatchedFrom.push(i);
  });
  const unmatchedTo = to.map((_, k) => k).filter((k) => !usedTo.has(k));
  const paired = Math.min(unmatchedFrom.length, unmatchedTo.length);
  for (let k = 0; k < paired; k++) pairs.push([unmatchedFrom[k], unmatchedTo[k]]);
  for (const i of unmatchedFrom.slice(paired)) pairs.push([i, null]);
  for (const j of unmatchedTo.slice(paired)) pairs.push([null, j]);
  return pairs.sort((a, b) => (a[1] ?? a[0] ?? 0) - (b[1] ?? b[0] ?? 0));
}

function modelDiff(
  from: CandidateModel | null,
  to: CandidateModel | null,
  fromIndex: number | null,
  toIndex: number | null,
): ModelDiff | null {
  const layerPairs = alignLayers(from?.layers ?? [], to?.layers ?? []);
  const layers: LayerDiff[] = [];
  for (const [i, j] of layerPairs) {
    const a = i === null || !from ? null : from.layers[i];
    const b = j === null || !to ? null : to.layers[j];
    const fields = layerFields(a, b);
    if (fields.length === 0 && a && b) continue;
    layers.push({
      change: a && b ? "changed" : a ? "removed" : "added",
      fromIndex: i,
      toIndex: j,
      from: a,
      to: b,
      fields,
    });
  }
  const change = from && to ? "changed" : from ? "removed" : "added";
  if (change === "changed" && layers.length === 0 && from!.name === to!.name) return null;
  return {
    change,
    fromName: from?.name ?? null,
    toName: to?.name ?? null,
    fromIndex,
    toIndex,
    layers,
  };
}

function fieldChanges<T extends object>(from: T, to: T, keys: (keyof T & string)[]): FieldChange[] {
  const changes: FieldChange[] = [];
  for (const key of keys) {
    const a = (from[key] ?? null) as DiffValue;
    const b = (to[key] ?? null) as DiffValue;
    if (a !== b) changes.push({ field: key, from: a, to: b });
  }
  return changes;
}

function shotChanges(from: Shot[], to: Shot[]): { added: Shot[]; removed: Shot[] } {
  // An anchored shot that followed a spread edit is the same shot (the spread diff says why it
  // moved); a fixed shot is known by its position.
  const key = (s: Shot) =>
    `${s.anchor ? `${s.anchor.to}${s.anchor.offset}` : s.position}\u0000${s.label ?? ""}`;
  const remaining = new Map<string, number>();
  for (const s of from) remaining.set(key(s), (remaining.get(key(s)) ?? 0) + 1);
  const added: Shot[] = [];
  for (const s of to) {
    const left = remaining.get(key(s)) ?? 0;
    if (left > 0) remaining.set(key(s), left - 1);
    else added.push(s);
  }
  const removed: Shot[] = [];
  const toCounts = new Map<string, number>();
  for (const s of to) toCounts.set(key(s), (toCounts.get(key(s)) ?? 0) + 1);
  for (const s of from) {
    const left = toCounts.get(key(s)) ?? 0;
    if (left > 0) toCounts.set(key(s), left - 1);
    else removed.push(s);
  }
  return { added, removed };
}

function verdictChanges(
  a: DiffSide,
  b: DiffSide,
  modelPairs: [number | null, number | null][],
): VerdictChange[] {
  const changes: VerdictChange[] = [];
  for (const [i, j] of modelPairs) {
    const fromModel = i === null ? null : (a.summary?.models[i] ?? null);
    const toModel = j === null ? null : (b.summary?.models[j] ?? null);
    if (!fromModel && !toModel) continue;
    const model = toModel?.name ?? fromModel?.name ?? "";
    const fromWorst: Verdict | null = fromModel?.worstStatus ?? null;
    const toWorst: Verdict | null = toModel?.worstStatus ?? null;
    if (fromWorst !== toWorst) {
      changes.push({
        model,
        layer: null,
        from: fromWorst,
        to: toWorst,
        errorFrom: null,
        errorTo: null,
      });
    }
    const layerPairs = alignLayers(
      i === null ? [] : a.document.models[i].layers,
      j === null ? [] : b.document.models[j].layers,
    );
    for (const [li, lj] of layerPairs) {
      // Layer index k (0-based) has its refractor at its top: layer number k + 1, none for k = 0.
      const r1 =
        li === null || li === 0 ? null : fromModel?.refractors.find((r) => r.layer === li + 1);
      const r2 =
        lj === null || lj === 0 ? null : toModel?.refractors.find((r) => r.layer === lj + 1);
      if (!r1 && !r2) continue;
      const from = r1?.status ?? null;
      const to = r2?.status ?? null;
      if (from === to) continue;
      changes.push({
        model,
        layer: r2?.layer ?? r1?.layer ?? null,
        from,
        to,
        errorFrom: r1?.error ?? null,
        errorTo: r2?.error ?? null,
      });
    }
  }
  return changes;
}

/** Everything of a PlanDiff except the plan id and the two revision numbers. */
export function diffRevisions(a: DiffSide, b: DiffSide): Omit<PlanDiff, "planId" | "from" | "to"> {
  const modelPairs = matchModels(a.document.models, b.document.models);
  const models = modelPairs
    .map(([i, j]) =>
      modelDiff(
        i === null ? null : a.document.models[i],
        j === null ? null : b.document.models[j],
        i,
        j,
      ),
    )
    .filter((d): d is ModelDiff => d !== null);
  const spread = fieldChanges(a.document.spread, b.document.spread, [
    "spacing",
    "channels",
    "firstGeophone",
  ]);
  const shots = shotChanges(a.document.spread.shots, b.document.spread.shots);
  const criteria = fieldChanges(a.document.criteria, b.document.criteria, [
    "minGeophones",
    "pickError",
    "depthTolerance",
  ]);
  const fromWorst = a.summary?.worstVerdict ?? null;
  const toWorst = b.summary?.worstVerdict ?? null;
  const worstVerdict = fromWorst === toWorst ? null : { from: fromWorst, to: toWorst };
  const verdicts = verdictChanges(a, b, modelPairs);
  const name =
    a.document.name === b.document.name
      ? null
      : { field: "name", from: a.document.name, to: b.document.name };
  const identical =
    name === null &&
    models.length === 0 &&
    spread.length === 0 &&
    shots.added.length === 0 &&
    shots.removed.length === 0 &&
    criteria.length === 0 &&
    worstVerdict === null &&
    verdicts.length === 0;
  return { name, models, spread, shots, criteria, worstVerdict, verdicts, identical };
}
