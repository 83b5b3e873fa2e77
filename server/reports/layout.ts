/**
 * A thin writer over a pdfkit document: headings that also become PDF bookmarks, paragraphs,
 * key–value lists and tables that break across pages, with Spreadsight's colours.
 */
import type PDFDocument from "pdfkit";
import { toDisplay, unitLabel, type UnitSystem } from "@/lib/units";
import { pdfText, type ReportFonts } from "./fonts";

type Doc = InstanceType<typeof PDFDocument>;

/** Print colours: Spreadsight's palette (src/lib/chart/palette.ts) on white paper. */
export const ink = {
  deep: "#0b2f30",
  ink: "#12484a",
  soft: "#3f6b6c",
  faint: "#7c9697",
  rule: "#d6cab2",
  paper: "#f4eee2",
  paperDeep: "#e9e0cd",
  ochre: "#b8862b",
  ochreSoft: "#f3e3bf",
  brick: "#9c3b2c",
  brickSoft: "#f2d6cf",
  moss: "#4f7a3a",
  mossSoft: "#dce9cf",
} as const;

/**
 * How the report writes lengths and velocities for its reader (stored values are SI): the
 * unit names for column heads and the numbers converted. Times stay in ms in both systems.
 */
export interface ReportUnits {
  system: UnitSystem;
  /** "m" or "ft". */
  length: string;
  /** "m/s" or "ft/s". */
  velocity: string;
  /** A length (m) as a number in the reader's unit, trailing zeros trimmed; "–" when unknown. */
  len(v: number | null | undefined, digits?: number): string;
  /** A length with its unit: "3 m", "9.84 ft". */
  lenU(v: number | null | undefined, digits?: number): string;
  /** A velocity (m/s) as a whole number in the reader's unit; "–" when unknown. */
  vel(v: number | null | undefined): string;
  /** A velocity with its unit: "1500 m/s", "4921 ft/s". */
  velU(v: number | null | undefined): string;
  /** A message of the engine (SI figures) with its lengths and velocities in the reader's unit. */
  text(message: string): string;
}

const trimmed = (v: number | null | undefined, digits: number): string => {
  if (v === null || v === undefined || !Number.isFinite(v)) return "–";
  const n = Number(v.toFixed(digits));
  return String(n === 0 ? 0 : n);
};

/**
 * The report's units for a reader: lengths to 0.01 m or 0.01 ft (a pegging-out precision,
 * common practice), velocities whole. Defaults to metric.
 */
export function reportUnits(system: UnitSystem = "metric"): ReportUnits {
  const length = unitLabel("length", system);
  const velocity = unitLabel("velocity", system);
  const len = (v: number | null | undefined, digits = 2) =>
    trimmed(v === null || v === undefined ? v : toDisplay("length", v, system), digits);
  const vel = (v: number | null | undefined) =>
    trimmed(v === null || v === undefined ? v : toDisplay("velocity", v, system), 0);
  return {
    system,
    length,
    velocity,
    len,
    lenU: (v, digits) => {
      const text = len(v, digits);
      return text === "–" ? text : `${text} ${length}`;
    },
    vel,
    velU: (v) => {
      const text = vel(v);
      return text === "–" ? text : `${text} ${velocity}`;
    },
    // "18 m (19.25 m offset)" → "59.1 ft (63.16 ft offset)": the SI figure replaced, not
    // doubled, with the message's own decimals (at least one, a foot being a third of a metre;
    // the Review screen's rule): a sentence's "29.3 m" reads "96.1 ft", not a "96.13 ft" that
    // disagrees with the exact 96.08 ft printed beside it.
    text: (message) =>
      system === "metric"
        ? message
        : message.replace(
            /(-?\d+(?:\.(\d+))?) (m\/s|m)\b/g,
            (_, value: string, decimals: string | undefined, unit: string) =>
              unit === "m/s"
                ? `${vel(Number(value))} ${velocity}`
                : `${len(Number(value), Math.max(decimals?.length ?? 0, 1))} ${length}`,
          ),
  };
}

export interface Column {
  header: string;
  width: number;
  align?: "left" | "right" | "center";
}

export interface Cell {
  text: string;
  color?: string;
  bold?: boolean;
}

export class ReportWriter {
  readonly left: number;
  readonly width: number;
  private sectionNumber = 0;

  constructor(
    readonly doc: Doc,
    readonly fonts: ReportFonts,
  ) {
    this.left = doc.page.margins.left;
    this.width = doc.page.width - doc.page.margins.left - doc.page.margins.right;
  }

  get y(): number {
    return this.doc.y;
  }

  get bottom(): number {
    return this.doc.page.height - this.doc.page.margins.bottom;
  }

  /** Starts a new page unless `height` points still fit on this one. */
  ensureSpace(height: number): void {
    if (this.doc.y + height > this.bottom) this.doc.addPage();
  }

  /** A numbered section heading, also a bookmark in the PDF outline. */
  /** `keep` is the space the first content under the heading needs (kept on the same page). */
  heading(title: string, keep = 60): void {
    this.ensureSpace(keep + 40);
    this.sectionNumber += 1;
    const text = `${this.sectionNumber}  ${title}`;
    this.doc.moveDown(0.6);
    const y = this.doc.y;
    this.doc
      .font(this.fonts.bold)
      .fontSize(14)
      .fillColor(ink.ink)
      .text(pdfText(text), this.left, y, { width: this.width });
    this.doc.outline.addItem(pdfText(title));
    const lineY = this.doc.y + 2;
    this.doc
      .moveTo(this.left, lineY)
      .lineTo(this.left + this.width, lineY)
      .lineWidth(0.6)
      .strokeColor(ink.rule)
      .stroke();
    this.doc.y = lineY + 8;
  }

  subheading(title: string, keep = 40): void {
    this.ensureSpace(keep + 20);
    this.doc.moveDown(0.3);
    this.doc
      .font(this.fonts.medium)
      .fontSize(11)
      .fillColor(ink.deep)
      .text(pdfText(title), this.left, this.doc.y, { width: this.width });
    this.doc.moveDown(0.25);
  }

  paragraph(text: string, options: { color?: string; size?: number; italic?: boolean } = {}): void {
    const size = options.size ?? 9.5;
    this.doc.font(this.fonts.regular).fontSize(size);
    const height = this.doc.heightOfString(pdfText(text), { width: this.width, lineGap: 1.5 });
    this.ensureSpace(Math.min(height, 60));
    this.doc
      .fillColor(options.color ?? ink.deep)
      .text(pdfText(text), this.left, this.doc.y, { width: this.width, lineGap: 1.5 });
    this.doc.moveDown(0.4);
  }

  /** A boxed note: tone "caution" (ochre), "hidden" (brick), "ok" (moss) or "plain". */
  callout(text: string, tone: "caution" | "hidden" | "ok" | "plain" = "plain"): void {
    const [fill, stroke] =
      tone === "caution"
        ? [ink.ochreSoft, ink.ochre]
        : tone === "hidden"
          ? [ink.brickSoft, ink.brick]
          : tone === "ok"
            ? [ink.mossSoft, ink.moss]
            : [ink.paper, ink.rule];
    const pad = 7;
    this.doc.font(this.fonts.regular).fontSize(9.5);
    const height =
      this.doc.heightOfString(pdfText(text), { width: this.width - 2 * pad, lineGap: 1.5 }) +
      2 * pad;
    this.ensureSpace(height + 6);
    const y = this.doc.y;
    this.doc.save();
    this.doc.rect(this.left, y, this.width, height).fill(fill);
    this.doc.rect(this.left, y, 3, height).fill(stroke);
    this.doc.restore();
    this.doc.fillColor(ink.deep).text(pdfText(text), this.left + pad + 2, y + pad, {
      width: this.width - 2 * pad,
      lineGap: 1.5,
    });
    this.doc.y = y + height + 6;
  }

  /** Label–value pairs in two columns. */
  facts(pairs: [string, string][], labelWidth = 130): void {
    for (const [label, value] of pairs) {
      this.doc.font(this.fonts.regular).fontSize(9.5);
      const h = Math.max(
        this.doc.heightOfString(pdfText(value), { width: this.width - labelWidth }),
        this.doc.heightOfString(pdfText(label), { width: labelWidth - 8 }),
      );
      this.ensureSpace(h + 2);
      const y = this.doc.y;
      this.doc.fillColor(ink.soft).text(pdfText(label), this.left, y, { width: labelWidth - 8 });
      this.doc
        .fillColor(ink.deep)
        .text(pdfText(value), this.left + labelWidth, y, { width: this.width - labelWidth });
      this.doc.y = Math.max(this.doc.y, y + h) + 2;
    }
    this.doc.moveDown(0.3);
  }

  /** A table with a header row that repeats after a page break. */
  table(columns: Column[], rows: (string | Cell)[][]): void {
    const total = columns.reduce((s, c) => s + c.width, 0);
    const scale = this.width / total;
    const widths = columns.map((c) => c.width * scale);
    const pad = 3;
    const size = 8.5;
    const drawHeader = () => {
      const y = this.doc.y;
      this.doc.font(this.fonts.medium).fontSize(size);
      const h =
        Math.max(
          ...columns.map((c, i) =>
            this.doc.heightOfString(pdfText(c.header), { width: widths[i] - 2 * pad }),
          ),
        ) +
        2 * pad;
      this.doc.rect(this.left, y, this.width, h).fill(ink.paperDeep);
      let x = this.left;
      columns.forEach((c, i) => {
        this.doc.fillColor(ink.ink).text(pdfText(c.header), x + pad, y + pad, {
          width: widths[i] - 2 * pad,
          align: c.align ?? "left",
        });
        x += widths[i];
      });
      this.doc.y = y + h;
    };
    this.ensureSpace(40);
    drawHeader();
    rows.forEach((row, r) => {
      const cells = row.map((c) => (typeof c === "string" ? { text: c } : c));
      const heights = cells.map((c, i) => {
        this.doc.font(c.bold ? this.fonts.medium : this.fonts.regular).fontSize(size);
        return this.doc.heightOfString(pdfText(c.text || " "), { width: widths[i] - 2 * pad });
      });
      const h = Math.max(...heights) + 2 * pad;
      if (this.doc.y + h > this.bottom) {
        this.doc.addPage();
        drawHeader();
      }
      const y = this.doc.y;
      if (r % 2 === 1) this.doc.rect(this.left, y, this.width, h).fill(ink.paper);
      let x = this.left;
      cells.forEach((c, i) => {
        this.doc
          .font(c.bold ? this.fonts.medium : this.fonts.regular)
          .fontSize(size)
          .fillColor(c.color ?? ink.deep)
          .text(pdfText(c.text), x + pad, y + pad, {
            width: widths[i] - 2 * pad,
            align: columns[i].align ?? "left",
          });
        x += widths[i];
      });
      this.doc.y = y + h;
    });
    this.doc
      .moveTo(this.left, this.doc.y)
      .lineTo(this.left + this.width, this.doc.y)
      .lineWidth(0.5)
      .strokeColor(ink.rule)
      .stroke();
    this.doc.moveDown(0.6);
  }
}
