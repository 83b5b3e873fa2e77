import { useId, useState } from "react";
import { formatQuantity, fromDisplay, unitLabel, type UnitSystem } from "@/lib/units";
import type { SectionDraft } from "../../lib/plan-form";
import {
  ImportProblem,
  basesFromBoreholes,
  parseBoreholeCsv,
  parseSurfaceCsv,
  type Borehole,
} from "../../lib/section-import";
import { lineAt } from "../../lib/section-view";

/**
 * Imports into a section: the surface from a levelling or GNSS CSV (position,elevation; or
 * easting,northing,elevation projected onto the line through the file's first and last
 * points or two points the user gives), and the layer bases from boreholes along the line.
 */
export function SectionImport({
  draft,
  units,
  onSurface,
  onBases,
}: {
  draft: SectionDraft;
  units: UnitSystem;
  onSurface: (surface: [number, number][]) => void;
  onBases: (bases: [number, number][][], boreholes: Borehole[]) => void;
}) {
  const id = useId();
  const h = unitLabel("length", units);
  const scale = fromDisplay("length", 1, units);
  const [given, setGiven] = useState(false);
  const [line, setLine] = useState({ ae: "", an: "", be: "", bn: "", start: "0" });
  const [message, setMessage] = useState<{ tone: "ok" | "error"; text: string } | null>(null);

  const readSurface = async (file: File) => {
    try {
      const num = (s: string, what: string) => {
        const v = Number(s);
        if (s.trim() === "" || !Number.isFinite(v))
          throw new ImportProblem(`${what} of the line must be a number`);
        return v * scale;
      };
      const lineGiven = given
        ? {
            a: {
              easting: num(line.ae, "the first point's easting"),
              northing: num(line.an, "the first point's northing"),
            },
            b: {
              easting: num(line.be, "the second point's easting"),
              northing: num(line.bn, "the second point's northing"),
            },
          }
        : null;
      const imported = parseSurfaceCsv(await file.text(), {
        scale,
        line: lineGiven,
        start: num(line.start || "0", "the start position"),
      });
      onSurface(imported.points);
      const how =
        imported.mode === "along"
          ? "read as position and elevation along the line"
          : `projected onto the line through ${imported.line === "given" ? "the two points you gave" : "the file's first and last points"}; the farthest point is ${formatQuantity("length", imported.largestOffset, units)} off the line`;
      setMessage({
        tone: "ok",
        text: `Surface: ${imported.points.length} points from ${file.name}, ${how}. Check that every base still lies below it.`,
      });
    } catch (error) {
      setMessage({ tone: "error", text: `${file.name}: ${problemText(error)}` });
    }
  };

  const readBoreholes = async (file: File) => {
    try {
      const logs = parseBoreholeCsv(await file.text(), scale);
      const from = draft.surface[0][0];
      const to = draft.surface[draft.surface.length - 1][0];
      const outside = logs.find((b) => b.position < from || b.position > to);
      if (outside)
        throw new ImportProblem(
          `borehole ${outside.name} at ${formatQuantity("length", outside.position, units)} stands beyond the section's surface (${formatQuantity("length", from, units)} to ${formatQuantity("length", to, units)}); extend the surface first`,
        );
      const bases = basesFromBoreholes(logs, (x) => lineAt(draft.surface, x), from, to);
      const used = Math.min(bases.length, draft.layers.length - 1);
      onBases(bases, logs);
      setMessage({
        tone: "ok",
        text: `Boreholes: ${logs.map((b) => `${b.name} at ${formatQuantity("length", b.position, units)}`).join(", ")}; the bases of ${used} layer${used === 1 ? "" : "s"} are interpolated linearly between them and kept level beyond.${bases.length > used ? ` The file logs ${bases.length} bases; add layers to use the rest.` : ""} The boreholes are kept with the plan when you save (replacing any stored before).`,
      });
    } catch (error) {
      setMessage({ tone: "error", text: `${file.name}: ${problemText(error)}` });
    }
  };

  return (
    <details className="mt-4 rounded-md border border-rule px-3 py-2 text-sm">
      <summary className="cursor-pointer font-semibold text-ink-deep">
        Import from survey files
      </summary>
      <div className="mt-2 grid gap-4 md:grid-cols-2">
        <div>
          <label htmlFor={`${id}-surface`} className="font-medium text-ink-deep">
            Surface from a levelling or GNSS file (CSV, {h})
          </label>
          <p className="text-xs text-ink-soft">
            Columns <span className="font-mono">position,elevation</span>, or{" "}
            <span className="font-mono">easting,northing,elevation</span> projected onto the line.
          </p>
          <fieldset className="mt-1 text-xs text-ink">
            <legend className="sr-only">Line for map coordinates</legend>
            <label className="mr-3 inline-flex items-center gap-1">
              <input type="radio" checked={!given} onChange={() => setGiven(false)} /> line through
              the file&apos;s first and last points
            </label>
            <label className="inline-flex items-center gap-1">
              <input type="radio" checked={given} onChange={() => setGiven(true)} /> line through
              two points I give
            </label>
          </fieldset>
          {given ? (
            <div className="mt-1 grid grid-cols-2 gap-1 text-xs">
              {(
                [
                  ["ae", "First point easting"],
                  ["an", "First point northing"],
                  ["be", "Second point easting"],
                  ["bn", "Second point northing"],
                ] as const
              ).map(([key, label]) => (
                <input
                  key={key}
                  aria-label={`${label} (${h})`}
                  placeholder={label.toLowerCase()}
                  className="field-input px-2! py-1! font-mono text-xs!"
                  value={line[key]}
                  onChange={(e) => setLine({ ...line, [key]: e.target.value })}
                />
              ))}
            </div>
          ) : null}
          <label className="mt-1 flex items-center gap-2 text-xs text-ink">
            Position of the line&apos;s first point ({h})
            <input
              className="field-input w-20! px-2! py-1! font-mono text-xs!"
              value={line.start}
              onChange={(e) => setLine({ ...line, start: e.target.value })}
            />
          </label>
          <input
            id={`${id}-surface`}
            type="file"
            accept=".csv,.txt,text/csv"
            className="mt-2 block text-xs"
            onChange={(e) => {
              const file = e.target.files?.[0];
              if (file) void readSurface(file);
              e.target.value = "";
            }}
          />
        </div>
        <div>
          <label htmlFor={`${id}-boreholes`} className="font-medium text-ink-deep">
            Layer bases from boreholes (CSV, {h})
          </label>
          <p className="text-xs text-ink-soft">
            One row per borehole: <span className="font-mono">name,position,depth1,depth2,…</span> —
            the depth below the ground of the base of layer 1, 2, … (blank: the layer is absent
            there). Bases are interpolated linearly between boreholes; the boreholes are kept with
            the plan.
          </p>
          <input
            id={`${id}-boreholes`}
            type="file"
            accept=".csv,.txt,text/csv"
            className="mt-2 block text-xs"
            onChange={(e) => {
              const file = e.target.files?.[0];
              if (file) void readBoreholes(file);
              e.target.value = "";
            }}
          />
        </div>
      </div>
      {message ? (
        <p
          role={message.tone === "error" ? "alert" : "status"}
          className={`mt-2 text-xs font-medium ${message.tone === "error" ? "text-brick" : "text-moss"}`}
        >
          {message.text}
        </p>
      ) : null}
    </details>
  );
}

function problemText(error: unknown): string {
  if (error instanceof ImportProblem) return error.message;
  return error instanceof Error ? error.message : String(error);
}
