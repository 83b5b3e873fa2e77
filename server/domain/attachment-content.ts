/**
 * The content check of an uploaded file: a borehole or picks CSV is parsed, a SEG-2 record is
 * read, and what was found is summarised (facts). Pure: no database, so the worker-thread
 * pool (server/workers) runs it off the event loop.
 */
import type {
  AttachmentFacts,
  AttachmentFields,
  AttachmentKind,
  AttachmentUploadResponse,
  FirstBreakPick,
} from "@/contracts/field";
import { MATERIALS } from "@engine";
import {
  boreholeModelName,
  parseBoreholeCsv,
  parsePicksCsv,
  readSeg2,
  Seg2Error,
  type CsvIssue,
} from "../../workers/field/index";
import { AppError } from "./errors";

/** What the check needs of an uploaded file. */
export interface ContentFile {
  originalname: string;
  buffer: Buffer;
}

/** A file name safe to store and to send back in Content-Disposition. */
export function cleanFileName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? "";
  const clean = Array.from(base.normalize("NFC"))
    .filter((ch) => {
      const code = ch.codePointAt(0) ?? 0;
      return code >= 0x20 && code !== 0x7f && ch !== '"';
    })
    .join("")
    .trim()
    .slice(0, 200);
  return clean || "upload";
}

function csvError(kind: AttachmentKind, issues: CsvIssue[]): AppError {
  const messages = issues.map((i) => i.message);
  const more = messages.length > 1 ? ` (and ${messages.length - 1} more)` : "";
  return new AppError(
    422,
    "invalid_csv",
    `the ${kind === "picks" ? "picks" : "borehole log"} CSV has problems: ${messages[0]}${more}`,
    { file: messages },
  );
}

/**
 * Most lines a CSV upload may have. A borehole log or a picks file of a survey has hundreds
 * to a few tens of thousands (500 shots × 96 channels is 48,000 picks); a file with more is
 * refused before it is parsed, so a hostile one-value-per-line file cannot fill memory.
 */
export const MAX_CSV_LINES = 60_000;

/** Counts line breaks without building strings. */
function lineCount(buffer: Buffer): number {
  let lines = 1;
  let at = buffer.indexOf(10);
  while (at >= 0) {
    lines++;
    at = buffer.indexOf(10, at + 1);
  }
  return lines;
}

/** The text of a CSV upload: UTF-8 (a BOM is allowed), not binary, at most MAX_CSV_LINES lines. */
export function csvText(buffer: Buffer): string {
  const nul = buffer.indexOf(0);
  if (nul >= 0) {
    const message = `byte ${nul}: a text file holds no NUL bytes; this looks like a binary file`;
    throw new AppError(415, "unsupported_file_type", message, { file: [message] });
  }
  const lines = lineCount(buffer);
  if (lines > MAX_CSV_LINES) {
    const message = `the file has ${lines.toLocaleString("en")} lines; a CSV upload may have at most ${MAX_CSV_LINES.toLocaleString("en")}`;
    throw new AppError(422, "invalid_csv", message, { file: [message] });
  }
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(buffer);
  } catch {
    const message = "the file is not UTF-8 text; save the CSV as UTF-8";
    throw new AppError(422, "invalid_csv", message, { file: [message] });
  }
}

/** What the check found. */
export interface CheckedContent {
  facts: AttachmentFacts;
  model?: AttachmentUploadResponse["model"];
  picks?: FirstBreakPick[];
}

/** Reads the file as its kind; throws 422 naming the line and column, or the byte offset. */
export function checkContent(
  kind: AttachmentKind,
  file: ContentFile,
  fields: AttachmentFields,
): CheckedContent {
  if (kind === "seg2") {
    let record;
    try {
      record = readSeg2(
        new Uint8Array(file.buffer.buffer, file.buffer.byteOffset, file.buffer.byteLength),
      );
    } catch (error) {
      if (error instanceof Seg2Error) {
        const message = `not a readable SEG-2 file: ${error.message}`;
        throw new AppError(422, "invalid_seg2", message, {
          file: [message],
          offset: [String(error.offset)],
        });
      }
      throw error;
    }
    if (record.traces.length === 0) {
      const message = "byte 6: expected at least one trace, found a record with none";
      throw new AppError(422, "invalid_seg2", `not a usable SEG-2 record: ${message}`, {
        file: [message],
        offset: ["6"],
      });
    }
    const sources = new Set<number>();
    let samples = 0;
    let withReceiver = 0;
    const formats = new Set<number>();
    for (const t of record.traces) {
      if (t.sourcePosition !== null) sources.add(t.sourcePosition);
      if (t.receiverPosition !== null) withReceiver++;
      samples = Math.max(samples, t.samples.length);
      formats.add(t.format);
    }
    return {
      facts: {
        kind: "seg2",
        traces: record.traces.length,
        samples,
        sampleInterval: record.traces[0].sampleInterval,
        formats: [...formats].sort(),
        byteOrder: record.byteOrder,
        sourcePositions: [...sources].sort((a, b) => a - b),
        tracesWithReceiver: withReceiver,
      },
    };
  }
  const text = csvText(file.buffer);
  if (kind === "picks") {
    const result = parsePicksCsv(text, { timeUnit: fields.timeUnit });
    if (!result.ok) throw csvError(kind, result.errors);
    const picks: FirstBreakPick[] = result.rows.map((r) => ({
      sourcePosition: r.shotPosition,
      receiverPosition: r.geophonePosition,
      time: r.time,
      origin: "csv",
    }));
    return {
      facts: {
        kind: "picks",
        picks: picks.length,
        shots: [...new Set(picks.map((p) => p.sourcePosition))].sort((a, b) => a - b),
        timeUnit: result.timeUnit,
      },
      picks,
    };
  }
  const name = fields.modelName ?? boreholeModelName(cleanFileName(file.originalname));
  const result = parseBoreholeCsv(text, MATERIALS, { name });
  if (!result.ok) throw csvError(kind, result.errors);
  return {
    facts: {
      kind: "borehole",
      intervals: result.rows.length,
      layers: result.model.layers.length,
      model: result.model,
    },
    model: result.model,
  };
}
