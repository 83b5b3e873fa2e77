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

export function downloadSvg(svg: SVGSVGElement, title: string) {
  download(
    new Blob([serializeSvg(svg)], { type: "image/svg+xml;charset=utf-8" }),
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

export async function downloadPng(svg: SVGSVGElement, title: string) {
  const width = Number(svg.getAttribute("width")) || svg.viewBox.baseVal?.width || 800;
  const height = Number(svg.getAttribute("height")) || svg.viewBox.baseVal?.height || 400;
  const blob = await svgToPng(serializeSvg(svg), width, height);
  download(blob, `${fileNameFor(title)}.png`);
}
