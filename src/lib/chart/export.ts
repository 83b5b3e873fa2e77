/**
 * Export a chart drawn as SVG: the SVG text itself, or a PNG made by drawing the serialised
 * SVG onto a canvas (drawImage). Charts carry their colours and fonts as attributes, so the
 * exported file needs no stylesheet.
 */

const SVG_NS = "http://www.w3.org/2000/svg";

/** The SVG element as a standalone document (namespace, size and a paper background). */
export function serializeSvg(svg: SVGSVGElement, background = "#fbf8f1"): string {
  const clone = svg.cloneNode(true) as SVGSVGElement;
  clone.setAttribute("xmlns", SVG_NS);
  const width = svg.getAttribute("width") ?? String(svg.viewBox.baseVal?.width ?? 800);
  const height = svg.getAttribute("height") ?? String(svg.viewBox.baseVal?.height ?? 400);
  clone.setAttribute("width", width);
  clone.setAttribute("height", height);
  clone.querySelectorAll("[data-export-skip]").forEach((node) => node.remove());
  const rect = clone.ownerDocument.createElementNS(SVG_NS, "rect");
  rect.setAttribute("width", "100%");
  rect.setAttribute("height", "100%");
  rect.setAttribute("fill", background);
  clone.insertBefore(rect, clone.firstChild);
  return `<?xml version="1.0" encoding="UTF-8"?>\n${new XMLSerializer().serializeToString(clone)}`;
}

/** One legend entry of an exported chart: a colour swatch and its words. */
export interface ExportLegendItem {
  label: string;
  colour: string;
}

/**
 * The chart as a standalone document with its title above and its legend below (an exported
 * chart must say what it shows without the page around it).
 */
export function serializeFramedSvg(
  svg: SVGSVGElement,
  title: string,
  legend: readonly ExportLegendItem[],
  background = "#fbf8f1",
): string {
  const doc = svg.ownerDocument;
  const width = Number(svg.getAttribute("width") ?? svg.viewBox.baseVal?.width ?? 800);
  const height = Number(svg.getAttribute("height") ?? svg.viewBox.baseVal?.height ?? 400);
  const top = 30;
  // Lay the legend out in rows: a 18 px swatch, 6 px gap, about 6.5 px per character at 11 px.
  const items: Array<{ x: number; row: number; item: ExportLegendItem }> = [];
  let x = 12;
  let row = 0;
  for (const item of legend) {
    const w = 24 + item.label.length * 6.5 + 16;
    if (x + w > width - 12 && x > 12) {
      row += 1;
      x = 12;
    }
    items.push({ x, row, item });
    x += w;
  }
  const legendHeight = legend.length ? (row + 1) * 18 + 8 : 0;
  // createElementNS gives the namespace; the serialiser writes xmlns once.
  const root = doc.createElementNS(SVG_NS, "svg");
  root.setAttribute("width", String(width));
  root.setAttribute("height", String(top + height + legendHeight));
  const make = (tag: string, attrs: Record<string, string | number>, text?: string) => {
    const node = doc.createElementNS(SVG_NS, tag);
    for (const [k, v] of Object.entries(attrs)) node.setAttribute(k, String(v));
    if (text !== undefined) node.textContent = text;
    root.appendChild(node);
    return node;
  };
  make("rect", { width: "100%", height: "100%", fill: background });
  make(
    "text",
    {
      x: 12,
      y: 20,
      "font-size": 14,
      "font-weight": 600,
      fill: "#1d2b30",
      "font-family": "sans-serif",
    },
    title,
  );
  const chart = svg.cloneNode(true) as SVGSVGElement;
  chart.querySelectorAll("[data-export-skip]").forEach((node) => node.remove());
  chart.setAttribute("x", "0");
  chart.setAttribute("y", String(top));
  chart.setAttribute("width", String(width));
  chart.setAttribute("height", String(height));
  root.appendChild(chart);
  for (const { x: ix, row: r, item } of items) {
    const y = top + height + 8 + r * 18;
    make("rect", { x: ix, y: y + 5, width: 18, height: 4, rx: 2, fill: item.colour });
    make(
      "text",
      { x: ix + 24, y: y + 11, "font-size": 11, fill: "#4a5a5e", "font-family": "sans-serif" },
      item.label,
    );
  }
  return `<?xml version="1.0" encoding="UTF-8"?>\n${new XMLSerializer().serializeToString(root)}`;
}

/** A safe file name from a title: "Arrivals – Quarry Lane, shot 1" → "arrivals-quarry-lane-shot-1". */
export function fileNameFor(title: string): string {
  return (
    title
      .toLowerCase()
      .normalize("NFKD")
      .replace(/[^a-z0-9]+/g, "-")
      .replace(/^-+|-+$/g, "")
      .slice(0, 80) || "chart"
  );
}

function download(blob: Blob, fileName: string) {
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = fileName;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

export function downloadSvg(
  svg: SVGSVGElement,
  title: string,
  legend?: readonly ExportLegendItem[],
) {
  download(
    new Blob([legend ? serializeFramedSvg(svg, title, legend) : serializeSvg(svg)], {
      type: "image/svg+xml;charset=utf-8",
    }),
    `${fileNameFor(title)}.svg`,
  );
}

/** Draw the serialised SVG onto a canvas at `scale` × its size and encode it as PNG. */
export async function svgToPng(
  svgText: string,
  width: number,
  height: number,
  scale = 2,
): Promise<Blob> {
  const url = URL.createObjectURL(new Blob([svgText], { type: "image/svg+xml;charset=utf-8" }));
  try {
    const image = new Image();
    image.decoding = "async";
    const loaded = new Promise<void>((resolve, reject) => {
      image.onload = () => resolve();
      image.onerror = () => reject(new Error("The chart could not be drawn as an image."));
    });
    image.src = url;
    await loaded;
    const canvas = document.createElement("canvas");
    canvas.width = Math.round(width * scale);
    canvas.height = Math.round(height * scale);
    const context = canvas.getContext("2d");
    if (!context) throw new Error("This browser cannot draw on a canvas.");
    context.scale(scale, scale);
    context.drawImage(image, 0, 0, width, height);
    return await new Promise<Blob>((resolve, reject) =>
      canvas.toBlob(
        (blob) => (blob ? resolve(blob) : reject(new Error("The PNG could not be encoded."))),
        "image/png",
      ),
    );
  } finally {
    URL.revokeObjectURL(url);
  }
}

export async function downloadPng(
  svg: SVGSVGElement,
  title: string,
  legend?: readonly ExportLegendItem[],
) {
  const width = Number(svg.getAttribute("width")) || svg.viewBox.baseVal?.width || 800;
  let height = Number(svg.getAttribute("height")) || svg.viewBox.baseVal?.height || 400;
  let text = serializeSvg(svg);
  if (legend) {
    text = serializeFramedSvg(svg, title, legend);
    // The framed document is taller: its root's height is the first one written.
    height = Number(/<svg[^>]*?\sheight="([\d.]+)"/.exec(text)?.[1]) || height;
  }
  const blob = await svgToPng(text, width, height);
  download(blob, `${fileNameFor(title)}.png`);
}
