import { palette } from "./palette";

export interface Tick {
  px: number;
  label: string;
}

/**
 * Horizontal grid lines across the plot with their labels in the left margin, as SVG
 * attributes (so exported charts keep them).
 */
export function HorizontalGrid({
  ticks,
  left,
  right,
}: {
  ticks: Tick[];
  left: number;
  right: number;
}) {
  return (
    <>
      {ticks.map((t) => (
        <g key={`y${t.label}`}>
          <line x1={left} x2={right} y1={t.px} y2={t.px} stroke={palette.rule} strokeWidth={0.6} />
          <text x={left - 6} y={t.px + 3.5} textAnchor="end" fontSize={11} fill={palette.inkSoft}>
            {t.label}
          </text>
        </g>
      ))}
    </>
  );
}
