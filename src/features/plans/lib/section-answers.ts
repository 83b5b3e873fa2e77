/**
 * The answers on a section as drawing data (pure, d3 scales only): the stretches of each
 * interface sampled by head waves, offset under the interface one row per shot branch and
 * coloured by verdict; the first-arrival rays of a shot; the interfaces a crew would
 * interpret; and the arrivals of one shot as time against position.
 */
import { scaleLinear } from "d3-scale";
import { arrivalColour, palette } from "@/lib/chart/palette";

/**
 * Ray colours on the section: the direct wave in soft ink, head waves in cool hues kept apart
 * from the verdict colours (moss, ochre, brick) of the stretches drawn over them.
 */
const RAY_COLOURS = [palette.inkSoft, "#2f7d8c", "#6a4c7d", "#3a5f8f", "#5b3f2f", "#2e6b55"];
export const rayColour = (via: number) => RAY_COLOURS[(Math.max(1, via) - 1) % RAY_COLOURS.length];
import { toDisplay, unitLabel, type UnitSystem } from "@/lib/units";
import type {
  CoverageStretch,
  InterfaceCoverage,
  SectionInterpretation,
  SectionRay,
  SectionShotArrivals,
  Status,
} from "@engine";
import type { SectionDraft } from "./plan-form";
import { placeCallouts } from "./callout-placement";
import { clipLine, type SectionView } from "./section-view";

/** Colour and dash of a verdict on the section (colour is never the only cue: dashes too). */
export const STRETCH_STYLE: Record<Status, { colour: string; dash: string | undefined }> = {
  resolved: { colour: palette.moss, dash: undefined },
  "under-sampled": { colour: palette.ochre, dash: "6 3" },
  blind: { colour: palette.brick, dash: "2 3" },
  inverted: { colour: palette.brick, dash: "8 3 2 3" },
};

export interface StretchMark {
  layer: number;
  stretch: CoverageStretch;
  path: string;
  colour: string;
  dash: string | undefined;
  /** Where to write the geophone count, or null when the stretch is too short on screen. */
  label: { x: number; y: number; text: string } | null;
  /** Branch row under the interface (0 nearest). */
  row: number;
}

/** Side word of a branch. */
export const sideWord = (side: string | null) =>
  side === "forward" ? "forward" : side === "reverse" ? "reverse" : "";

/**
 * Each stretch drawn along its interface between `from` and `to`, 5 px under it per branch
 * row (one row per shot branch, in the order they come), blind and inverted stretches on
 * the interface itself. Feature stretches are left to featureBands; geophone-count labels
 * never overlap each other or a layer's name (one that would is moved along its stretch or
 * left out).
 */
export function stretchMarks(
  view: SectionView,
  section: SectionDraft,
  coverage: InterfaceCoverage[],
): StretchMark[] {
  const out: StretchMark[] = [];
  // the layers' name labels are there already (12 px sans name, 11 px monospace velocity)
  const placed: Array<{ x0: number; x1: number; y0: number; y1: number }> = view.layers.flatMap(
    (l) => {
      if (!l.label) return [];
      const w = l.name.length * 6.8 + (l.velocityText.length + 2) * 6.7;
      return [
        { x0: l.label.x - w / 2, x1: l.label.x + w / 2, y0: l.label.y - 11, y1: l.label.y + 3 },
      ];
    },
  );
  for (const c of coverage) {
    const base = section.layers[c.layer - 2]?.base;
    if (!base) continue;
    const rows = new Map<string, number>();
    for (const s of c.stretches) {
      // feature stretches lie inside their branch's run: drawn on the interface instead
      // (featureBands), never as another mark on the branch row
      if (s.feature !== undefined) continue;
      const key = s.shot === null ? "none" : `${s.shot}:${s.side}`;
      if (!rows.has(key)) rows.set(key, s.shot === null ? -1 : rows.size);
      const row = rows.get(key) as number;
      const from = Math.max(view.from, Math.min(s.from, s.to));
      const to = Math.min(view.to, Math.max(s.from, s.to));
      if (!(to >= from)) continue;
      const pts = clipLine(base, from, to);
      const dy = row < 0 ? 0 : 5 + row * 5;
      const path = pts
        .map(
          ([x, z], i) =>
            `${i === 0 ? "M" : "L"}${view.x(x).toFixed(1)},${(view.y(z) + dy).toFixed(1)}`,
        )
        .join("");
      const style = STRETCH_STYLE[s.status];
      const wide = view.x(to) - view.x(from) >= 44;
      const text = `S${(s.shot ?? 0) + 1}${s.side === "forward" ? "→" : "←"} ${s.geophones}`;
      const w = text.length * 6.2; // 10 px monospace, semibold
      // branch rows write their counts at different places along the stretch; a count that
      // would overlap one already written moves to another place, or is left out
      const fractions = [0.3, 0.7, 0.5, 0.15, 0.85];
      const first = Math.max(0, row) % fractions.length;
      let label: StretchMark["label"] = null;
      for (let k = 0; wide && s.shot !== null && k < fractions.length; k++) {
        const mid = from + (to - from) * fractions[(first + k) % fractions.length];
        const midZ = clipLine(base, mid, mid)[0][1];
        const x = view.x(mid);
        const y = view.y(midZ) + dy + 13;
        const box = { x0: x - w / 2, x1: x + w / 2, y0: y - 10, y1: y + 2 };
        const clash = placed.some(
          (p) => p.x0 < box.x1 + 3 && box.x0 < p.x1 + 3 && p.y0 < box.y1 + 2 && box.y0 < p.y1 + 2,
        );
        if (clash) continue;
        placed.push(box);
        label = { x, y, text };
        break;
      }
      out.push({
        layer: c.layer,
        stretch: s,
        path,
        colour: style.colour,
        dash: style.dash,
        row,
        label,
      });
    }
  }
  return out;
}

/** Plain words for a count of geophones ("1 geophone", "3 geophones"). */
export const geophoneWord = (n: number) => `${n} geophone${n === 1 ? "" : "s"}`;

/**
 * What a feature stretch means in words: under-sampled when it counts towards the verdict,
 * "resolved by another branch" when another shot branch puts enough exit points on the same
 * feature (`judged` false, section-types.ts). Null for a stretch without `feature`.
 */
export function featureVerdict(s: CoverageStretch): string | null {
  if (s.feature === undefined) return null;
  return s.judged ? "under-sampled" : "resolved by another branch";
}

/**
 * The stretches of one interface in reading order: under-sampled (judged) feature stretches
 * first, so a lead sees at once which stretch the spread misses, then the other stretches as
 * they came (feature stretches resolved by another branch stay beside their run).
 */
export function orderStretches(stretches: CoverageStretch[]): CoverageStretch[] {
  const weak = stretches.filter((s) => s.feature !== undefined && s.judged);
  return [...weak, ...stretches.filter((s) => !weak.includes(s))];
}

/** The recommendation for a stretch of interface `layer` (same ends within 1 mm), or null. */
export function recommendationFor<R extends { layer: number; from: number; to: number }>(
  recommendations: R[],
  layer: number,
  s: CoverageStretch,
): R | null {
  return (
    recommendations.find(
      (r) => r.layer === layer && Math.abs(r.from - s.from) < 1e-3 && Math.abs(r.to - s.to) < 1e-3,
    ) ?? null
  );
}

export interface FeatureBand {
  layer: number;
  feature: string;
  from: number;
  to: number;
  /** Most exit points any branch puts on the feature (all fewer than minGeophones). */
  geophones: number;
  /** The band along the interface between from and to (SVG path, px). */
  path: string;
  /** Label near the band (placeCallouts: off other labels, bands and the layers' names). */
  label: { x: number; y: number; text: string; anchor: "start" | "middle" | "end" };
  /** Leader from the label's edge (x1, y1) to the band (x2, y2). */
  leader: { x1: number; y1: number; x2: number; y2: number };
}

/** Boxes `step` px long covering a stroke `half` px either side of a path (M/L only), px. */
function pathPieces(path: string, step: number, half: number) {
  const pts = [...path.matchAll(/[ML](-?[\d.]+),(-?[\d.]+)/g)].map((m) => [+m[1], +m[2]]);
  const out: Array<{ x0: number; x1: number; y0: number; y1: number }> = [];
  for (let i = 0; i + 1 < pts.length; i++) {
    const [ax, ay] = pts[i];
    const [bx, by] = pts[i + 1];
    const n = Math.max(1, Math.ceil(Math.hypot(bx - ax, by - ay) / step));
    for (let k = 0; k < n; k++) {
      const [x0, y0] = [ax + ((bx - ax) * k) / n, ay + ((by - ay) * k) / n];
      const [x1, y1] = [ax + ((bx - ax) * (k + 1)) / n, ay + ((by - ay) * (k + 1)) / n];
      out.push({
        x0: Math.min(x0, x1),
        x1: Math.max(x0, x1),
        y0: Math.min(y0, y1) - half,
        y1: Math.max(y0, y1) + half,
      });
    }
  }
  return out;
}

/** The screen box of a band drawn along a path (13 px wide stroke), px. */
function bandBox(path: string) {
  const pts = [...path.matchAll(/[ML](-?[\d.]+),(-?[\d.]+)/g)].map((m) => [+m[1], +m[2]]);
  const xs = pts.map((p) => p[0]);
  const ys = pts.map((p) => p[1]);
  const half = 6.5;
  return {
    x0: Math.min(...xs),
    x1: Math.max(...xs),
    y0: Math.min(...ys) - half,
    y1: Math.max(...ys) + half,
  };
}

/**
 * Under-sampled interface features (judged feature stretches) as bands on the interface
 * itself, exactly from `from` to `to`, one per feature (branches that flag the same feature
 * share it), labelled "<feature>: <n> geophone(s)" on a leader, above the interface where
 * there is room (placeCallouts): no label over another, a band, a layer's name or one of the
 * `avoid` marks' labels (stretchMarks), and leaders kept off the text. Features resolved by another branch are not drawn.
 */
export function featureBands(
  view: SectionView,
  section: SectionDraft,
  coverage: InterfaceCoverage[],
  avoid: StretchMark[] = [],
): FeatureBand[] {
  const out: FeatureBand[] = [];
  const charPx = 6.1; // 10.5 px sans-serif, semibold: a generous average glyph width
  const placed: Array<{ x0: number; x1: number; y: number }> = view.layers.flatMap((l) => {
    if (!l.label) return [];
    const w = l.name.length * 6.8 + (l.velocityText.length + 2) * 6.7;
    return [{ x0: l.label.x - w / 2, x1: l.label.x + w / 2, y: l.label.y }];
  });
  placed.push(
    ...avoid.flatMap((m) =>
      m.label
        ? [
            {
              x0: m.label.x - m.label.text.length * 3.1,
              x1: m.label.x + m.label.text.length * 3.1,
              y: m.label.y,
            },
          ]
        : [],
    ),
  );
  const left = view.margin.left;
  const right = view.width - view.margin.right;
  for (const c of coverage) {
    const base = section.layers[c.layer - 2]?.base;
    if (!base) continue;
    const seen = new Map<string, FeatureBand>();
    for (const s of c.stretches) {
      if (s.feature === undefined || !s.judged || s.status !== "under-sampled") continue;
      const a = Math.min(s.from, s.to);
      const b = Math.max(s.from, s.to);
      const key = `${s.feature}:${a.toFixed(3)}:${b.toFixed(3)}`;
      const had = seen.get(key);
      if (had) {
        had.geophones = Math.max(had.geophones, s.geophones);
        had.label.text = `${had.feature}: ${geophoneWord(had.geophones)}`;
        continue;
      }
      const from = Math.max(view.from, a);
      const to = Math.min(view.to, b);
      if (!(to >= from)) continue;
      const pts = clipLine(base, from, to);
      const path = pts
        .map(([x, z], i) => `${i === 0 ? "M" : "L"}${view.x(x).toFixed(1)},${view.y(z).toFixed(1)}`)
        .join("");
      const mid = (from + to) / 2;
      const px = view.x(mid);
      const py = Math.min(...pts.map(([, z]) => view.y(z)));
      const band: FeatureBand = {
        layer: c.layer,
        feature: s.feature,
        from: a,
        to: b,
        geophones: s.geophones,
        path,
        label: {
          x: px,
          y: py,
          text: `${s.feature}: ${geophoneWord(s.geophones)}`,
          anchor: "middle",
        },
        leader: { x1: px, y1: py, x2: px, y2: py },
      };
      seen.set(key, band);
      out.push(band);
    }
  }
  // place the labels once their final text is known: above or below the band, a row or a
  // step sideways at a time, never over another label or band, leaders kept off the text
  const bandBoxes = out.map((b) => bandBox(b.path));
  const callouts = placeCallouts(
    out.map((b, i) => ({
      x: b.leader.x2,
      top: bandBoxes[i].y0,
      bottom: bandBoxes[i].y1,
      width: b.label.text.length * charPx,
      height: 12,
    })),
    [
      ...placed.map((p) => ({ x0: p.x0, x1: p.x1, y0: p.y - 11, y1: p.y + 3 })),
      ...bandBoxes,
      // the branch rows' bands, in short pieces, so a label sits on one only when the other
      // places are worse (a leader through text, a label over a label)
      ...avoid.flatMap((m) => pathPieces(m.path, 12, 2.5).map((b) => ({ ...b, weight: 0.03 }))),
    ],
    { left: left + 2, right: right - 2, top: 2, bottom: view.height - view.margin.bottom - 2 },
  );
  out.forEach((band, i) => {
    const { box, leader } = callouts[i];
    band.label = { x: box.x0, y: box.y1 - 3, text: band.label.text, anchor: "start" };
    band.leader = leader;
  });
  return out;
}

/** First-arrival ray paths as SVG paths, coloured by the layer they travelled along. */
export function rayPaths(view: SectionView, rays: SectionRay[]) {
  return rays
    .filter((r) => r.points.length >= 4)
    .map((r) => {
      let d = "";
      for (let i = 0; i < r.points.length; i += 2)
        d += `${i === 0 ? "M" : "L"}${view.x(r.points[i]).toFixed(1)},${view.y(r.points[i + 1]).toFixed(1)}`;
      return { geophone: r.geophone, via: r.via, path: d, colour: rayColour(r.via) };
    });
}

/** Interpreted interfaces as dashed lines and the worst point. */
export function interpretationMarks(view: SectionView, interpretation: SectionInterpretation) {
  const lines = interpretation.interfaces.map((f) => {
    const pts = [...f.points].sort((a, b) => a.position - b.position);
    return {
      layer: f.layer,
      path: pts
        .map(
          (p, i) =>
            `${i === 0 ? "M" : "L"}${view.x(p.position).toFixed(1)},${view.y(p.elevation).toFixed(1)}`,
        )
        .join(""),
      points: pts.map((p) => ({ px: view.x(p.position), py: view.y(p.elevation), point: p })),
    };
  });
  const w = interpretation.worst;
  let worst = null;
  if (w) {
    const f = interpretation.interfaces.find((i) => i.layer === w.layer);
    const p = f?.points.find((q) => q.position === w.position && q.error === w.error);
    if (p) worst = { px: view.x(p.position), py: view.y(p.elevation), ...w };
  }
  return { lines, worst };
}

export interface ArrivalsPlot {
  width: number;
  height: number;
  margin: { top: number; right: number; bottom: number; left: number };
  xTicks: Array<{ px: number; label: string }>;
  yTicks: Array<{ px: number; label: string }>;
  xLabel: string;
  yLabel: string;
  shotX: number;
  /** Straight pieces between neighbouring geophones of the same arrival and side of the shot. */
  segments: Array<{ path: string; colour: string }>;
  points: Array<{
    px: number;
    py: number;
    colour: string;
    via: number;
    position: number;
    time: number;
  }>;
}

/** The first arrivals of one shot on the section, time (ms) against position. */
export function arrivalsPlot(
  shot: SectionShotArrivals,
  width: number,
  units: UnitSystem,
): ArrivalsPlot {
  const margin = { top: 16, right: 18, bottom: 42, left: 58 };
  const height = 300;
  const xs = [shot.position, ...shot.geophones.map((g) => g.position)];
  const times = shot.geophones.map((g) => g.time ?? 0);
  const x = scaleLinear()
    .domain([Math.min(...xs), Math.max(...xs)])
    .range([margin.left, width - margin.right]);
  const tMax = Math.max(1e-3, ...times) * 1.08;
  const y = scaleLinear()
    .domain([0, tMax])
    .range([height - margin.bottom, margin.top]);
  const perUnit = toDisplay("length", 1, units);
  const xTicks = scaleLinear()
    .domain(x.domain().map((v) => v * perUnit))
    .ticks(8)
    .map((v) => ({ px: x(v / perUnit), label: String(v) }));
  const yTicks = scaleLinear()
    .domain([0, tMax * 1000])
    .ticks(6)
    .map((v) => ({ px: y(v / 1000), label: String(v) }));
  const points = shot.geophones
    .filter((g) => g.time !== null)
    .map((g) => ({
      px: x(g.position),
      py: y(g.time as number),
      colour: arrivalColour(g.via),
      via: g.via,
      position: g.position,
      time: g.time as number,
    }));
  const segments: ArrivalsPlot["segments"] = [];
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1];
    const b = points[i];
    const sameSide = (a.position - shot.position) * (b.position - shot.position) > 0;
    if (a.via === b.via && sameSide)
      segments.push({ path: `M${a.px},${a.py}L${b.px},${b.py}`, colour: a.colour });
  }
  return {
    width,
    height,
    margin,
    xTicks,
    yTicks,
    xLabel: `Geophone position (${unitLabel("length", units)})`,
    yLabel: "First arrival (ms)",
    shotX: x(shot.position),
    segments,
    points,
  };
}
