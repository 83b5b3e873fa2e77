/**
 * The plan report as PDF (pdfkit): site, plan, ground models, spread, Arrivals and Section
 * figures drawn from the engine's numbers, Resolvability, the recommendation, the field check
 * (when picks were saved), review history and approval, cautions and safety notes, and a
 * disclaimer deferring to licensed practice. Every section heading is also a PDF bookmark.
 */
import PDFDocument from "pdfkit";
import type { ModelAnalysis, Plan } from "@engine";
import { arrivalsFigure, drawArrivals, drawSection, sectionFigure } from "./charts";
import { pdfText, reportFonts } from "./fonts";
import { ink, reportUnits, ReportWriter, type Cell, type ReportUnits } from "./layout";
import type { PlanReportInput } from "./types";
import { drawInterpretation } from "./field-interpretation";
import { drawRollAlongTable } from "./roll-along-table";

/** Section headings, in order (the tests look for them). */
export const REPORT_SECTIONS = [
  "Site and plan",
  "Ground models",
  "Spread",
  "Arrivals",
  "Section",
  "Resolvability",
  "Recommendation",
  "Field check",
  "Review history and approval",
  "Cautions and safety",
  "Disclaimer",
] as const;

export const CAUTIONS = [
  "A design check is a model, not ground truth: boreholes and a qualified geophysicist's review decide. Defer to local codes and licensed practice.",
  "No spread can reveal a blind layer or a velocity inversion from first arrivals. Where the plan names such a layer, look for other evidence: boreholes or cone penetration tests, later (secondary) arrivals, reflection or surface-wave methods, or carry the layer as a thickness range into the interpretation with its worst-case depth error.",
];

export const SAFETY_NOTES = [
  "Explosive sources need a licensed blaster and local permits.",
  "Hammer and weight-drop sources need eye and hearing protection for everyone near the shot point.",
  "Clear buried utilities before spiking geophones or drilling shot holes.",
  "Lines along roads need traffic management.",
];

export const DISCLAIMER =
  "This report sets out a forward model of first-arrival travel times for the candidate ground models stated above and a check of whether the proposed spread would resolve each refractor. It is a planning aid, not a site investigation or a ground-truth statement. The velocities and thicknesses are assumptions; the ground may differ. Decisions on design, construction or safety rest with a suitably qualified and, where required, licensed professional working to the codes and regulations that apply at the site.";

const fmt = (v: number | null | undefined, digits = 1): string =>
  v === null || v === undefined || !Number.isFinite(v) ? "–" : String(Number(v.toFixed(digits)));
const ms = (s: number | null | undefined, digits = 1) =>
  s === null || s === undefined || !Number.isFinite(s) ? "–" : `${(s * 1000).toFixed(digits)} ms`;
const when = (d: Date) => `${d.toISOString().slice(0, 16).replace("T", " ")} UTC`;

const STATUS_COLOURS: Record<string, string> = {
  resolved: ink.moss,
  "under-sampled": ink.ochre,
  blind: ink.brick,
  inverted: ink.brick,
};

const statusCell = (status: string): Cell => ({
  text: status,
  color: STATUS_COLOURS[status] ?? ink.deep,
  bold: true,
});

/**
 * fontkit faces parsed by the first report of this thread, reused by the next ones: pdfkit
 * (0.20) accepts a parsed face in `registerFont`, and parsing the four faces again took about a
 * fifth of every report. Each document still embeds its own subset. Read from pdfkit's font
 * cache (`_fontFamilies`, keyed by the registered name); when that is missing nothing is kept
 * and every report parses the files as before.
 */
const parsedFaces = new Map<string, unknown>();

function rememberParsedFaces(doc: PDFKit.PDFDocument, names: string[]): void {
  const families = (doc as unknown as { _fontFamilies?: Record<string, { font?: unknown }> })
    ._fontFamilies;
  for (const name of names) {
    const face = families?.[name]?.font as { layout?: unknown } | undefined;
    if (face && typeof face.layout === "function" && !parsedFaces.has(name)) {
      parsedFaces.set(name, face);
    }
  }
}

/**
 * The report's sections that are words and tables only (no figure), each a function of the
 * writer, the input and the reader's units: exported so tests can read their text without a
 * PDF reader.
 */
export const textSections = {
  sitePlan: (w: ReportWriter, input: PlanReportInput, u: ReportUnits) => sitePlan(w, input, u),
  groundModels: (w: ReportWriter, input: PlanReportInput, u: ReportUnits) =>
    groundModels(w, input.document, u),
  spread: (w: ReportWriter, input: PlanReportInput, u: ReportUnits) =>
    spreadSection(w, input.document, u),
  resolvability: (w: ReportWriter, input: PlanReportInput, u: ReportUnits) =>
    resolvability(w, input, u),
  recommendation: (w: ReportWriter, input: PlanReportInput, u: ReportUnits) =>
    recommendation(w, input, u),
  fieldCheck: (w: ReportWriter, input: PlanReportInput, u: ReportUnits) => fieldCheck(w, input, u),
};

/** Renders the report; resolves with the PDF bytes. `compress: false` keeps streams readable. */
export function renderPlanReport(
  input: PlanReportInput,
  options: { compress?: boolean } = {},
): Promise<Buffer> {
  const fonts = reportFonts();
  const doc = new PDFDocument({
    size: "A4",
    margins: { top: 58, bottom: 58, left: 54, right: 54 },
    bufferPages: true,
    compress: options.compress ?? true,
    lang: "en-GB",
    displayTitle: true,
    info: {
      Title: pdfText(`Plan report: ${input.plan.name}`),
      Author: pdfText(input.teamName),
      Subject: pdfText(`${input.site.name}, revision ${input.plan.revision}`),
      Creator: "Spreadsight",
      Producer: "Spreadsight (pdfkit)",
      CreationDate: input.generatedAt,
    },
  });
  for (const [name, data] of Object.entries(fonts.files)) {
    // A face parsed by an earlier report of this thread, else the font file's bytes.
    doc.registerFont(name, (parsedFaces.get(name) ?? data) as Buffer);
  }
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on("data", (c: Buffer) => chunks.push(c));
    doc.on("end", () => {
      rememberParsedFaces(doc, Object.keys(fonts.files));
      resolve(Buffer.concat(chunks));
    });
    doc.on("error", reject);
  });

  const w = new ReportWriter(doc, fonts);
  const u = reportUnits(input.units);
  titleBlock(w, input);
  sitePlan(w, input, u);
  groundModels(w, input.document, u);
  spreadSection(w, input.document, u);
  drawRollAlongTable(w, input.document, input.analysis.ok ? input.analysis.value : null, u.system);
  figures(w, input, u);
  resolvability(w, input, u);
  recommendation(w, input, u);
  fieldCheck(w, input, u);
  reviewHistory(w, input);
  cautions(w);
  disclaimer(w);
  footers(w, input);
  doc.end();
  return done;
}

function titleBlock(w: ReportWriter, input: PlanReportInput): void {
  const { doc, fonts } = w;
  doc.rect(0, 0, doc.page.width, 6).fill(ink.ink);
  doc
    .font(fonts.medium)
    .fontSize(9)
    .fillColor(ink.ochre)
    .text("SPREADSIGHT · PLAN REPORT", w.left, 34, {
      characterSpacing: 1.2,
    });
  doc.font(fonts.bold).fontSize(20).fillColor(ink.deep).text(pdfText(input.plan.name), w.left, 50, {
    width: w.width,
  });
  doc.moveDown(0.2);
  doc
    .font(fonts.regular)
    .fontSize(10)
    .fillColor(ink.soft)
    .text(
      pdfText(
        `${input.site.name} · revision ${input.plan.revision} · ${input.plan.status}${input.plan.sandbox ? " · trainee sandbox" : ""}`,
      ),
      { width: w.width },
    );
  doc.moveDown(0.6);
  const approved = input.approval;
  if (approved) {
    w.callout(
      `Signed off for mobilisation by ${approved.by} on ${when(approved.at)} (revision ${approved.revision})${approved.revision === input.plan.revision ? "" : `; this report shows revision ${input.plan.revision}, which is not the signed-off one`}.`,
      approved.revision === input.plan.revision ? "ok" : "caution",
    );
  } else {
    w.callout(`Not signed off. Status: ${input.plan.status}.`, "caution");
  }
}

function sitePlan(w: ReportWriter, input: PlanReportInput, u: ReportUnits): void {
  w.heading(REPORT_SECTIONS[0]);
  const d = input.document;
  w.facts([
    ["Site", input.site.name],
    ["Site description", input.site.description || "–"],
    ["Plan", d.name],
    ["Team", input.teamName],
    ["Plan author", input.plan.author],
    ["Status", input.plan.status],
    ["Revision", String(input.plan.revision)],
    ["Report made", `${when(input.generatedAt)} by ${input.generatedBy}`],
    [
      "Acceptance criteria",
      `at least ${d.criteria.minGeophones} geophones per segment; pick error ${ms(d.criteria.pickError, 2)}; depth tolerance ${u.lenU(d.criteria.depthTolerance)}`,
    ],
    [
      "Units",
      u.system === "imperial" ? "feet (ft, ft/s); times in ms" : "metres (m, m/s); times in ms",
    ],
  ]);
}

function groundModels(w: ReportWriter, d: Plan, u: ReportUnits): void {
  w.heading(REPORT_SECTIONS[1]);
  w.paragraph(
    `${d.models.length} candidate ground model${d.models.length === 1 ? "" : "s"}. Thickness is vertical at position 0 ${u.length}; dip is that of the layer's base, positive deepening towards increasing position.`,
    { color: ink.soft },
  );
  d.models.forEach((model, m) => {
    w.subheading(`${m + 1}. ${model.name}`);
    let depth = 0;
    w.table(
      [
        { header: "Layer", width: 40 },
        { header: "Name", width: 150 },
        { header: "Material", width: 90 },
        { header: `Velocity (${u.velocity})`, width: 80, align: "right" },
        { header: `Thickness (${u.length})`, width: 80, align: "right" },
        { header: `Top at 0 ${u.length} (${u.length})`, width: 80, align: "right" },
        { header: "Dip (°)", width: 55, align: "right" },
      ],
      model.layers.map((layer, i) => {
        const row = [
          String(i + 1),
          layer.name ?? "",
          layer.material ?? "",
          u.vel(layer.velocity),
          i === model.layers.length - 1 ? "half-space" : u.len(layer.thickness),
          u.len(depth),
          i === model.layers.length - 1 ? "–" : fmt(layer.dip ?? 0, 1),
        ];
        depth += layer.thickness ?? 0;
        return row;
      }),
    );
  });
}

function spreadSection(w: ReportWriter, d: Plan, u: ReportUnits): void {
  w.heading(REPORT_SECTIONS[2]);
  const s = d.spread;
  const last = s.firstGeophone + (s.channels - 1) * s.spacing;
  w.facts([
    ["Geophones", `${s.channels} at ${u.lenU(s.spacing)} spacing`],
    ["First geophone", u.lenU(s.firstGeophone)],
    ["Last geophone", u.lenU(last)],
    ["Spread length", u.lenU(last - s.firstGeophone)],
    ["Shots", String(s.shots.length)],
  ]);
  w.table(
    [
      { header: "Shot", width: 60 },
      { header: `Position (${u.length})`, width: 90, align: "right" },
      { header: "Where", width: 250 },
    ],
    s.shots.map((shot, i) => {
      const where =
        shot.position < s.firstGeophone
          ? `off-end, ${u.lenU(s.firstGeophone - shot.position)} before the first geophone`
          : shot.position > last
            ? `off-end, ${u.lenU(shot.position - last)} beyond the last geophone`
            : "within the spread";
      return [shot.label || `S${i + 1}`, u.len(shot.position), where];
    }),
  );
  w.paragraph(
    `The station layout for pegging out is available as CSV (stations.csv) beside this report; its columns are in SI units (position_m and so on) whatever the report's units.`,
    {
      color: ink.soft,
    },
  );
}

function figures(w: ReportWriter, input: PlanReportInput, u: ReportUnits): void {
  const d = input.document;
  w.heading(REPORT_SECTIONS[3], 290);
  w.paragraph(
    "Modelled first-arrival time against position for every shot. Colour shows which arrival comes first: the direct wave, or the head wave along the top of a deeper layer. Triangles above the chart are shot points; ticks on the position axis are geophones.",
    { color: ink.soft },
  );
  d.models.forEach((model, m) => {
    w.ensureSpace(250);
    w.subheading(`${m + 1}. ${model.name}`);
    const box = { x: w.left, y: w.y, width: w.width, height: 220 };
    try {
      drawArrivals(w.doc, w.fonts, box, arrivalsFigure(model, d.spread), u.system);
      w.doc.y = box.y + box.height + 8;
    } catch (error) {
      w.callout(
        `The arrivals of this model could not be computed: ${(error as Error).message}`,
        "caution",
      );
    }
  });

  w.heading(REPORT_SECTIONS[4], 270);
  w.paragraph(
    "Each ground model drawn to scale under the line, with geophones (triangles), shot points (dots) and the first-arrival ray path from the first shot to the geophone farthest from it (dashed).",
    { color: ink.soft },
  );
  d.models.forEach((model, m) => {
    w.ensureSpace(230);
    w.subheading(`${m + 1}. ${model.name}`);
    const box = { x: w.left, y: w.y + 4, width: w.width, height: 190 };
    try {
      const ve = drawSection(w.doc, w.fonts, box, sectionFigure(model, d.spread), u.system);
      w.doc.y = box.y + box.height + 4;
      if (Math.abs(ve - 1) > 0.1)
        w.paragraph(`Vertical exaggeration about ${fmt(ve, 1)} : 1.`, { color: ink.soft, size: 8 });
    } catch (error) {
      w.callout(
        `The section of this model could not be drawn: ${(error as Error).message}`,
        "caution",
      );
    }
  });
}

function modelResolvability(w: ReportWriter, model: ModelAnalysis, u: ReportUnits): void {
  w.subheading(`${model.model + 1}. ${model.name} — worst verdict: ${model.worstStatus}`, 90);
  const rows: (string | Cell)[][] = [
    [
      "1 (direct wave)",
      u.vel(model.direct.velocity),
      "0",
      statusCell(model.direct.status),
      String(model.direct.geophones),
      "–",
      "–",
    ],
  ];
  for (const r of model.refractors) {
    const interp = model.interpretation?.refractors.find((x) => x.layer === r.layer);
    rows.push([
      `${r.layer}${r.name ? ` (${r.name})` : ""}`,
      u.vel(r.velocity),
      u.len(r.depth),
      statusCell(r.status),
      String(r.geophones),
      r.minimumThickness === null ? "–" : u.len(r.minimumThickness),
      interp
        ? interp.interpretedDepth === null
          ? "cannot be computed"
          : `${u.len(interp.interpretedDepth)} (${interp.error !== null && interp.error >= 0 ? "+" : ""}${u.len(interp.error)})`
        : "not interpreted",
    ]);
  }
  w.table(
    [
      { header: "Layer (refractor at its top)", width: 116 },
      { header: `Velocity (${u.velocity})`, width: 66, align: "right" },
      { header: `Depth (${u.length})`, width: 52, align: "right" },
      { header: "Verdict", width: 70 },
      { header: "Geophones on segment", width: 62, align: "right" },
      { header: `Min. thickness to resolve (${u.length})`, width: 70, align: "right" },
      { header: `Interpreted depth (error), ${u.length}`, width: 90, align: "right" },
    ],
    rows,
  );
}

function resolvability(w: ReportWriter, input: PlanReportInput, u: ReportUnits): void {
  w.heading(REPORT_SECTIONS[5]);
  if (!input.analysis.ok) {
    w.callout(`The plan could not be analysed: ${input.analysis.reason}`, "caution");
    return;
  }
  const a = input.analysis.value;
  w.paragraph(
    "Verdict per refractor over every shot branch: resolved; under-sampled (its first-arrival segment holds fewer geophones than the criterion); blind (its head wave is never a first arrival); inverted (slower than a layer above, so no head wave). Interpreted depth is what the intercept-time method gives on the resolved segments of the first shot's longest branch, with its error against the true depth.",
    { color: ink.soft },
  );
  w.facts([["Worst verdict over all models", a.worstStatus]]);
  for (const model of a.models) modelResolvability(w, model, u);
}

function recommendation(w: ReportWriter, input: PlanReportInput, u: ReportUnits): void {
  w.heading(REPORT_SECTIONS[6]);
  if (!input.analysis.ok) {
    w.callout("No recommendation: the plan could not be analysed.", "caution");
    return;
  }
  const a = input.analysis.value;
  w.callout(u.text(a.recommendation.text), "plain");
  for (const model of a.models) {
    w.subheading(`${model.model + 1}. ${model.name}`);
    w.paragraph(u.text(model.recommendation.text));
    const r = model.recommendation;
    w.facts([
      [
        "Largest spacing",
        r.maxSpacing === null
          ? "any"
          : `${u.lenU(r.maxSpacing)} (${r.spacingOk ? "the plan's spacing meets it" : "the plan's spacing is wider"})`,
      ],
      [
        "Offset each branch must reach",
        `${u.lenU(r.spreadLength)} (${r.lengthOk ? "reached" : "not reached"})`,
      ],
    ]);
    for (const hidden of r.hidden) w.callout(u.text(hidden.statement), "hidden");
  }
}

function fieldCheck(w: ReportWriter, input: PlanReportInput, u: ReportUnits): void {
  w.heading(REPORT_SECTIONS[7]);
  const f = input.fieldCheck;
  if (!f || f.picks === 0) {
    w.paragraph("No field picks have been saved for this plan yet.", { color: ink.soft });
    return;
  }
  w.paragraph(
    `${f.picks} first-break picks from ${f.shots.length} shot${f.shots.length === 1 ? "" : "s"} (at ${f.shots.map((s) => u.lenU(s)).join(", ")}) compared with the modelled first arrivals of each candidate ground model.`,
  );
  w.table(
    [
      { header: "Ground model", width: 220 },
      { header: "RMS residual", width: 90, align: "right" },
      { header: "Mean residual", width: 90, align: "right" },
      { header: "Picks modelled", width: 80, align: "right" },
    ],
    f.fits.map((fit) => [
      { text: fit.name + (fit.name === f.best ? " (best fit)" : ""), bold: fit.name === f.best },
      ms(fit.rms, 2),
      ms(fit.meanResidual, 2),
      String(fit.count),
    ]),
  );
  for (const warning of f.warnings) w.callout(warning, "caution");
  drawInterpretation(w, f.interpretation, u);
}

function reviewHistory(w: ReportWriter, input: PlanReportInput): void {
  w.heading(REPORT_SECTIONS[8]);
  if (input.approval) {
    w.callout(
      `Signed off for mobilisation by ${input.approval.by} on ${when(input.approval.at)}, revision ${input.approval.revision}${input.approval.note ? `: "${input.approval.note}"` : "."}`,
      "ok",
    );
  } else {
    w.callout(
      `This plan has not been signed off for mobilisation (status: ${input.plan.status}).`,
      "caution",
    );
  }
  w.subheading("Review");
  if (input.review.length === 0) w.paragraph("No review steps recorded.", { color: ink.soft });
  else
    w.table(
      [
        { header: "When", width: 110 },
        { header: "Who", width: 110 },
        { header: "Step", width: 120 },
        { header: "Revision", width: 55, align: "right" },
        { header: "Note", width: 180 },
      ],
      input.review.map((e) => [
        when(e.at),
        e.actor ?? "–",
        e.label,
        e.revision === null ? "–" : String(e.revision),
        e.note ?? "",
      ]),
    );
  w.subheading("Revisions");
  if (input.revisions.length === 0) w.paragraph("No revisions recorded.", { color: ink.soft });
  else
    w.table(
      [
        { header: "Revision", width: 55, align: "right" },
        { header: "When", width: 110 },
        { header: "Author", width: 110 },
        { header: "Worst verdict", width: 80 },
        { header: "Message", width: 220 },
      ],
      input.revisions.map((r) => [
        String(r.number),
        when(r.createdAt),
        r.author,
        r.worstVerdict ? statusCell(r.worstVerdict) : "–",
        r.message ?? "",
      ]),
    );
}

function cautions(w: ReportWriter): void {
  w.heading(REPORT_SECTIONS[9]);
  for (const c of CAUTIONS) w.callout(c, "caution");
  w.subheading("Safety notes for the field crew");
  for (const s of SAFETY_NOTES) w.paragraph(`•  ${s}`);
}

function disclaimer(w: ReportWriter): void {
  w.heading(REPORT_SECTIONS[10]);
  w.paragraph(DISCLAIMER);
  w.paragraph(
    `Methods: flat and planar dipping layers; direct wave, head waves and the intercept-time method after Telford, Geldart & Sheriff (1990) §4.3 and Kearey, Brooks & Hill (2002) ch. 5. Report set in ${w.fonts.family}.`,
    { color: ink.soft, size: 8 },
  );
}

function footers(w: ReportWriter, input: PlanReportInput): void {
  const { doc, fonts } = w;
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    const y = doc.page.height - 36;
    doc
      .moveTo(w.left, y - 6)
      .lineTo(w.left + w.width, y - 6)
      .lineWidth(0.5)
      .strokeColor(ink.rule)
      .stroke();
    doc
      .font(fonts.regular)
      .fontSize(7.5)
      .fillColor(ink.soft)
      .text(
        pdfText(`Spreadsight · ${input.plan.name} · revision ${input.plan.revision}`),
        w.left,
        y,
        {
          width: w.width * 0.7,
          lineBreak: false,
        },
      );
    doc.text(`page ${i - range.start + 1} of ${range.count}`, w.left, y, {
      width: w.width,
      align: "right",
      lineBreak: false,
    });
    doc.page.margins.bottom = bottom;
  }
}
