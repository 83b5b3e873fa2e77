import {
  useEffect,
  useRef,
  useState,
  type KeyboardEvent,
  type PointerEvent,
  type ReactNode,
} from "react";
import { chartFont, chartMono, palette } from "@/lib/chart/palette";
import { formatQuantity, type UnitSystem } from "@/lib/units";
import type { SectionView } from "../../lib/section-view";
import { SectionAxes, SectionGrid } from "./section-axes";

export interface PointRef {
  line: number;
  index: number;
}

export interface SectionEditing {
  selected: PointRef | null;
  /** Points the schema refuses ("line:index"), drawn in brick red. */
  flagged: ReadonlySet<string>;
  onSelect: (point: PointRef | null) => void;
  /** A point moved to (x m, elevation m); `done` on release or a key press. */
  onMove: (point: PointRef, x: number, z: number, done: boolean) => void;
  onInsert: (line: number, x: number) => void;
  onRemove: (point: PointRef) => void;
}

/**
 * The section drawn to scale (SVG): layers shaded by velocity, interfaces, geophones and shots
 * on the surface, axes in the user's units. With `editing`, every polyline point is a handle:
 * drag it, click a line to add a point, select one and press Delete or Backspace to remove it,
 * arrow keys nudge it (Shift: ten times more). `children` draws over the ground (rays,
 * stretches, interpretation) in the same coordinates.
 */
export function SectionFigure({
  view,
  title,
  units,
  editing,
  children,
  caption,
}: {
  view: SectionView;
  title: string;
  units: UnitSystem;
  editing?: SectionEditing;
  children?: ReactNode;
  caption?: ReactNode;
}) {
  const svg = useRef<SVGSVGElement>(null);
  const [drag, setDrag] = useState<PointRef | null>(null);
  const { margin, width, height } = view;
  // keyboard focus follows the selected point (e.g. one just added by a click on a line),
  // unless the user is typing in a box
  const selectedKey = editing?.selected
    ? `${editing.selected.line}:${editing.selected.index}`
    : null;
  useEffect(() => {
    if (!selectedKey || !svg.current) return;
    const active = document.activeElement;
    if (active && active !== document.body && !svg.current.contains(active)) return;
    const handle = svg.current.querySelector<SVGGElement>(`[data-point="${selectedKey}"]`);
    if (handle && handle !== active) handle.focus();
  }, [selectedKey]);
  const bottom = height - margin.bottom;
  const right = width - margin.right;
  // on a phone-width chart the axis title and the vertical scale share the bottom line
  const narrow = width < 520;

  const toModel = (e: { clientX: number; clientY: number }) => {
    const rect = svg.current?.getBoundingClientRect();
    const sx = rect && rect.width > 0 ? view.width / rect.width : 1;
    const sy = rect && rect.height > 0 ? view.height / rect.height : 1;
    const px = (e.clientX - (rect?.left ?? 0)) * sx;
    const py = (e.clientY - (rect?.top ?? 0)) * sy;
    return { x: view.x.invert(px), z: view.y.invert(py) };
  };

  const onPointerMove = (e: PointerEvent<SVGSVGElement>) => {
    if (!drag || !editing) return;
    const { x, z } = toModel(e);
    editing.onMove(drag, x, z, false);
  };
  const endDrag = (e: PointerEvent<SVGSVGElement>) => {
    if (!drag || !editing) return;
    const { x, z } = toModel(e);
    editing.onMove(drag, x, z, true);
    setDrag(null);
  };

  const stepX = units === "imperial" ? 0.3048 : 0.5;
  const stepZ = units === "imperial" ? 0.3048 / 2 : 0.1;
  const onKey = (point: PointRef, x: number, z: number) => (e: KeyboardEvent<SVGGElement>) => {
    if (!editing) return;
    const k = e.shiftKey ? 10 : 1;
    const moves: Record<string, [number, number]> = {
      ArrowLeft: [-stepX * k, 0],
      ArrowRight: [stepX * k, 0],
      ArrowUp: [0, stepZ * k],
      ArrowDown: [0, -stepZ * k],
    };
    if (moves[e.key]) {
      e.preventDefault();
      editing.onMove(point, x + moves[e.key][0], z + moves[e.key][1], true);
    } else if (e.key === "Delete" || e.key === "Backspace") {
      e.preventDefault();
      editing.onRemove(point);
    } else if (e.key === "Escape") {
      editing.onSelect(null);
    }
  };

  return (
    <figure className="m-0">
      <svg
        ref={svg}
        role="img"
        aria-label={title}
        viewBox={`0 0 ${width} ${height}`}
        width="100%"
        style={{ maxWidth: width, touchAction: drag ? "none" : undefined }}
        fontFamily={chartFont}
        onPointerMove={onPointerMove}
        onPointerUp={endDrag}
        onPointerCancel={endDrag}
      >
        <title>{title}</title>
        <rect x={0} y={0} width={width} height={height} fill={palette.card} />
        {/* sky */}
        <rect
          x={margin.left}
          y={margin.top}
          width={right - margin.left}
          height={bottom - margin.top}
          fill={palette.paper}
        />
        <SectionGrid frame={view} yTicks={view.yTicks} />
        {view.layers.map((l) => (
          <path key={l.layer} d={l.path} fill={l.fill} stroke="none" />
        ))}
        {view.lines.map((l) => (
          <path
            key={l.line}
            d={l.path}
            fill="none"
            stroke={l.line < 0 ? palette.inkDeep : palette.ink}
            strokeWidth={l.line < 0 ? 1.8 : 1.2}
          />
        ))}
        {view.layers.map((l) =>
          l.label ? (
            <text
              key={`t${l.layer}`}
              x={l.label.x}
              y={l.label.y}
              textAnchor="middle"
              fontSize={12}
              fill={l.label.colour}
              pointerEvents="none"
            >
              <tspan fontWeight={600}>{l.name}</tspan>
              <tspan fontFamily={chartMono} fontSize={11}>
                {"  "}
                {l.velocityText}
              </tspan>
            </text>
          ) : null,
        )}
        {children}
        {/* geophones and shots on the surface */}
        {view.geophones.map((g) => (
          <path
            key={`gp${g.number}`}
            d={`M${g.px - 3.5},${g.py - 7}L${g.px + 3.5},${g.py - 7}L${g.px},${g.py}Z`}
            fill={palette.inkDeep}
            stroke={palette.card}
            strokeWidth={0.6}
          >
            <title>{`geophone ${g.number} at ${formatQuantity("length", g.position, units)}`}</title>
          </path>
        ))}
        {view.shots.map((s) => (
          <g key={`s${s.index}`}>
            <circle
              cx={s.px}
              cy={s.py}
              r={s.selected ? 6 : 4.5}
              fill={s.selected ? palette.ochre : palette.card}
              stroke={palette.inkDeep}
              strokeWidth={1.4}
            />
            <text
              x={s.px}
              y={margin.top - 8}
              textAnchor="middle"
              fontSize={11}
              fontWeight={s.selected ? 700 : 500}
              fill={s.selected ? palette.inkDeep : palette.inkSoft}
            >
              {`S${s.index + 1}`}
            </text>
            <line
              x1={s.px}
              x2={s.px}
              y1={margin.top - 5}
              y2={s.py - 7}
              stroke={palette.inkFaint}
              strokeDasharray="1 3"
            />
          </g>
        ))}
        {editing
          ? view.lines.map((l) => (
              <g key={`e${l.line}`}>
                <path
                  d={l.path}
                  fill="none"
                  stroke="transparent"
                  strokeWidth={12}
                  style={{ cursor: "copy" }}
                  aria-hidden
                  onClick={(e) => editing.onInsert(l.line, toModel(e).x)}
                />
                {l.points.map((p) => {
                  const key = `${l.line}:${p.index}`;
                  const selected =
                    editing.selected?.line === l.line && editing.selected.index === p.index;
                  const flagged = editing.flagged.has(key);
                  return (
                    <g
                      key={key}
                      role="button"
                      tabIndex={0}
                      data-point={key}
                      aria-pressed={selected}
                      aria-label={`${l.label} point ${p.index + 1} at ${formatQuantity("length", p.x, units)}, elevation ${formatQuantity("length", p.z, units)}`}
                      style={{ cursor: "grab", outline: "none" }}
                      onFocus={() => editing.onSelect({ line: l.line, index: p.index })}
                      onPointerDown={(e) => {
                        e.preventDefault();
                        (e.currentTarget as SVGGElement).focus();
                        svg.current?.setPointerCapture?.(e.pointerId);
                        editing.onSelect({ line: l.line, index: p.index });
                        setDrag({ line: l.line, index: p.index });
                      }}
                      onKeyDown={onKey({ line: l.line, index: p.index }, p.x, p.z)}
                    >
                      <circle cx={p.px} cy={p.py} r={10} fill="transparent" />
                      <rect
                        x={p.px - (selected ? 5.5 : 4)}
                        y={p.py - (selected ? 5.5 : 4)}
                        width={selected ? 11 : 8}
                        height={selected ? 11 : 8}
                        fill={flagged ? palette.brick : selected ? palette.ochre : palette.card}
                        stroke={flagged ? palette.brick : palette.inkDeep}
                        strokeWidth={selected ? 2 : 1.2}
                      />
                    </g>
                  );
                })}
              </g>
            ))
          : null}
        <SectionAxes
          frame={view}
          xTicks={view.xTicks}
          yTicks={view.yTicks}
          xLabel={view.xLabel}
          yLabel={view.yLabel}
          xLabelAt={narrow ? "start" : "middle"}
        />
        <text x={right} y={height - 6} textAnchor="end" fontSize={11} fill={palette.inkSoft}>
          {view.exaggeration === 1
            ? "true scale"
            : `${narrow ? "vertical" : "vertical scale"} ×${view.exaggeration}`}
        </text>
      </svg>
      {caption ? <figcaption className="mt-1 text-xs text-ink-soft">{caption}</figcaption> : null}
    </figure>
  );
}
