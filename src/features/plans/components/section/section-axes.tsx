import { chartMono, palette } from "@/lib/chart/palette";

/** The plot box of a section chart: the SVG's size and the margins around the plot. */
export interface SectionFrame {
  width: number;
  height: number;
  margin: { top: number; right: number; bottom: number; left: number };
}

export interface SectionTick {
  px: number;
  label: string;
}

/** Faint horizontal grid lines at the y ticks, drawn under the data. */
export function SectionGrid({ frame, yTicks }: { frame: SectionFrame; yTicks: SectionTick[] }) {
  const { margin, width } = frame;
  return (
    <g aria-hidden pointerEvents="none">
      {yTicks.map((t) => (
        <line
          key={t.label}
          x1={margin.left}
          x2={width - margin.right}
          y1={t.px}
          y2={t.px}
          stroke={palette.rule}
          strokeWidth={0.6}
        />
      ))}
    </g>
  );
}

/**
 * The axes of the section charts (the section to scale and the arrivals of one shot): the
 * bottom and left axis lines, tick marks and monospace labels, and the axis titles.
 */
export function SectionAxes({
  frame,
  xTicks,
  yTicks,
  xLabel,
  yLabel,
  xLabelAt = "middle",
}: {
  frame: SectionFrame;
  xTicks: SectionTick[];
  yTicks: SectionTick[];
  xLabel: string;
  yLabel: string;
  /** Where the x axis title sits: centred under the plot, or from its left edge. */
  xLabelAt?: "middle" | "start";
}) {
  const { margin, width, height } = frame;
  const bottom = height - margin.bottom;
  const right = width - margin.right;
  return (
    <g pointerEvents="none">
      <line x1={margin.left} x2={right} y1={bottom} y2={bottom} stroke={palette.inkSoft} />
      <line
        x1={margin.left}
        x2={margin.left}
        y1={margin.top}
        y2={bottom}
        stroke={palette.inkSoft}
      />
      {xTicks.map((t) => (
        <g key={`x${t.label}`}>
          <line x1={t.px} x2={t.px} y1={bottom} y2={bottom + 4} stroke={palette.inkSoft} />
          <text
            x={t.px}
            y={bottom + 16}
            textAnchor="middle"
            fontSize={11}
            fontFamily={chartMono}
            fill={palette.inkSoft}
          >
            {t.label}
          </text>
        </g>
      ))}
      {yTicks.map((t) => (
        <text
          key={`y${t.label}`}
          x={margin.left - 6}
          y={t.px + 4}
          textAnchor="end"
          fontSize={11}
          fontFamily={chartMono}
          fill={palette.inkSoft}
        >
          {t.label}
        </text>
      ))}
      <text
        x={xLabelAt === "start" ? margin.left : (margin.left + right) / 2}
        y={height - 6}
        textAnchor={xLabelAt}
        fontSize={12}
        fill={palette.inkSoft}
      >
        {xLabel}
      </text>
      <text
        transform={`translate(14,${(margin.top + bottom) / 2}) rotate(-90)`}
        textAnchor="middle"
        fontSize={12}
        fill={palette.inkSoft}
      >
        {yLabel}
      </text>
    </g>
  );
}
