import { useId, useMemo, useRef } from "react";
import { chartFont, chartMono, palette } from "@/lib/chart/palette";
import { formatQuantity } from "@/lib/units";
import { buildSection, type SectionInput } from "../../lib/section-chart";
import { arrivalName } from "../../lib/arrivals-chart";
import { ExportButtons } from "./export-buttons";

/**
 * The Section: the model to scale (depth down), layers shaded by velocity with a legend,
 * geophones (small triangles) and shots (brick marks) on the surface, and the first-arrival
 * ray path to one geophone.
 */
export function SectionChart({ input, title }: { input: SectionInput; title: string }) {
  const section = useMemo(() => buildSection(input), [input]);
  const svgRef = useRef<SVGSVGElement>(null);
  const titleId = useId();
  const gradientId = `grad${useId().replace(/[^a-zA-Z0-9]/g, "")}`;
  const { margin, width, height } = section;
  const surface = margin.top;
  const legendWidth = section.legend.width;
  const legendX = width - margin.right - legendWidth;

  return (
    <figure>
      <svg
        ref={svgRef}
        width={width}
        height={height}
        viewBox={`0 0 ${width} ${height}`}
        role="img"
        aria-labelledby={titleId}
        fontFamily={chartFont}
        className="block h-auto max-w-full"
      >
        <title id={titleId}>{title}</title>
        <defs>
          <linearGradient id={gradientId} x1="0" x2="1" y1="0" y2="0">
            {section.legend.stops.map((s) => (
              <stop key={s.offset} offset={s.offset} stopColor={s.colour} />
            ))}
          </linearGradient>
        </defs>
        {section.layers.map((l) => (
          <g key={l.layer} data-layer={l.layer}>
            <path d={l.path} fill={l.fill} stroke="none" />
            <text x={l.labelX} y={l.labelY} fontSize={11} fill={l.textColour} textAnchor="middle">
              {`${l.layer}. ${l.name} · ${formatQuantity("velocity", l.velocity, input.units)}`}
            </text>
          </g>
        ))}
        {section.interfaces.map((i) => (
          <path key={i.layer} d={i.path} stroke={palette.inkDeep} strokeWidth={1} fill="none" />
        ))}
        <line
          x1={margin.left}
          x2={width - margin.right}
          y1={surface}
          y2={surface}
          stroke={palette.inkDeep}
          strokeWidth={1.5}
        />
        {section.ray ? (
          <g data-role="ray-path">
            <path
              d={section.ray.path}
              fill="none"
              stroke={palette.card}
              strokeWidth={4.5}
              strokeLinejoin="round"
            />
            <path
              d={section.ray.path}
              fill="none"
              stroke={palette.brick}
              strokeWidth={2}
              strokeLinejoin="round"
            />
          </g>
        ) : null}
        {section.geophones.map((g) => (
          <path
            key={g.number}
            d={`M${g.x},${surface} l-3.5,-7 h7 z`}
            fill={input.geophone === g.number ? palette.brick : palette.ink}
          >
            <title>{`Geophone ${g.number} at ${formatQuantity("length", g.position, input.units)}`}</title>
          </path>
        ))}
        {section.shots.map((s) => (
          <g key={s.index}>
            <circle
              cx={s.x}
              cy={surface - 14}
              r={s.selected ? 5 : 3.5}
              fill={s.selected ? palette.brick : palette.card}
              stroke={palette.brick}
              strokeWidth={1.5}
            />
            {s.selected ? (
              <text x={s.x} y={surface - 21} textAnchor="middle" fontSize={10} fill={palette.brick}>
                {s.label}
              </text>
            ) : null}
          </g>
        ))}
        {section.xTicks.map((t) => (
          <text
            key={`x${t.label}`}
            x={t.px}
            y={height - margin.bottom + 16}
            textAnchor="middle"
            fontSize={11}
            fill={palette.inkSoft}
          >
            {t.label}
          </text>
        ))}
        {section.yTicks.map((t) => (
          <g key={`y${t.label}`}>
            <line x1={margin.left - 4} x2={margin.left} y1={t.px} y2={t.px} stroke={palette.ink} />
            <text
              x={margin.left - 7}
              y={t.px + 3.5}
              textAnchor="end"
              fontSize={11}
              fill={palette.inkSoft}
            >
              {t.label}
            </text>
          </g>
        ))}
        <line
          x1={margin.left}
          x2={margin.left}
          y1={surface}
          y2={height - margin.bottom}
          stroke={palette.ink}
        />
        <text
          x={(margin.left + width - margin.right) / 2}
          y={height - 6}
          textAnchor="middle"
          fontSize={12}
          fill={palette.ink}
        >
          {section.xLabel}
        </text>
        <text
          transform={`translate(14 ${(surface + height - margin.bottom) / 2}) rotate(-90)`}
          textAnchor="middle"
          fontSize={12}
          fill={palette.ink}
        >
          {section.yLabel}
        </text>
        <text x={margin.left} y={12} fontSize={11} fill={palette.inkSoft} fontFamily={chartMono}>
          {section.scaleNote}
        </text>
        <g aria-label="Velocity legend">
          <rect
            x={legendX}
            y={4}
            width={legendWidth}
            height={8}
            fill={`url(#${gradientId})`}
            stroke={palette.rule}
          />
          {section.legend.ticks.map((t) => (
            <text
              key={t.label}
              x={legendX + t.at * legendWidth}
              y={22}
              textAnchor={t.at <= 0 ? "start" : t.at >= 1 ? "end" : "middle"}
              fontSize={9}
              fill={palette.inkSoft}
            >
              {t.label}
            </text>
          ))}
          <text x={legendX - 6} y={12} textAnchor="end" fontSize={10} fill={palette.inkSoft}>
            {section.legend.label}
          </text>
        </g>
      </svg>
      {input.ray ? (
        <p className="mt-1 font-mono text-xs text-ink-deep">
          Ray path: shot {input.shotIndex + 1} → geophone {input.geophone} ·{" "}
          {arrivalName(input.ray.kind === "direct" ? 1 : input.ray.layer)} ·{" "}
          {formatQuantity("time", input.ray.time, input.units)}
        </p>
      ) : null}
      <div className="mt-2">
        <ExportButtons svgRef={svgRef} title={title} />
      </div>
    </figure>
  );
}
