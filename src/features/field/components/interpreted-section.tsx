/**
 * The interpreted section: the ground, each interpreted refractor with its ± one standard error
 * band, and the interfaces of every candidate ground model (plan models and borehole logs,
 * dashed) hung from the same ground, positions and elevations in the user's units.
 */
import { palette, chartFont } from "@/lib/chart/palette";
import { formatQuantity, fromDisplay, toDisplay, unitLabel, type UnitSystem } from "@/lib/units";
import { useMemo } from "react";
import { useElementWidth } from "@/hooks/use-element-width";
import type { PlanInterpretation } from "../../../../workers/field/index";
import type { Candidate } from "../lib/comparison";
import { fieldWorker } from "../lib/field-worker";
import { useFieldResult } from "../lib/use-field-result";

/** The drawing's width at most (its viewBox; wider screens scale it up). */
const MAX_W = 820;
const H = 280;
const M = { left: 64, right: 16, top: 16, bottom: 40 };

function ticks(lo: number, hi: number, count = 6): number[] {
  const span = hi - lo || 1;
  const raw = span / count;
  const p = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((k) => k * p).find((s) => s >= raw) ?? raw;
  const out: number[] = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi + 1e-9; v += step) out.push(v);
  return out;
}

const INTERPRETED = [palette.ink, palette.moss, "#6a4c7d"];

export function InterpretedSection({
  result,
  candidates,
  units,
}: {
  result: PlanInterpretation;
  candidates: readonly Candidate[];
  units: UnitSystem;
}) {
  const refs = result.result.refractors;
  // Narrower than 820 px (a phone), the section is drawn at the width it has, so its labels keep
  // their size instead of shrinking to a third.
  const { ref: frameRef, width } = useElementWidth<HTMLElement>(MAX_W);
  const W = Math.max(240, Math.min(MAX_W, width));
  // ground elevation at each interpreted station (elevation + depth below the ground)
  const groundPts = new Map<number, number>();
  for (const r of refs) for (const d of r.depth) groundPts.set(d.position, d.elevation + d.depth);
  const ground = [...groundPts.entries()].sort((a, b) => a[0] - b[0]);
  const groundAt = (x: number) => {
    if (ground.length === 0) return 0;
    if (x <= ground[0][0]) return ground[0][1];
    const last = ground[ground.length - 1];
    if (x >= last[0]) return last[1];
    let i = 1;
    while (ground[i][0] < x) i++;
    const [xa, ya] = ground[i - 1];
    const [xb, yb] = ground[i];
    return ya + ((yb - ya) * (x - xa)) / (xb - xa);
  };
  const shots = refs.flatMap((r) => r.shots);
  const xs = [...ground.map((g) => g[0]), ...shots];
  const x0 = Math.min(...xs);
  const x1 = Math.max(...xs);
  const stations = ground.map((g) => g[0]);
  // Layered candidates only: a section model's interfaces are not a depth below a flat ground.
  const layered = candidates.filter((c) => (c.model as { kind?: string }).kind !== "section");
  // The candidates' interface depths come from the field worker (depths[refractor][model][station]).
  const depthInput = useMemo(
    () => ({
      models: layered.map((c) => c.model),
      layers: refs.map((r) => r.layer),
      stations,
    }),
    // The inputs are derived from `result` and `candidates` only.
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [result, candidates],
  );
  const depths = useFieldResult("candidate-depths", depthInput, (i) =>
    Promise.all(i.layers.map((l) => fieldWorker().candidateDepths(i.models, l, i.stations))),
  ).data;
  const candidateLines = depths
    ? layered.map((c, ci) => ({
        name: c.name,
        source: c.source,
        layers: refs.map((_, ri) =>
          stations.flatMap((x, si) => {
            const d = depths[ri]?.[ci]?.[si] ?? null;
            return d === null ? [] : [[x, groundAt(x) - d] as [number, number]];
          }),
        ),
      }))
    : [];
  const ys = [
    ...ground.map((g) => g[1]),
    ...refs.flatMap((r) => r.depth.flatMap((d) => [d.elevation - d.sigma, d.elevation + d.sigma])),
    ...candidateLines.flatMap((c) => c.layers.flat().map((p) => p[1])),
  ];
  const yTop = Math.max(...ys) + 1;
  const yBottom = Math.min(...ys) - 1;
  const sx = (x: number) => M.left + ((x - x0) / (x1 - x0 || 1)) * (W - M.left - M.right);
  const sy = (y: number) => M.top + ((yTop - y) / (yTop - yBottom || 1)) * (H - M.top - M.bottom);
  const path = (pts: [number, number][]) =>
    pts.map(([x, y], i) => `${i ? "L" : "M"}${sx(x).toFixed(1)},${sy(y).toFixed(1)}`).join("");
  const lenUnit = unitLabel("length", units);
  // Ticks at round values of the unit read ([SI m, shown]): 0, 20, 40 ft, not the feet of 0, 5, 10 m.
  const lengthTicks = (lo: number, hi: number, count = 6): [number, number][] =>
    ticks(toDisplay("length", lo, units), toDisplay("length", hi, units), count).map((shown) => [
      fromDisplay("length", shown, units),
      Number(shown.toFixed(6)),
    ]);

  return (
    <figure ref={frameRef} className="m-0">
      <svg
        viewBox={`0 0 ${W} ${H}`}
        className="h-auto w-full"
        role="img"
        aria-label={`Interpreted section: ${refs.map((r) => `top of layer ${r.layer} from ${formatQuantity("length", Math.min(...r.depth.map((d) => d.depth)), units, 1)} to ${formatQuantity("length", Math.max(...r.depth.map((d) => d.depth)), units, 1)} below the ground`).join("; ")}`}
        style={{ fontFamily: chartFont }}
      >
        <rect x={0} y={0} width={W} height={H} fill={palette.card} />
        {lengthTicks(yBottom, yTop).map(([t, shown]) => (
          <g key={`y${t}`}>
            <line x1={M.left} x2={W - M.right} y1={sy(t)} y2={sy(t)} stroke={palette.rule} />
            <text
              x={M.left - 6}
              y={sy(t) + 4}
              fontSize={11}
              textAnchor="end"
              fill={palette.inkSoft}
            >
              {shown}
            </text>
          </g>
        ))}
        {lengthTicks(x0, x1, W < 500 ? 4 : 6).map(([t, shown]) => (
          <text
            key={`x${t}`}
            x={sx(t)}
            y={H - M.bottom + 16}
            fontSize={11}
            textAnchor="middle"
            fill={palette.inkSoft}
          >
            {shown}
          </text>
        ))}
        <text
          x={(M.left + W - M.right) / 2}
          y={H - 6}
          fontSize={11}
          textAnchor="middle"
          fill={palette.inkSoft}
        >
          Position along the line ({lenUnit})
        </text>
        <text
          transform={`translate(14 ${(M.top + H - M.bottom) / 2}) rotate(-90)`}
          fontSize={11}
          textAnchor="middle"
          fill={palette.inkSoft}
        >
          Elevation ({lenUnit})
        </text>
        {candidateLines.map((c, ci) =>
          c.layers.map((pts, li) =>
            pts.length > 1 ? (
              <path
                key={`c${ci}-${li}`}
                d={path(pts)}
                fill="none"
                stroke={c.source === "borehole" ? palette.brick : palette.ochre}
                strokeWidth={1.5}
                strokeDasharray="6 4"
              >
                <title>{`${c.name} (${c.source === "borehole" ? "borehole log" : "candidate"}): top of layer ${refs[li].layer}`}</title>
              </path>
            ) : null,
          ),
        )}
        {refs.map((r, i) => {
          const upper = r.depth.map((d) => [d.position, d.elevation + d.sigma] as [number, number]);
          const lower = r.depth.map((d) => [d.position, d.elevation - d.sigma] as [number, number]);
          const band = `${path(upper)}${path(lower.reverse()).replace(/^M/, "L")}Z`;
          return (
            <g key={r.layer}>
              <path d={band} fill={INTERPRETED[i % INTERPRETED.length]} opacity={0.18} />
              <path
                d={path(r.depth.map((d) => [d.position, d.elevation]))}
                fill="none"
                stroke={INTERPRETED[i % INTERPRETED.length]}
                strokeWidth={2.5}
              >
                <title>{`Interpreted top of layer ${r.layer}`}</title>
              </path>
            </g>
          );
        })}
        {ground.length > 1 ? (
          <path d={path(ground)} fill="none" stroke={palette.inkSoft} strokeWidth={2} />
        ) : null}
        {stations.map((x) => (
          <path
            key={`g${x}`}
            d={`M${sx(x)},${sy(groundAt(x)) - 6}l-3,-6h6z`}
            fill={palette.inkSoft}
          />
        ))}
        {[...new Set(shots)].map((s) => (
          <circle key={`s${s}`} cx={sx(s)} cy={sy(groundAt(s)) - 4} r={4} fill={palette.ochre}>
            <title>{`Shot at ${formatQuantity("length", s, units, 1)}`}</title>
          </circle>
        ))}
      </svg>
      <figcaption className="mt-1 text-xs text-ink-soft">
        Solid: interpreted refractors with a band of ± one standard error. Dashed ochre: the plan's
        candidate models; dashed brick: models from borehole logs (hung from the same ground).
        Circles: shots; triangles: geophones with an interpretation.
      </figcaption>
    </figure>
  );
}
