/**
 * Fonts of the PDF report. pdfkit embeds TrueType, OpenType and WOFF fonts but draws WOFF2
 * subsets as empty glyphs, and public/fonts ships only WOFF2 (for the browser). The report
 * therefore embeds IBM Plex Sans and Mono from the WOFF files of the @fontsource packages the
 * client build installs, looking first in public/fonts for a .ttf/.otf/.woff of the same face.
 * When none is found it falls back to pdfkit's built-in Helvetica and Courier.
 *
 * The Latin subsets hold U+0000–00FF, general punctuation and a few more; `pdfText` replaces the
 * handful of symbols the report would otherwise use (≤, σ, →, …) with plain equivalents so that
 * no glyph is ever missing, whichever font is in use.
 */
import { existsSync } from "node:fs";
import { fileURLToPath } from "node:url";

export interface ReportFonts {
  regular: string;
  medium: string;
  bold: string;
  mono: string;
  /** "IBM Plex Sans" or "Helvetica (built-in)". */
  family: string;
  /** Files to register with pdfkit, name → path; empty for the built-in fonts. */
  files: Record<string, string>;
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
    `node_modules/@fontsource/ibm-plex-${family}/files/${base}.woff`,
  ]);
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
          files: { plex: regular, "plex-medium": medium, "plex-bold": bold, "plex-mono": mono },
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
