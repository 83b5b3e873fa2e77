/**
 * Converting a layered ground model into a section model (the designer's one-click
 * conversion): the flat surface at a chosen elevation and each planar base as a straight
 * polyline over the chosen range of positions.
 */
import { interfaceDepth, earthFromModel } from "./geometry";
import type { GroundModel, SectionModel } from "./plan-schema";

/**
 * The section equivalent of a layered model between positions `from` and `to` (m, from <
 * to), with the surface at `surfaceElevation` (m, default 0). Depths follow the layered
 * convention (thickness at position 0, dip of each base), so the section gives the same
 * first arrivals. Throws RangeError for an invalid layered model or range.
 */
export function sectionFromLayered(
  model: GroundModel,
  from: number,
  to: number,
  surfaceElevation = 0,
): SectionModel {
  if (!(Number.isFinite(from) && Number.isFinite(to) && to > from)) {
    throw new RangeError("the section needs a range of positions with from < to");
  }
  if (!Number.isFinite(surfaceElevation)) throw new RangeError("surface elevation must be finite");
  const earth = earthFromModel(model);
  const n = earth.layerCount;
  return {
    kind: "section",
    name: model.name,
    surface: [
      [from, surfaceElevation],
      [to, surfaceElevation],
    ],
    layers: model.layers.map((layer, i) => ({
      ...(layer.name !== undefined ? { name: layer.name } : {}),
      ...(layer.material !== undefined ? { material: layer.material } : {}),
      velocity: layer.velocity,
      ...(i < n - 1
        ? {
            base: [
              [from, surfaceElevation - interfaceDepth(earth, i + 1, from)],
              [to, surfaceElevation - interfaceDepth(earth, i + 1, to)],
            ] as [number, number][],
          }
        : {}),
    })),
  };
}
