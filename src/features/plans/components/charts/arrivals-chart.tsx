import { useId, useMemo, useRef, useState } from "react";
import { chartFont, chartMono, palette } from "@/lib/chart/palette";
import { HorizontalGrid } from "@/lib/chart/grid";
import { ErrorNotice, Loading } from "@/components/feedback";
import { type UnitSystem } from "@/lib/units";
import type { ArrivalCurves, ModelAnalysis, ShotArrivals } from "../../lib/engine";
import {
  buildArrivalsChart,
  nearestGeophone,
  type ArrivalsChartModel,
  type GeophoneMark,
} from "../../lib/arrivals-chart";
import { ExportButtons } from "./export-buttons";

export interface ArrivalsData {
  curves: ArrivalCurves;
  arrivals: ShotArrivals;
}

/**
 * The Arrivals chart (time against offset for one shot): every arrival faint where it
 * exists and solid where it is the first arrival, the first-arrival curve emphasised, one
 * mark per geophone at the time it records, each segment labelled with its geophone count,
 * and hidden refractors flagged in brick red with the reason.
 */
export function ArrivalsChart({
  data,
  analysis,
  layerNames,
  minGeophones,
  units,
  width,
  height = 360,
  domain,
  showReflections,
  title,
  stale,
}: {
  data: ArrivalsData;
  analysis: ModelAnalysis;
  layerNames: Array<string | null | undefined>;
  minGeophones: number;
  units: UnitSystem;
  width: number;
  height?: number;
  domain?: [number, number];
  showReflections: boolean;
  title: string;
  stale?: boolean;
}) {
  const chart = useMemo(
    () =>
      buildArrivalsChart({
        curves: data.curves,
        arrivals: data.arrivals,
        analysis,
        layerNames,
        width,
        height,
        domain,
        showReflections,
        minGeophones,
        units,
      }),
    [data, analysis, layerNames, width, height, domain, showReflections, minGeophones, units],
  );
  const svgRef = useRef<SVGSVGElement>(null);
  const [hover, setHover] = useState<GeophoneMark | null>(null);
  const titleId = useId();
  const clipId = `clip${useId().replace(/[^a-zA-Z0-9]/g, "")}`;

  return (
    <figure className={stale ? "opacity-60 transition-opacity" : "transition-opacity"}>
      <svg
        ref={svgRef}
        width={chart.width}
        height={chart.height}
        viewBox={`0 0 ${chart.width} ${chart.height}`}
        role="img"
        aria-labelledby={titleId}
        fontFamily={chartFont}
        className="block h-auto max-w-full touch-none select-none"
        onPointerMove={(e) => {
          const rect = e.currentTarget.getBoundingClientRect();
          const scale = rect.width > 0 ? chart.width / rect.width : 1;
          setHover(nearestGeophone(chart, (e.clientX - rect.left) * scale));
        }}
        onPointerLeave={() => setHover(null)}
      >
        <title id={titleId}>{title}</title>
        <ChartFrame chart={chart} />
        <g clipPath={`url(#${clipId})`}>
          <defs>
            <clipPath id={clipId}>
              <rect
                x={chart.margin.left}
                y={chart.margin.top}
                width={chart.width - chart.margin.left - chart.margin.right}
                height={chart.height - chart.margin.top - chart.margin.bottom}
              />
            </clipPath>
          </defs>
          <path
            d={chart.firstPath}
            fill="none"
            stroke={palette.ochreSoft}
            strokeWidth={9}
            strokeLinecap="round"
            strokeLinejoin="round"
            data-role="first-arrival"
          />
          {chart.reflections.map((r) => (
            <path
              key={r.key}
              d={r.path}
              fill="none"
              stroke={r.colour}
              strokeWidth={1}
              strokeDasharray="2 3"
              opacity={0.7}
              data-role="reflection"
            />
          ))}
          {chart.curves.map((c) => (
            <g key={c.key} data-arrival={c.layer}>
              <path d={c.faintPath} fill="none" stroke={c.colour} strokeWidth={1.2} opacity={0.3} />
              <path d={c.solidPath} fill="none" stroke={c.colour} strokeWidth={2.2} />
            </g>
          ))}
        </g>
        {chart.geophones.map((g) => (
          <g key={g.channel} data-geophone={g.number}>
            <line
              x1={g.x}
              x2={g.x}
              y1={chart.height - chart.margin.bottom}
              y2={chart.height - chart.margin.bottom + 6}
              stroke={palette.ink}
              strokeWidth={1}
            />
            <circle
              cx={g.x}
              cy={g.y}
              r={hover?.channel === g.channel ? 4.5 : 3}
              fill={g.colour}
              stroke={palette.card}
              strokeWidth={1}
            >
              <title>{g.readout}</title>
            </circle>
          </g>
        ))}
        {chart.shotX !== null ? (
          <g aria-hidden>
            <path
              d={`M${chart.shotX},${chart.height - chart.margin.bottom + 2} l-6,10 h12 z`}
              fill={palette.brick}
            />
          </g>
        ) : null}
        {chart.segmentLabels.map((s) => (
          <g key={s.key} data-segment-layer={s.layer} data-segment-side={s.side}>
            <text
              x={s.x}
              y={s.y}
              textAnchor={s.anchor}
              fontSize={11}
              fontFamily={chartMono}
              fill={s.status === "resolved" ? palette.inkDeep : palette.brick}
              stroke={palette.card}
              strokeWidth={3}
              paintOrder="stroke"
            >
              {s.text}
            </text>
          </g>
        ))}
        {hover ? (
          <g pointerEvents="none" data-export-skip>
            <line
              x1={hover.x}
              x2={hover.x}
              y1={chart.margin.top}
              y2={chart.height - chart.margin.bottom}
              stroke={palette.inkFaint}
              strokeDasharray="3 3"
            />
          </g>
        ) : null}
      </svg>
      {/* figures of the pointed geophone in monospace; the helper sentence in the text face */}
      <p
        className={`mt-1 min-h-5 text-xs text-ink-deep print:hidden ${hover ? "font-mono" : "font-sans"}`}
        aria-live="polite"
        data-testid="arrivals-readout"
      >
        {hover ? hover.readout : "Point at the chart to read a geophone's first break."}
      </p>
      {chart.flags.length > 0 ? (
        <ul className="mt-2 space-y-1" aria-label="Flagged arrivals on this shot">
          {chart.flags.map((f) => (
            <li
              key={f.key}
              className="rounded-md border border-brick/40 bg-brick-soft px-3 py-1.5 text-sm text-brick"
              data-flag-layer={f.layer}
            >
              <span aria-hidden>⚑ </span>
              {f.text}
            </li>
          ))}
        </ul>
      ) : null}
      <Legend chart={chart} showReflections={showReflections} />
      <div className="mt-2">
        <ExportButtons svgRef={svgRef} title={title} />
      </div>
    </figure>
  );
}

function ChartFrame({ chart }: { chart: ArrivalsChartModel }) {
  const { margin, width, height } = chart;
  const bottom = height - margin.bottom;
  return (
    <g>
      <HorizontalGrid ticks={chart.yTicks} left={margin.left} right={width - margin.right} />
      {chart.xTicks.map((t) => (
        <g key={`x${t.label}`}>
          <line
            x1={t.px}
            x2={t.px}
            y1={margin.top}
            y2={bottom}
            stroke={palette.rule}
            strokeWidth={0.6}
          />
          <text x={t.px} y={bottom + 20} textAnchor="middle" fontSize={11} fill={palette.inkSoft}>
            {t.label}
          </text>
        </g>
      ))}
      <line
        x1={margin.left}
        x2={width - margin.right}
        y1={bottom}
        y2={bottom}
        stroke={palette.ink}
      />
      <line x1={margin.left} x2={margin.left} y1={margin.top} y2={bottom} stroke={palette.ink} />
      <text
        x={(margin.left + width - margin.right) / 2}
        y={height - 6}
        textAnchor="middle"
        fontSize={12}
        fill={palette.ink}
      >
        {chart.xLabel}
      </text>
      <text
        transform={`translate(14 ${(margin.top + bottom) / 2}) rotate(-90)`}
        textAnchor="middle"
        fontSize={12}
        fill={palette.ink}
      >
        {chart.yLabel}
      </text>
    </g>
  );
}

function Legend({
  chart,
  showReflections,
}: {
  chart: ArrivalsChartModel;
  showReflections: boolean;
}) {
  return (
    <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft" aria-label="Legend">
      <li className="flex items-center gap-1.5">
        <span
          className="inline-block h-2 w-5 rounded-full"
          style={{ background: palette.ochreSoft }}
        />
        first arrival
      </li>
      {chart.curves
        .filter((c) => c.faintPath !== "")
        .map((c) => (
          <li key={c.key} className="flex items-center gap-1.5">
            <span className="inline-block h-0.5 w-5" style={{ background: c.colour }} />
            {c.label}
          </li>
        ))}
      <li className="flex items-center gap-1.5">
        <span className="inline-block h-0.5 w-5 opacity-30" style={{ background: palette.ink }} />
        faint: exists, not first
      </li>
      {showReflections ? (
        <li className="flex items-center gap-1.5">
          <span
            className="inline-block w-5 border-t border-dashed"
            style={{ borderColor: palette.ink }}
          />
          reflections
        </li>
      ) : null}
    </ul>
  );
}

/** Loading and error states around the chart while the modeller computes the curves. */
export function ChartState({ pending, error }: { pending: boolean; error: unknown }) {
  if (error) return <ErrorNotice error={error} title="The modeller could not draw this shot" />;
  if (pending) return <Loading label="Computing arrivals…" />;
  return null;
}
