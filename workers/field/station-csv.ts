/**
 * Station layout for the field crew: every geophone and shot station of a plan's spread with
 * its position along the line, as rows and as CSV text.
 *
 * A roll-along line (`spread.rollAlong`, workers/engine/roll-along.ts) lists one geophone row
 * per station of the whole line (continuous numbers 1…stations) with the spreads that record
 * it and its channel on each, then one shot row per spread and shot it records, with that
 * spread; the CSV then has two more columns, `spread` and `channel`, at the end.
 */
import Papa from "papaparse";
import { rollAlongLayout, spreadSchema, type Spread } from "@engine";

/** One station to peg out. */
export interface StationRow {
  kind: "geophone" | "shot";
  /** Geophone channel number (1…channels) or shot number (1…shots), in plan order. */
  number: number;
  /** "G1"…, or the shot's label from the plan ("S1"… when it has none). */
  label: string;
  /** Position along the line, m. */
  position: number;
  /**
   * Roll-along only: the spreads (1-based) that record this station, in order along the line
   * (two where neighbouring spreads overlap); for a shot, the one spread it is fired for.
   */
  spreads?: number[];
  /** Roll-along only: a geophone station's channel on each of `spreads` (same order); [] for a shot. */
  channels?: number[];
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
  if (s.rollAlong) return lineLayout(s);
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
 * A roll-along line: station n (1…stations) at firstGeophone + (n − 1)·spacing, recorded by
 * spread k on channel n − (k − 1)·step; then for each spread its shots in plan order, numbered
 * as in the plan (so a shot repeated on every spread keeps its number).
 */
function lineLayout(s: Spread): StationRow[] {
  const line = rollAlongLayout(s);
  const rows: StationRow[] = [];
  for (let n = 1; n <= line.stations; n++) {
    const on = line.spreads.filter((p) => p.firstStation <= n && n <= p.lastStation);
    rows.push({
      kind: "geophone",
      number: n,
      label: `G${n}`,
      position: metres(s.firstGeophone + (n - 1) * s.spacing),
      spreads: on.map((p) => p.index),
      channels: on.map((p) => n - p.firstStation + 1),
    });
  }
  for (const part of line.spreads) {
    for (const shot of part.shots) {
      rows.push({
        kind: "shot",
        number: shot.planShot + 1,
        label: shot.label,
        position: metres(shot.position),
        spreads: [part.index],
        channels: [],
      });
    }
  }
  return rows;
}

/**
 * The station layout as CSV with the header `kind,number,label,position_m` and CRLF line
 * ends (RFC 4180), ready for a spreadsheet or a survey controller. A roll-along line adds the
 * columns `spread,channel`: a station shared by two spreads reads e.g. `1;2` and `24;1`
 * (channel 24 of spread 1 and channel 1 of spread 2); a shot row names its spread and leaves
 * `channel` empty.
 * @throws RangeError when the spread does not satisfy the plan schema
 */
export function stationLayoutCsv(spread: Spread): string {
  const rows = stationLayout(spread);
  const rolled = rows.some((r) => r.spreads);
  const fields = ["kind", "number", "label", "position_m"];
  return (
    Papa.unparse(
      {
        fields: rolled ? [...fields, "spread", "channel"] : fields,
        data: rows.map((r) =>
          rolled
            ? [
                r.kind,
                r.number,
                r.label,
                r.position,
                (r.spreads ?? []).join(";"),
                (r.channels ?? []).join(";"),
              ]
            : [r.kind, r.number, r.label, r.position],
        ),
      },
      { newline: "\r\n", escapeFormulae: true },
    ) + "\r\n"
  );
}
