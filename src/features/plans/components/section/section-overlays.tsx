import { useId } from "react";
import { chartFont, chartMono, palette } from "@/lib/chart/palette";
import { formatQuantity, formatSigned, type UnitSystem } from "@/lib/units";
import type { SectionInterpretation, SectionRay } from "@engine";
import type { InterfaceCoverage } from "@engine";
import type { MethodReading } from "../../../../../workers/field/section-reading";
import type { SectionDraft } from "../../lib/plan-form";
import {
  featureBands,
  interpretationMarks,
  rayPaths,
  stretchMarks,
} from "../../lib/section-answers";
import { boreholeTop, type StoredBorehole } from "../../lib/section-boreholes";
import type { SectionView } from "../../lib/section-view";

/**
 * Boreholes drawn as vertical logs where they stand (from their own top, else the surface),
 * a tick at each logged base.
 */
export function BoreholeLogs({
  view,
  boreholes,
  surface,
  units,
}: {
  view: SectionView;
  boreholes: readonly StoredBorehole[];
  surface: [number, number][];
  units: UnitSystem;
}) {
  if (boreholes.length === 0) return null;
  return (
    <g aria-label="Boreholes">
      {boreholes.map((b, index) => {
        const ground = boreholeTop(surface, b);
        const px = view.x(b.position);
        const depths = b.depths.filter((d): d is number => d !== null);
        const bottom = view.y(ground - Math.max(0, ...depths));
        return (
          <g key={`${index}:${b.name}`}>
            <rect
              x={px - 3}
              y={view.y(ground)}
              width={6}
              height={Math.max(2, bottom - view.y(ground))}
              fill={palette.card}
              stroke={palette.inkDeep}
              strokeWidth={1}
            />
            {depths.map((d, i) => (
              <line
                key={i}
                x1={px - 6}
                x2={px + 6}
                y1={view.y(ground - d)}
                y2={view.y(ground - d)}
                stroke={palette.inkDeep}
                strokeWidth={1.5}
              />
            ))}
            {/* a light halo keeps the name legible over the dark lower layers */}
            <text
              x={px + 7}
              y={bottom + 10}
              fontSize={10}
              fontWeight={600}
              fill={palette.inkDeep}
              stroke={palette.card}
              strokeWidth={3}
              strokeLinejoin="round"
              paintOrder="stroke"
            >
              {b.name}
            </text>
            <title>{`${b.name} at ${formatQuantity("length", b.position, units)}`}</title>
          </g>
        );
      })}
    </g>
  );
}

/** First-arrival rays of one shot. */
export function RayOverlay({ view, rays }: { view: SectionView; rays: SectionRay[] }) {
  return (
    <g aria-label="First-arrival ray paths" fill="none" pointerEvents="none">
      {rayPaths(view, rays).map((r) => (
        <path key={r.geophone} d={r.path} stroke={r.colour} strokeWidth={0.9} opacity={0.75} />
      ))}
    </g>
  );
}

/**
 * A band along an interface: a light halo path under the stroked band (`stroke` a colour or a
 * pattern fill), so bands stay legible where they cross the layers' shading and rays.
 */
function Band({
  d,
  stroke,
  width,
  halo,
  haloOpacity,
  dash,
}: {
  d: string;
  stroke: string;
  width: number;
  /** Width of the halo under the band, px. */
  halo: number;
  haloOpacity?: number;
  dash?: string;
}) {
  return (
    <>
      <path
        d={d}
        fill="none"
        stroke={palette.card}
        strokeWidth={halo}
        strokeLinecap="butt"
        opacity={haloOpacity}
      />
      <path
        d={d}
        fill="none"
        stroke={stroke}
        strokeWidth={width}
        strokeDasharray={dash}
        strokeLinecap="butt"
      />
    </>
  );
}

/** The stretches of each interface sampled by head waves, one row per shot branch. */
export function StretchOverlay({
  view,
  section,
  coverage,
}: {
  view: SectionView;
  section: SectionDraft;
  coverage: InterfaceCoverage[];
}) {
  const marks = stretchMarks(view, section, coverage);
  // every band first, then every count, so no band is drawn over a count
  return (
    <g aria-label="Stretches sampled by head waves" pointerEvents="none">
      {marks.map((m, i) => (
        <g key={i}>
          <Band
            d={m.path}
            stroke={m.colour}
            width={3.5}
            halo={5.5}
            haloOpacity={0.8}
            dash={m.dash}
          />
        </g>
      ))}
      {marks.map((m, i) =>
        m.label ? (
          <text
            key={`t${i}`}
            x={m.label.x}
            y={m.label.y}
            textAnchor="middle"
            fontSize={10}
            fontFamily={chartMono}
            fontWeight={600}
            fill={m.colour}
            stroke={palette.card}
            strokeWidth={2.5}
            paintOrder="stroke"
          >
            {m.label.text}
          </text>
        ) : null,
      )}
    </g>
  );
}

/**
 * Under-sampled interface features (e.g. a channel floor) as a thick hatched ochre band on
 * the interface itself, exactly between the feature's ends, with a label
 * ("channel floor: 1 geophone") on a leader, placed so labels never overlap each other, a
 * band or a layer's name (featureBands).
 */
export function FeatureOverlay({
  view,
  section,
  coverage,
  units,
}: {
  view: SectionView;
  section: SectionDraft;
  coverage: InterfaceCoverage[];
  units: UnitSystem;
}) {
  const id = useId().replace(/:/g, "");
  const bands = featureBands(view, section, coverage, stretchMarks(view, section, coverage));
  if (bands.length === 0) return null;
  const hatch = `feature-hatch-${id}`;
  return (
    <g aria-label="Under-sampled features" pointerEvents="none">
      <defs>
        <pattern
          id={hatch}
          patternUnits="userSpaceOnUse"
          width={6}
          height={6}
          patternTransform="rotate(45)"
        >
          <rect width={6} height={6} fill={palette.ochre} />
          <line x1={0} y1={0} x2={0} y2={6} stroke={palette.inkDeep} strokeWidth={2.2} />
        </pattern>
      </defs>
      {bands.map((b) => (
        <g
          key={`${b.layer}:${b.from}:${b.to}`}
          role="img"
          aria-label={`${b.feature} from ${formatQuantity("length", b.from, units)} to ${formatQuantity("length", b.to, units)}: ${b.label.text.slice(b.feature.length + 2)}, under-sampled`}
        >
          <Band d={b.path} stroke={`url(#${hatch})`} width={10} halo={13} />
          <line
            x1={b.leader.x1}
            x2={b.leader.x2}
            y1={b.leader.y1}
            y2={b.leader.y2}
            stroke={palette.inkDeep}
            strokeWidth={1}
          />
          <text
            x={b.label.x}
            y={b.label.y}
            textAnchor={b.label.anchor}
            fontSize={10.5}
            fontFamily={chartFont}
            fontWeight={600}
            fill={palette.inkDeep}
            stroke={palette.card}
            strokeWidth={3}
            paintOrder="stroke"
          >
            {b.label.text}
          </text>
        </g>
      ))}
    </g>
  );
}

/** The interfaces a crew would interpret, dashed over the true ones, and the worst point. */
export function InterpretationOverlay({
  view,
  interpretation,
  units,
}: {
  view: SectionView;
  interpretation: SectionInterpretation;
  units: UnitSystem;
}) {
  const { lines, worst } = interpretationMarks(view, interpretation);
  return (
    <g aria-label="Interpreted interfaces" pointerEvents="none">
      {lines.map((l) => (
        <g key={l.layer}>
          <path
            d={l.path}
            fill="none"
            stroke={palette.inkDeep}
            strokeWidth={1.6}
            strokeDasharray="5 4"
          />
          {l.points.map((p, i) => (
            <circle
              key={i}
              cx={p.px}
              cy={p.py}
              r={3}
              fill={palette.card}
              stroke={palette.inkDeep}
              strokeWidth={1.2}
            />
          ))}
        </g>
      ))}
      {worst ? (
        <g>
          <circle
            cx={worst.px}
            cy={worst.py}
            r={7}
            fill="none"
            stroke={palette.brick}
            strokeWidth={2}
          />
          <text
            x={worst.px + 10}
            y={worst.py - 8}
            fontSize={11}
            fontWeight={600}
            fill={palette.brick}
            stroke={palette.card}
            strokeWidth={3}
            paintOrder="stroke"
          >
            {`worst ${formatSigned("length", worst.error, units)}`}
          </text>
        </g>
      ) : null}
    </g>
  );
}

/** Dash of the crew's plus-minus reading (distinct from the intercept-time marks, "5 4"). */
export const READING_DASH = "1.5 3";

/**
 * A crew's reading of the section by a reciprocal method (plus-minus): each interpreted
 * interface as a dotted moss line (on a light halo) under the geophones, over the true one.
 */
export function ReadingOverlay({ view, reading }: { view: SectionView; reading: MethodReading }) {
  return (
    <g aria-label={`Crew's reading: ${reading.method}`} pointerEvents="none">
      {reading.interfaces.map((f) => {
        const pts = [...f.points].sort((a, b) => a.position - b.position);
        if (pts.length === 0) return null;
        const d = pts
          .map(
            (p, i) =>
              `${i === 0 ? "M" : "L"}${view.x(p.position).toFixed(1)},${view.y(p.elevation).toFixed(1)}`,
          )
          .join("");
        // a light halo under the dots keeps them legible on the stretch bands they follow
        return (
          <g key={f.layer} data-layer={f.layer}>
            <path d={d} fill="none" stroke={palette.card} strokeWidth={4.5} opacity={0.9} />
            <path
              data-role="reading"
              d={d}
              fill="none"
              stroke={palette.moss}
              strokeWidth={2.2}
              strokeDasharray={READING_DASH}
              strokeLinecap="round"
            />
          </g>
        );
      })}
    </g>
  );
}
