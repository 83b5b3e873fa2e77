import { useState, type RefObject } from "react";
import { downloadPng, downloadSvg } from "@/lib/chart/export";
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
      if (kind === "svg") downloadSvg(svg, title);
      else await downloadPng(svg, title);
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
