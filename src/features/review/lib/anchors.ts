/**
 * Where a comment points in the plan: a layer or refractor of one ground model, or a shot of the
 * spread. Indexes are 0-based as in the API (`CommentAnchor`): a layer anchor names the layer,
 * a refractor anchor names the layer whose top is the refractor (so it is at least 1), a shot
 * anchor names the shot in `spread.shots`.
 */
import type { Plan } from "@engine";
import type { CommentAnchor } from "@/contracts/plans";
import { formatQuantity, type UnitSystem } from "@/lib/units";

/** A stable string for an anchor (form values, React keys): "layer:0:2", "shot:0:1". */
export function anchorKey(anchor: CommentAnchor): string {
  return `${anchor.kind}:${anchor.kind === "shot" ? 0 : (anchor.model ?? 0)}:${anchor.index}`;
}

/** The anchor a key stands for, or null for "" or anything malformed. */
export function parseAnchorKey(key: string): CommentAnchor | null {
  const match = /^(layer|refractor|shot):(\d+):(\d+)$/.exec(key);
  if (!match) return null;
  return {
    kind: match[1] as CommentAnchor["kind"],
    model: Number(match[2]),
    index: Number(match[3]),
  };
}

/**
 * A short label for a chip: "Layer 2 · Clay lens", "Refractor · top of layer 3", "Shot 1 · 0 m".
 * With more than one ground model the model's name follows. Anchors that no longer exist in
 * the document (a layer since removed) keep their number and say so.
 */
export function anchorLabel(
  anchor: CommentAnchor,
  document: Plan | null | undefined,
  units: UnitSystem = "metric",
): string {
  const modelIndex = anchor.model ?? 0;
  const model = document?.models[modelIndex];
  const modelPart =
    anchor.kind !== "shot" && document && document.models.length > 1
      ? ` · ${model?.name ?? `model ${modelIndex + 1}`}`
      : "";
  const missing = document ? " (no longer in the plan)" : "";
  if (anchor.kind === "shot") {
    const shot = document?.spread.shots[anchor.index];
    const base = `Shot ${anchor.index + 1}`;
    if (!shot) return `${base}${missing}`;
    const where = formatQuantity("length", shot.position, units, 1);
    return shot.label ? `${base} · ${shot.label} (${where})` : `${base} · ${where}`;
  }
  const layer = model?.layers[anchor.index];
  const exists = Boolean(layer) && (anchor.kind === "layer" || anchor.index >= 1);
  if (anchor.kind === "layer") {
    const base = `Layer ${anchor.index + 1}`;
    if (!exists) return `${base}${missing}${modelPart}`;
    return `${base}${layer?.name ? ` · ${layer.name}` : ""}${modelPart}`;
  }
  const base = `Refractor · top of layer ${anchor.index + 1}`;
  if (!exists) return `${base}${missing}${modelPart}`;
  return `${base}${layer?.name ? ` (${layer.name})` : ""}${modelPart}`;
}

/** Every place a comment can point at in this document, grouped for a select. */
export function anchorOptions(
  document: Plan,
  units: UnitSystem = "metric",
): Array<{ group: string; options: Array<{ key: string; label: string }> }> {
  const groups: Array<{ group: string; options: Array<{ key: string; label: string }> }> = [];
  document.models.forEach((model, m) => {
    const options: Array<{ key: string; label: string }> = [];
    model.layers.forEach((_, i) => {
      const layer: CommentAnchor = { kind: "layer", model: m, index: i };
      options.push({ key: anchorKey(layer), label: anchorLabel(layer, document, units) });
    });
    model.layers.forEach((_, i) => {
      if (i === 0) return;
      const refractor: CommentAnchor = { kind: "refractor", model: m, index: i };
      options.push({ key: anchorKey(refractor), label: anchorLabel(refractor, document, units) });
    });
    groups.push({ group: `Ground model: ${model.name}`, options });
  });
  groups.push({
    group: "Spread",
    options: document.spread.shots.map((_, i) => {
      const shot: CommentAnchor = { kind: "shot", model: 0, index: i };
      return { key: anchorKey(shot), label: anchorLabel(shot, document, units) };
    }),
  });
  return groups;
}
