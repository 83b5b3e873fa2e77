/**
 * Station layout for the field crew: every geophone and shot station of a plan's spread with
 * its position along the line, as rows and as CSV text.
 */
import Papa from "papaparse";
import { spreadSchema, type Spread } from "@engine";

/** One station to peg out. */
export interface StationRow {
  kind: "geophone" | "shot";
  /** Geophone channel number (1…channels) or shot number (1…shots), in plan order. */
  number: number;
  /** "G1"…, or the shot's label from the plan ("S1"… when it has none). */
  label: string;
  /** Position along the line, m. */
  position: number;
}

/** Rounds to the millimetre and avoids "-0". */
function metres(v: number): number {
  const r = Math.round(v * 1000) / 1000;
  return r === 0 ? 0 : r;
}

/**
 * Lists the stations of a spread: geophones at firstGeophone + (k − 1)·spacing for
 * k = 1…channels, then the shots in plan order.
 * @throws RangeError when the spread does not satisfy the plan schema
 */
export function stationLayout(spread: Spread): StationRow[] {
  const checked = spreadSchema.safeParse(spread);
  if (!checked.success) {
    throw new RangeError(
      `invalid spread: ${checked.error.issues.map((i) => `${i.path.join(".") || "spread"}: ${i.message}`).join("; ")}`,
    );
  }
  const s = checked.data;
  const rows: StationRow[] = [];
  for (let k = 1; k <= s.channels; k++) {
    rows.push({
      kind: "geophone",
      number: k,
      label: `G${k}`,
      position: metres(s.firstGeophone + (k - 1) * s.spacing),
    });
  }
  s.shots.forEach((shot, i) => {
    rows.push({
      kind: "shot",
      number: i + 1,
      label: shot.label || `S${i + 1}`,
      position: metres(shot.position),
    });
  });
  return rows;
}

/**
 * The station layout as CSV with the header `kind,number,label,position_m` and CRLF line
 * ends (RFC 4180), ready for a spreadsheet or a survey controller.
 * @throws RangeError when the spread does not satisfy the plan schema
 */
export function stationLayoutCsv(spread: Spread): string {
  const rows = stationLayout(spread);
  return (
    Papa.unparse(
      {
        fields: ["kind", "number", "label", "position_m"],
        data: rows.map((r) => [r.kind, r.number, r.label, r.position]),
      },
      { newline: "\r\n", escapeFormulae: true },
    ) + "\r\n"
  );
}
