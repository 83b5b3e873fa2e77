import { useState, type RefObject } from "react";
import { downloadPng, downloadSvg, type ExportLegendItem } from "@/lib/chart/export";
import { errorMessage } from "@/lib/api-client";

/** "Export SVG" and "Export PNG" for a chart drawn as SVG. */
export function ExportButtons({
  svgRef,
  title,
}: {
  svgRef: RefObject<SVGSVGElement | null>;
  title: string;
}) {
  const [error, setError] = useState<string | null>(null);
  const run = async (kind: "svg" | "png") => {
    const svg = svgRef.current;
    if (!svg) return;
    setError(null);
    try {
      // The chart's own legend (the list beside it) goes into the file under the title.
      const legend = legendNear(svg);
      if (kind === "svg") downloadSvg(svg, title, legend);
      else await downloadPng(svg, title, legend);
    } catch (e) {
      setError(errorMessage(e));
    }
  };
  const cls =
    "rounded-md border border-rule bg-card px-2.5 py-1 text-xs font-medium text-ink hover:bg-paper-deep";
  return (
    <div className="flex items-center gap-1.5">
      <button type="button" className={cls} onClick={() => run("svg")}>
        Export SVG
      </button>
      <button type="button" className={cls} onClick={() => run("png")}>
        Export PNG
      </button>
      {error ? (
        <span role="alert" className="text-xs text-brick">
          {error}
        </span>
      ) : null}
    </div>
  );
}

/**
 * The legend entries shown with a chart: the items of the nearest `ul[aria-label="Legend"]`
 * in the chart's figure, each with the colour of its swatch.
 */
export function legendNear(svg: SVGSVGElement): ExportLegendItem[] {
  const list = (svg.closest("figure") ?? svg.closest("section"))?.querySelector(
    'ul[aria-label="Legend"]',
  );
  if (!list) return [];
  return Array.from(list.querySelectorAll(":scope > li")).map((li) => {
    const swatch = li.querySelector("span") as HTMLElement | null;
    const colour =
      swatch?.style.background || swatch?.style.borderColor || swatch?.style.backgroundColor;
    return { label: (li.textContent ?? "").trim(), colour: colour || "#4a5a5e" };
  });
}
