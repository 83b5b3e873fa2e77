import { useEffect, useMemo, useRef, useState } from "react";
import type { FirstBreakPick } from "@/contracts/field";
import { palette, chartFont } from "@/lib/chart/palette";
import type { PickQuality, Seg2Record } from "../../../../workers/field/index";
import { useElementWidth } from "@/hooks/use-element-width";
import { unitLabel, type UnitSystem } from "@/lib/units";
import { length, lengthNumber, ms } from "../lib/format";
import { findPick, type TracePlacement } from "../lib/picks";
import {
  peakAmplitude,
  pointerTarget,
  sectionLayout,
  snapToSample,
  timeTicks,
  wigglePaths,
  zoomWindow,
  type SectionLayout,
} from "../lib/record-section";

export type DisplayMode = "both" | "wiggle" | "area";
export type Scaling = "trace" | "record";

export interface SectionView {
  mode: DisplayMode;
  /** Amplitude multiplier. */
  gain: number;
  /** Largest deflection in trace spacings. */
  clip: number;
  scaling: Scaling;
  window: [number, number];
}

/** Colours of pick marks by origin. */
export const PICK_COLOURS = {
  auto: palette.brick,
  adjusted: "#d2561e",
  csv: palette.moss,
} as const;

const HEIGHT = 460;

/** Gain slider position (0–100) ↔ gain (1/16 … 16, logarithmic). */
export const gainFromSlider = (v: number) => 2 ** ((v - 50) / 12.5);
export const sliderFromGain = (g: number) => Math.round(50 + 12.5 * Math.log2(g));

/** Start and end of the record, s. */
export function recordSpan(record: Seg2Record): [number, number] {
  let start = Number.POSITIVE_INFINITY;
  let end = Number.NEGATIVE_INFINITY;
  for (const t of record.traces) {
    start = Math.min(start, t.delay);
    end = Math.max(end, t.delay + Math.max(0, t.samples.length - 1) * t.sampleInterval);
  }
  return end > start ? [start, end] : [0, 0.1];
}

function draw(
  canvas: HTMLCanvasElement,
  layout: SectionLayout,
  record: Seg2Record,
  placements: TracePlacement[],
  picks: readonly FirstBreakPick[],
  modelled: (number | null)[] | null,
  view: SectionView,
  hover: number | null,
  quality: readonly (PickQuality | null)[] | null,
  units: UnitSystem,
) {
  const dpr = window.devicePixelRatio || 1;
  canvas.width = Math.round(layout.width * dpr);
  canvas.height = Math.round(layout.height * dpr);
  const ctx = canvas.getContext("2d");
  if (!ctx) return;
  ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
  ctx.fillStyle = palette.card;
  ctx.fillRect(0, 0, layout.width, layout.height);
  const { margins } = layout;
  const plotW = layout.width - margins.left - margins.right;
  const plotH = layout.height - margins.top - margins.bottom;

  // Time grid and labels (ms).
  ctx.font = `11px ${chartFont}`;
  ctx.textAlign = "right";
  ctx.textBaseline = "middle";
  for (const t of timeTicks(layout.window, 8)) {
    const y = layout.timeY(t);
    ctx.strokeStyle = palette.rule;
    ctx.lineWidth = 0.6;
    ctx.beginPath();
    ctx.moveTo(margins.left, y);
    ctx.lineTo(layout.width - margins.right, y);
    ctx.stroke();
    ctx.fillStyle = palette.inkSoft;
    ctx.fillText(`${Number((t * 1000).toFixed(3))}`, margins.left - 6, y);
  }
  ctx.save();
  ctx.translate(12, margins.top + plotH / 2);
  ctx.rotate(-Math.PI / 2);
  ctx.textAlign = "center";
  ctx.fillStyle = palette.ink;
  ctx.fillText("time (ms)", 0, 0);
  ctx.restore();

  // Geophone positions along the top in the user's unit (named left of the row), thinned so
  // labels never overlap.
  ctx.textBaseline = "alphabetic";
  ctx.textAlign = "right";
  ctx.fillStyle = palette.ink;
  ctx.fillText(unitLabel("length", units), margins.left - 6, margins.top - 8);
  ctx.textAlign = "center";
  const every = Math.max(1, Math.ceil(34 / layout.spacing));
  placements.forEach((p, i) => {
    if (i % every !== 0 && i !== hover) return;
    ctx.fillStyle = i === hover ? palette.inkDeep : palette.inkSoft;
    ctx.fillText(
      `${lengthNumber(p.receiverPosition, units, 1)}`,
      layout.traceX(i),
      margins.top - 8,
    );
  });

  ctx.save();
  ctx.beginPath();
  ctx.rect(margins.left, margins.top, plotW, plotH);
  ctx.clip();
  const recordPeak =
    view.scaling === "record"
      ? record.traces.reduce((m, t) => Math.max(m, peakAmplitude(t.samples)), 0)
      : 0;
  record.traces.forEach((trace, i) => {
    const norm = view.scaling === "record" ? recordPeak : peakAmplitude(trace.samples);
    const paths = wigglePaths(
      trace.samples,
      { sampleInterval: trace.sampleInterval, delay: trace.delay },
      layout,
      i,
      { gain: view.gain * 0.5, clip: view.clip, norm },
    );
    if (i === hover) {
      ctx.fillStyle = "rgba(184,134,43,0.10)";
      ctx.fillRect(layout.traceX(i) - layout.spacing / 2, margins.top, layout.spacing, plotH);
    }
    if (view.mode !== "wiggle") {
      ctx.fillStyle = palette.ink;
      for (const fill of paths.fills) {
        ctx.beginPath();
        ctx.moveTo(fill[0], fill[1]);
        for (let k = 2; k < fill.length; k += 2) ctx.lineTo(fill[k], fill[k + 1]);
        ctx.closePath();
        ctx.fill();
      }
    }
    if (view.mode !== "area") {
      ctx.strokeStyle = palette.inkDeep;
      ctx.lineWidth = 0.7;
      ctx.beginPath();
      const line = paths.line;
      if (line.length >= 2) ctx.moveTo(line[0], line[1]);
      for (let k = 2; k < line.length; k += 2) ctx.lineTo(line[k], line[k + 1]);
      ctx.stroke();
    }
  });

  // Modelled first arrivals of the chosen model.
  if (modelled) {
    ctx.strokeStyle = palette.ochre;
    ctx.lineWidth = 2;
    ctx.setLineDash([6, 4]);
    ctx.beginPath();
    let started = false;
    modelled.forEach((t, i) => {
      if (t === null) {
        started = false;
        return;
      }
      const x = layout.traceX(i);
      const y = layout.timeY(t);
      if (!started) ctx.moveTo(x, y);
      else ctx.lineTo(x, y);
      started = true;
    });
    ctx.stroke();
    ctx.setLineDash([]);
  }

  // Picks; an automatic pick's quality: weak ones dashed with a ring, none marked × at the top.
  placements.forEach((p, i) => {
    const pick = findPick(picks, p.sourcePosition, p.receiverPosition);
    const q = quality?.[i] ?? null;
    const x = layout.traceX(i);
    if (!pick) {
      if (q === "none") {
        const y = margins.top + 8;
        ctx.strokeStyle = palette.brick;
        ctx.lineWidth = 2;
        ctx.beginPath();
        ctx.moveTo(x - 4, y - 4);
        ctx.lineTo(x + 4, y + 4);
        ctx.moveTo(x + 4, y - 4);
        ctx.lineTo(x - 4, y + 4);
        ctx.stroke();
      }
      return;
    }
    const y = layout.timeY(pick.time);
    const half = Math.max(3, Math.min(10, layout.spacing * 0.42));
    ctx.strokeStyle = PICK_COLOURS[pick.origin];
    ctx.lineWidth = 2.5;
    const weak = q === "weak" && pick.origin === "auto";
    if (weak) ctx.setLineDash([3, 2]);
    ctx.beginPath();
    ctx.moveTo(x - half, y);
    ctx.lineTo(x + half, y);
    ctx.stroke();
    ctx.setLineDash([]);
    if (weak) {
      ctx.strokeStyle = palette.ochre;
      ctx.lineWidth = 1.5;
      ctx.beginPath();
      ctx.arc(x, y, half + 2, 0, 2 * Math.PI);
      ctx.stroke();
    }
    if (pick.origin === "adjusted") {
      ctx.fillStyle = PICK_COLOURS.adjusted;
      ctx.beginPath();
      ctx.arc(x, y, 3, 0, 2 * Math.PI);
      ctx.fill();
    }
  });
  ctx.restore();
  ctx.strokeStyle = palette.inkSoft;
  ctx.lineWidth = 1;
  ctx.strokeRect(margins.left, margins.top, plotW, plotH);
}

/**
 * The record section of a SEG-2 shot record on a canvas: wiggle and variable area, gain, clip
 * and time zoom; picks drawn on each trace, the chosen model's first arrivals dashed. Clicking
 * sets the pick of the trace under the pointer at the nearest sample.
 */
export function RecordSection({
  record,
  placements,
  picks,
  modelled,
  modelName,
  view,
  onViewChange,
  onAdjust,
  editable,
  quality = null,
  units,
}: {
  record: Seg2Record;
  placements: TracePlacement[];
  picks: readonly FirstBreakPick[];
  /** Quality word of each trace's automatic pick (null where unknown). */
  quality?: readonly (PickQuality | null)[] | null;
  /** Modelled first arrival per trace, s (null where none). */
  modelled: (number | null)[] | null;
  modelName: string | null;
  view: SectionView;
  onViewChange: (view: SectionView) => void;
  onAdjust: (traceIndex: number, time: number) => void;
  editable: boolean;
  /** The user's display unit for geophone positions. */
  units: UnitSystem;
}) {
  const { ref, width } = useElementWidth<HTMLDivElement>(900);
  const canvasRef = useRef<HTMLCanvasElement | null>(null);
  const [hover, setHover] = useState<{ trace: number; time: number } | null>(null);
  const layout = useMemo(
    () =>
      sectionLayout({
        width,
        height: HEIGHT,
        traces: Math.max(1, record.traces.length),
        window: view.window,
      }),
    [width, record.traces.length, view.window],
  );

  useEffect(() => {
    if (canvasRef.current) {
      draw(
        canvasRef.current,
        layout,
        record,
        placements,
        picks,
        modelled,
        view,
        hover?.trace ?? null,
        quality,
        units,
      );
    }
  }, [layout, record, placements, picks, modelled, view, hover?.trace, quality, units]);

  const span = recordSpan(record);
  const target = (event: React.MouseEvent<HTMLCanvasElement>) => {
    const box = event.currentTarget.getBoundingClientRect();
    return pointerTarget(event.clientX - box.left, event.clientY - box.top, layout);
  };
  const hovered = hover ? placements[hover.trace] : null;
  const hoveredPick = hovered
    ? findPick(picks, hovered.sourcePosition, hovered.receiverPosition)
    : undefined;

  return (
    <div>
      <div ref={ref} className="relative w-full">
        <canvas
          ref={canvasRef}
          role="img"
          aria-label={`Record section: ${record.traces.length} traces from ${ms(view.window[0], 0)} to ${ms(view.window[1], 0)}${editable ? "; click a trace to set its first-break pick" : ""}`}
          data-testid="record-section"
          style={{
            width: `${width}px`,
            height: `${HEIGHT}px`,
            cursor: editable ? "crosshair" : "default",
          }}
          className="block rounded-md border border-rule"
          onMouseMove={(e) => setHover(target(e))}
          onMouseLeave={() => setHover(null)}
          onClick={(e) => {
            if (!editable) return;
            const t = target(e);
            if (!t) return;
            const trace = record.traces[t.trace];
            onAdjust(
              t.trace,
              snapToSample(
                t.time,
                { sampleInterval: trace.sampleInterval, delay: trace.delay },
                trace.samples.length,
              ),
            );
          }}
        />
      </div>
      {/* The readout is numbers (monospace); the helper sentence shown without a pointer is not. */}
      <p
        className={`mt-1 min-h-5 text-xs text-ink-soft ${hover && hovered ? "font-mono" : ""}`}
        aria-live="polite"
      >
        {hover && hovered
          ? `channel ${record.traces[hover.trace].channel ?? hover.trace + 1} · geophone ${length(hovered.receiverPosition, units)} · ${ms(hover.time, 2)}` +
            (hoveredPick
              ? ` · pick ${ms(hoveredPick.time, 2)} (${hoveredPick.origin}${quality?.[hover.trace] && hoveredPick.origin === "auto" ? `, ${quality[hover.trace]}` : ""})`
              : quality?.[hover.trace] === "none"
                ? " · no automatic pick"
                : "") +
            (modelled && modelled[hover.trace] !== null
              ? ` · ${modelName ?? "model"} ${ms(modelled[hover.trace], 2)}`
              : "")
          : editable
            ? "Click a trace to set its pick at that time."
            : "Your role may look at the picks but not change them."}
      </p>
      <SectionControls view={view} span={span} onChange={onViewChange} />
    </div>
  );
}

function SectionControls({
  view,
  span,
  onChange,
}: {
  view: SectionView;
  span: [number, number];
  onChange: (view: SectionView) => void;
}) {
  const centre = (view.window[0] + view.window[1]) / 2;
  return (
    <div className="mt-2 flex flex-wrap items-end gap-x-5 gap-y-3 text-sm">
      <label className="flex flex-col gap-1">
        <span className="font-medium text-ink">Display</span>
        <select
          className="field-input py-1"
          value={view.mode}
          onChange={(e) => onChange({ ...view, mode: e.target.value as DisplayMode })}
        >
          <option value="both">Wiggle and variable area</option>
          <option value="wiggle">Wiggle only</option>
          <option value="area">Variable area only</option>
        </select>
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-medium text-ink">Amplitude</span>
        <select
          className="field-input py-1"
          value={view.scaling}
          onChange={(e) => onChange({ ...view, scaling: e.target.value as Scaling })}
        >
          <option value="trace">Each trace to its own peak</option>
          <option value="record">True relative amplitude</option>
        </select>
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-medium text-ink">
          Gain{" "}
          <span className="font-mono text-ink-soft">
            ×{view.gain.toFixed(view.gain < 1 ? 2 : 1)}
          </span>
        </span>
        <input
          type="range"
          min={0}
          max={100}
          value={sliderFromGain(view.gain)}
          onChange={(e) => onChange({ ...view, gain: gainFromSlider(Number(e.target.value)) })}
          className="w-36 accent-[var(--color-ink)]"
        />
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-medium text-ink">
          Clip <span className="font-mono text-ink-soft">{view.clip.toFixed(2)} traces</span>
        </span>
        <input
          type="range"
          min={0.25}
          max={3}
          step={0.25}
          value={view.clip}
          onChange={(e) => onChange({ ...view, clip: Number(e.target.value) })}
          className="w-32 accent-[var(--color-ink)]"
        />
      </label>
      <div className="flex flex-col gap-1">
        <span className="font-medium text-ink">
          Time window{" "}
          <span className="font-mono text-ink-soft">
            {Number((view.window[0] * 1000).toFixed(1))}–
            {Number((view.window[1] * 1000).toFixed(1))} ms
          </span>
        </span>
        <div className="flex gap-1">
          <button
            type="button"
            className="rounded-md border border-ink-soft bg-card px-2.5 py-1 text-ink hover:bg-paper-deep"
            onClick={() =>
              onChange({ ...view, window: zoomWindow(view.window, 0.5, view.window[0], span) })
            }
          >
            Zoom in
          </button>
          <button
            type="button"
            className="rounded-md border border-ink-soft bg-card px-2.5 py-1 text-ink hover:bg-paper-deep"
            onClick={() => onChange({ ...view, window: zoomWindow(view.window, 2, centre, span) })}
          >
            Zoom out
          </button>
          <button
            type="button"
            className="rounded-md border border-ink-soft bg-card px-2.5 py-1 text-ink hover:bg-paper-deep"
            onClick={() => onChange({ ...view, window: span })}
          >
            Whole record
          </button>
          <button
            type="button"
            aria-label="Earlier"
            className="rounded-md border border-ink-soft bg-card px-2 py-1 text-ink hover:bg-paper-deep"
            onClick={() => {
              const w = view.window[1] - view.window[0];
              const start = Math.max(span[0], view.window[0] - w / 2);
              onChange({ ...view, window: [start, start + w] });
            }}
          >
            ↑
          </button>
          <button
            type="button"
            aria-label="Later"
            className="rounded-md border border-ink-soft bg-card px-2 py-1 text-ink hover:bg-paper-deep"
            onClick={() => {
              const w = view.window[1] - view.window[0];
              const start = Math.min(span[1] - w, view.window[0] + w / 2);
              onChange({ ...view, window: [start, start + w] });
            }}
          >
            ↓
          </button>
        </div>
      </div>
    </div>
  );
}
