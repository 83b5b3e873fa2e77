/**
 * Fonts of the PDF report. pdfkit embeds TrueType, OpenType and WOFF fonts but draws WOFF2
 * subsets as empty glyphs, so public/fonts ships the WOFF files of the faces the report uses
 * (IBM Plex Sans 400/500/600 and Mono 400, copied from the @fontsource packages) beside the
 * WOFF2 files the browser loads. They are read from public/fonts, or from dist/fonts (the
 * built client's copy); never from a dev dependency, so an install without dev dependencies
 * prints the same report. WOFF files are unpacked to plain sfnt once per process
 * (`unpackWoff`). When none is found the report falls back to pdfkit's built-in Helvetica and
 * Courier, and the server warns at start (`reportFontsMissing`).
 *
 * The Latin subsets hold U+0000–00FF, general punctuation and a few more; `pdfText` replaces the
 * handful of symbols the report would otherwise use (≤, σ, →, …) with plain equivalents so that
 * no glyph is ever missing, whichever font is in use.
 */
import { existsSync, readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { inflateSync } from "node:zlib";

export interface ReportFonts {
  regular: string;
  medium: string;
  bold: string;
  mono: string;
  /** "IBM Plex Sans" or "Helvetica (built-in)". */
  family: string;
  /** Font data to register with pdfkit, name → TrueType/OpenType bytes; empty for the built-in fonts. */
  files: Record<string, Buffer>;
}

const root = fileURLToPath(new URL("../../", import.meta.url));

function find(candidates: string[]): string | null {
  for (const c of candidates) {
    const path = root + c;
    if (existsSync(path)) return path;
  }
  return null;
}

function face(family: "sans" | "mono", weight: number): string | null {
  const base = `ibm-plex-${family}-latin-${weight}-normal`;
  return find([
    `public/fonts/${base}.ttf`,
    `public/fonts/${base}.otf`,
    `public/fonts/${base}.woff`,
    `dist/fonts/${base}.woff`,
  ]);
}

/**
 * Unpacks a WOFF 1.0 file (W3C WOFF File Format 1.0: a 44-byte header, 20-byte table entries
 * of tag, offset, compressed length, original length and checksum, zlib-compressed tables) into
 * the plain sfnt (TrueType/OpenType) it wraps. fontkit reads WOFF itself but inflates tables in
 * JavaScript on every access; unpacking once makes each report several times faster.
 * Anything that is not WOFF is returned unchanged.
 */
export function unpackWoff(data: Buffer): Buffer {
  if (data.length < 44 || data.toString("latin1", 0, 4) !== "wOFF") return data;
  const flavor = data.readUInt32BE(4);
  const count = data.readUInt16BE(12);
  const tables = Array.from({ length: count }, (_, i) => {
    const at = 44 + 20 * i;
    const offset = data.readUInt32BE(at + 4);
    const compressed = data.readUInt32BE(at + 8);
    const original = data.readUInt32BE(at + 12);
    const raw = data.subarray(offset, offset + compressed);
    return {
      tag: data.subarray(at, at + 4),
      checksum: data.readUInt32BE(at + 16),
      bytes: compressed < original ? inflateSync(raw) : raw,
    };
  });
  let searchRange = 1;
  let entrySelector = 0;
  while (searchRange * 2 <= count) {
    searchRange *= 2;
    entrySelector++;
  }
  const header = Buffer.alloc(12 + 16 * count);
  header.writeUInt32BE(flavor, 0);
  header.writeUInt16BE(count, 4);
  header.writeUInt16BE(searchRange * 16, 6);
  header.writeUInt16BE(entrySelector, 8);
  header.writeUInt16BE(count * 16 - searchRange * 16, 10);
  const parts: Buffer[] = [header];
  let offset = header.length;
  tables.forEach((t, i) => {
    const at = 12 + 16 * i;
    t.tag.copy(header, at);
    header.writeUInt32BE(t.checksum, at + 4);
    header.writeUInt32BE(offset, at + 8);
    header.writeUInt32BE(t.bytes.length, at + 12);
    const padded = Buffer.alloc((t.bytes.length + 3) & ~3);
    t.bytes.copy(padded);
    parts.push(padded);
    offset += padded.length;
  });
  return Buffer.concat(parts);
}

/** The report faces that cannot be found (empty when the report will use IBM Plex). */
export function reportFontsMissing(): string[] {
  const faces: [string, "sans" | "mono", number][] = [
    ["IBM Plex Sans 400", "sans", 400],
    ["IBM Plex Sans 500", "sans", 500],
    ["IBM Plex Sans 600", "sans", 600],
    ["IBM Plex Mono 400", "mono", 400],
  ];
  return faces.filter(([, family, weight]) => face(family, weight) === null).map(([n]) => n);
}

let cached: ReportFonts | null = null;

/** The fonts to use, resolved once per process. */
export function reportFonts(): ReportFonts {
  if (cached) return cached;
  const regular = face("sans", 400);
  const medium = face("sans", 500);
  const bold = face("sans", 600);
  const mono = face("mono", 400);
  cached =
    regular && medium && bold && mono
      ? {
          regular: "plex",
          medium: "plex-medium",
          bold: "plex-bold",
          mono: "plex-mono",
          family: "IBM Plex Sans",
          files: {
            plex: unpackWoff(readFileSync(regular)),
            "plex-medium": unpackWoff(readFileSync(medium)),
            "plex-bold": unpackWoff(readFileSync(bold)),
            "plex-mono": unpackWoff(readFileSync(mono)),
          },
        }
      : {
          regular: "Helvetica",
          medium: "Helvetica-Bold",
          bold: "Helvetica-Bold",
          mono: "Courier",
          family: "Helvetica (built-in)",
          files: {},
        };
  return cached;
}

const REPLACEMENTS: Record<string, string> = {
  "≤": "<=",
  "≥": ">=",
  "≈": "~",
  "→": "->",
  "←": "<-",
  σ: "sigma ",
  θ: "theta",
  φ: "phi",
  Δ: "delta ",
  "√": "sqrt",
  Σ: "sum ",
  "−": "-",
  "∞": "infinity",
  "✓": "yes",
  "✗": "no",
};

/**
 * Text safe for the report's fonts: the symbols above spelled out, any other character outside
 * Latin-1 and general punctuation replaced by "?".
 */
export function pdfText(text: string): string {
  let out = "";
  for (const ch of text) {
    const replacement = REPLACEMENTS[ch];
    if (replacement !== undefined) {
      out += replacement;
      continue;
    }
    const code = ch.codePointAt(0) ?? 63;
    const ok =
      (code >= 0x20 && code <= 0x7e) ||
      (code >= 0xa0 && code <= 0xff) ||
      code === 0x0a ||
      (code >= 0x2010 && code <= 0x2027) ||
      code === 0x20ac;
    out += ok ? ch : "?";
  }
  return out;
}
