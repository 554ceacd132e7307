/**
 * The brief as a PDF, made on the server with pdfkit and its built-in Helvetica (no font file
 * to ship). Charts are vector drawings from the same data as the page. Fits A4 and US Letter:
 * every width is taken from the page.
 */
import { HEALTH_RULE_TITLES } from '@/lib/domain/schedule-health';
import PDFDocument from 'pdfkit';
import { formatDate, formatDays, formatMoney, formatMoneyShort, formatShare } from '@/lib/runs/format';
import { calendarText, finishDate } from '@/lib/runs/working-days';
import { CLASS_CHECK_SOURCE } from '@/lib/domain/estimate-class';
import { contingencyOver } from '@/lib/domain/contingency';
import { percentileOf, type BriefData, type TotalBrief } from '../build';
import { dateText, dateTimeText, moneyWithInterval, probabilityText, signedPercent } from '../format';
import { finishRows } from '../finish';
import { headlineText } from '../headline';
import {
  BRIEF_CAUTION,
  SCENARIO_TEXT,
  VERDICT_TEXT,
  classBandsText,
  classCheckWarnings,
  responsesText,
  scenarioRows,
  simulatedRangeText,
} from '../wording';
import { PDF_COLOURS as C } from './palette';
import { drawSCurve, type PdfMarker } from './s-curve';
import { drawTornado } from './tornado';
import { pdfText } from './text';

type Doc = PDFKit.PDFDocument;
type Column = { label: string; width: number; align?: 'left' | 'right' };

const MARGIN = 42;

class Writer {
  y = MARGIN;
  constructor(readonly doc: Doc) {}

  get left() {
    return MARGIN;
  }
  get width() {
    return this.doc.page.width - 2 * MARGIN;
  }
  get bottom() {
    return this.doc.page.height - MARGIN;
  }

  /** Starts a new page when fewer than `needed` points are left. */
  room(needed: number) {
    if (this.y + needed > this.bottom) {
      this.doc.addPage();
      this.y = MARGIN;
    }
  }

  /** A hairline across the text width at the current position. */
  rule(lineWidth: number) {
    const { doc, left, y } = this;
    doc
      .lineWidth(lineWidth)
      .strokeColor(C.rule)
      .moveTo(left, y)
      .lineTo(left + this.width, y)
      .stroke();
  }

  /** A section title, kept on one page with the first `keepWith` points of what follows. */
  heading(text: string, keepWith = 40) {
    this.room(25 + keepWith);
    this.y += 8;
    this.doc.font('Helvetica-Bold').fontSize(9).fillColor(C.soft);
    this.doc.text(pdfText(text.toUpperCase()), this.left, this.y, {
      characterSpacing: 0.6,
      lineBreak: false,
    });
    this.y += 12;
    this.rule(0.5);
    this.y += 5;
  }

  paragraph(text: string, { size = 8.5, colour: colour = C.ink as string, bold = false } = {}) {
    this.doc
      .font(bold ? 'Helvetica-Bold' : 'Helvetica')
      .fontSize(size)
      .fillColor(colour);
    const h = this.doc.heightOfString(pdfText(text), { width: this.width });
    this.room(h + 2);
    this.doc.text(pdfText(text), this.left, this.y, { width: this.width });
    this.y += h + 3;
  }

  table(columns: Column[], rows: string[][], { size = 8 } = {}) {
    const total = columns.reduce((s, c) => s + c.width, 0);
    const scale = this.width / total;
    const row = (cells: string[], bold: boolean, colour: string) => {
      this.doc
        .font(bold ? 'Helvetica-Bold' : 'Helvetica')
        .fontSize(size)
        .fillColor(colour);
      const heights = cells.map((c, i) =>
        this.doc.heightOfString(pdfText(c), { width: columns[i].width * scale - 6 }),
      );
      const h = Math.max(...heights) + 4;
      this.room(h);
      let x = this.left;
      cells.forEach((cell, i) => {
        const w = columns[i].width * scale;
        this.doc.text(pdfText(cell), x + 3, this.y + 2, { width: w - 6, align: columns[i].align ?? 'left' });
        x += w;
      });
      this.y += h;
      this.rule(0.4);
    };
    row(
      columns.map((c) => c.label),
      true,
      C.soft,
    );
    for (const r of rows) row(r, false, C.ink);
    this.y += 4;
  }

  /** A boxed note in the caution colours. */
  caution(title: string, text: string) {
    this.doc.font('Helvetica').fontSize(8);
    const h = this.doc.heightOfString(pdfText(text), { width: this.width - 16 }) + 22;
    this.room(h + 4);
    this.doc.rect(this.left, this.y, this.width, h).fillAndStroke(C.cautionLight, C.caution);
    this.doc.font('Helvetica-Bold').fontSize(8.5).fillColor(C.cautionDark);
    this.doc.text(pdfText(title), this.left + 8, this.y + 6, { width: this.width - 16 });
    this.doc.font('Helvetica').fontSize(8).fillColor(C.cautionDark);
    this.doc.text(pdfText(text), this.left + 8, this.y + 17, { width: this.width - 16 });
    this.y += h + 6;
  }
}

const shareText = (share: number | null) => (share === null ? '—' : signedPercent(share));

/** The columns of a confidence-level table whose values are named `value`. */
const percentileColumns = (value: string): Column[] => [
  { label: 'Level', width: 1 },
  { label: value, width: 2, align: 'right' },
  { label: '95 % interval', width: 3, align: 'right' },
  { label: 'vs base', width: 1, align: 'right' },
];

function percentileRows(total: TotalBrief, show: (v: number) => string): string[][] {
  return total.percentiles.map((p) => [
    p.level,
    show(p.value),
    `${show(p.ci95[0])} – ${show(p.ci95[1])}`,
    shareText(contingencyOver(total.base, p.level, p.value).shareOfBase),
  ]);
}

function header(w: Writer, brief: BriefData) {
  const { doc } = w;
  const { project, run } = brief;
  doc.font('Helvetica').fontSize(8).fillColor(C.faint);
  doc.text(pdfText(`Brief for sponsors · ${project.code} · run ${run.number}`), w.left, w.y, {
    lineBreak: false,
  });
  w.y += 12;
  doc.font('Helvetica-Bold').fontSize(17).fillColor(C.ink);
  doc.text(pdfText(project.name), w.left, w.y, { width: w.width });
  w.y += doc.heightOfString(pdfText(project.name), { width: w.width }) + 2;
  doc.font('Helvetica').fontSize(9).fillColor(C.soft);
  const ran = run.finishedAt
    ? dateTimeText(run.finishedAt)
    : run.startedAt
      ? dateTimeText(run.startedAt)
      : 'unknown';
  doc.text(
    pdfText(
      `${project.stage} · Class ${project.estimateClass} estimate · ${project.currency} · run by ${run.startedByName ?? 'a former member'}, ${ran}`,
    ),
    w.left,
    w.y,
    { width: w.width },
  );
  w.y += 16;
}

function headlineFigures(w: Writer, brief: BriefData) {
  const { doc } = w;
  const currency = brief.project.currency;
  const level = brief.contingency.level;
  const atLevel = brief.cost.percentiles.find((p) => p.level === level);
  const figures: [string, string, string][] = [
    ['Base estimate', formatMoney(brief.cost.base, currency), 'deterministic sum of the inputs'],
    [
      `Cost ${level}`,
      formatMoney(brief.contingency.value, currency),
      atLevel
        ? `95 % interval ${formatMoney(atLevel.ci95[0], currency)} – ${formatMoney(atLevel.ci95[1], currency)}`
        : '',
    ],
    [
      `Contingency at ${level}`,
      formatMoney(brief.contingency.amount, currency),
      brief.contingency.shareOfBase === null ? '' : `${signedPercent(brief.contingency.shareOfBase)} of base`,
    ],
  ];
  const cell = w.width / figures.length;
  w.room(48);
  figures.forEach(([label, value, note], i) => {
    const x = w.left + i * cell;
    doc.rect(x + (i ? 4 : 0), w.y, cell - 4, 44).fillAndStroke('#fffdf8', C.rule);
    doc
      .font('Helvetica')
      .fontSize(7.5)
      .fillColor(C.soft)
      .text(pdfText(label), x + 10, w.y + 5, { lineBreak: false });
    doc
      .font('Helvetica-Bold')
      .fontSize(13)
      .fillColor(i === 0 ? C.ink : C.cost);
    doc.text(pdfText(value), x + 10, w.y + 15, { lineBreak: false });
    doc
      .font('Helvetica')
      .fontSize(6.5)
      .fillColor(C.faint)
      .text(pdfText(note), x + 10, w.y + 33, { lineBreak: false });
  });
  w.y += 52;
}

function targets(w: Writer, brief: BriefData) {
  const currency = brief.project.currency;
  const rows: string[][] = [];
  if (brief.cost.target)
    rows.push([
      `Cost at most ${formatMoney(brief.cost.target.value, currency)}`,
      probabilityText(brief.cost.target.probability, brief.cost.target.ci95),
    ]);
  if (brief.duration?.target)
    rows.push([
      `Finish within ${formatDays(brief.duration.target.value, 0)}${brief.run.finishTarget ? ` (by ${dateText(brief.run.finishTarget)})` : ''}`,
      probabilityText(brief.duration.target.probability, brief.duration.target.ci95),
    ]);
  if (brief.joint)
    rows.push(['Both targets met (joint)', probabilityText(brief.joint.probability, brief.joint.ci95)]);
  w.heading('Probability of meeting the targets');
  if (!rows.length) w.paragraph('The run was started without a cost or finish target.', { colour: C.soft });
  else
    w.table(
      [
        { label: 'Target', width: 3 },
        { label: 'Probability', width: 2, align: 'right' },
      ],
      rows,
    );
}

function scenarioSection(w: Writer, brief: BriefData) {
  const { scenario } = brief;
  const text = SCENARIO_TEXT[scenario.used];
  w.heading('Scenario');
  w.paragraph(`${text.title}. ${text.detail} ${responsesText(scenario, brief.project.currency)}`);
  const rows = scenarioRows(scenario, brief.project.currency);
  if (!rows.length) return;
  w.table(
    [
      { label: 'Same run, same random numbers', width: 3 },
      { label: 'Before responses', width: 2, align: 'right' },
      { label: 'After responses', width: 2, align: 'right' },
      { label: 'What the responses buy', width: 2, align: 'right' },
    ],
    rows,
  );
}

function finishSection(w: Writer, brief: BriefData) {
  const { finish, duration } = brief;
  if (!finish || !duration) return;
  const dateOf = (days: number) => formatDate(finishDate(finish.baseDate, days, finish.calendar));
  w.heading('Finish dates', 60);
  const rows = finishRows(finish).map((r) => [
    r.label,
    formatDate(r.date),
    formatDays(r.days, r.wholeDays ? 0 : 1),
  ]);
  w.table(
    [
      { label: 'Finish', width: 2 },
      { label: 'Date', width: 2, align: 'right' },
      { label: `Working days from ${formatDate(finish.baseDate)}`, width: 3, align: 'right' },
    ],
    rows,
  );
  w.paragraph(
    `80 % of simulated outcomes finish by ${formatDate(finish.p80.date)} (working days ${calendarText(finish.calendar)}).`,
    {
      size: 8,
      colour: C.soft,
    },
  );
  const markers: PdfMarker[] = [
    { label: 'P50', value: finish.p50.days, tone: 'base' },
    { label: finish.atLevel.level, value: finish.atLevel.days, tone: 'level' },
  ];
  if (finish.atLevel.level !== 'P80') markers.push({ label: 'P80', value: finish.p80.days, tone: 'level' });
  if (finish.target) markers.push({ label: 'Target', value: finish.target.days, tone: 'target' });
  w.room(150);
  drawSCurve(
    w.doc,
    duration.curve,
    markers,
    dateOf,
    { x: w.left, y: w.y, width: w.width, height: 140 },
    C.time,
  );
  w.y += 148;
}

function scheduleHealthSection(w: Writer, brief: BriefData) {
  const { findings, activityCount } = brief.scheduleHealth;
  if (activityCount === 0) return;
  w.heading('Health check of the network this run read');
  if (findings.length === 0) {
    w.paragraph('No findings.', { size: 8, colour: C.soft });
    return;
  }
  for (const f of findings) w.paragraph(`${HEALTH_RULE_TITLES[f.rule]}: ${f.message}`, { size: 8 });
  w.paragraph(
    'Common checks of schedule logic, on the network as the run read it; the finish figures are only as sound as that network.',
    { size: 7.5, colour: C.faint },
  );
}

function classCheck(w: Writer, brief: BriefData) {
  const check = brief.classCheck!;
  const { narrowest, widest } = classBandsText(check);
  w.heading(`Estimate-class check (Class ${check.estimateClass})`);
  w.table(
    [
      {
        label: `Range as a share of the P50 of cost (${formatMoney(check.reference, brief.project.currency)})`,
        width: 4,
      },
      { label: 'Low side', width: 1.6, align: 'right' },
      { label: 'High side', width: 1.6, align: 'right' },
    ],
    [
      ['Simulated P10 and P90', ...simulatedRangeText(check)],
      [`Class ${check.estimateClass}, narrowest expected`, ...narrowest],
      [`Class ${check.estimateClass}, widest expected`, ...widest],
      ['Verdict', VERDICT_TEXT[check.low], VERDICT_TEXT[check.high]],
    ],
  );
  w.paragraph(
    `Measured around the estimate including contingency at about P50, not around the base, on each side. Source: ${CLASS_CHECK_SOURCE}; check them against the current revision. Reading the class ranges as a P10-P90 range is common practice.`,
    { size: 7.5, colour: C.faint },
  );
  const warnings = classCheckWarnings(check);
  if (warnings.length) w.caution("The simulated range is out of the class's band", warnings.join(' '));
}

function allocationSection(w: Writer, brief: BriefData) {
  const a = brief.allocation;
  if (!a) return;
  const money = (v: number) => formatMoney(v, brief.project.currency);
  w.heading('Where the contingency sits (by top-level WBS)');
  w.table(
    [
      { label: 'Top-level WBS', width: 4 },
      { label: 'Lines', width: 1, align: 'right' },
      { label: `Contingency at ${a.level}`, width: 2, align: 'right' },
      { label: 'Share', width: 1, align: 'right' },
    ],
    [
      ...a.rows.map((r) => [
        r.wbs !== null && r.name !== `WBS ${r.wbs}` ? `${r.wbs} ${r.name}` : r.name,
        String(r.count),
        money(r.amount),
        r.share === null ? '—' : formatShare(r.share, 0),
      ]),
      ['Total', '', money(a.total), a.contingency ? formatShare(a.total / a.contingency, 0) : '—'],
    ],
  );
  w.paragraph(
    `Euler allocation: each line's mean cost over base in the outcomes nearest the ${a.level} total. The contingency at ${a.level} is ${money(a.contingency)}.`,
    { size: 7.5, colour: C.faint },
  );
}

function driversSection(w: Writer, drivers: BriefData['drivers'], title: string) {
  if (!drivers.length) return;
  const height = Math.max(60, drivers.length * 15 + 22);
  w.heading(title, height + 6);
  w.room(height + 6);
  drawTornado(w.doc, drivers, { x: w.left, y: w.y, width: w.width, height });
  w.y += height + 6;
}

export async function renderBriefPdf(
  brief: BriefData,
  { paper = 'A4' }: { paper?: 'A4' | 'LETTER' } = {},
): Promise<Buffer> {
  const doc = new PDFDocument({
    size: paper,
    margin: MARGIN,
    info: {
      Title: pdfText(`Brief: ${brief.project.name}, run ${brief.run.id}`),
      Author: 'Outturn',
      Subject: pdfText(`${brief.project.code} ${brief.project.stage}`),
    },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const w = new Writer(doc);
  const currency = brief.project.currency;
  const money = (v: number) => formatMoney(v, currency);
  header(w, brief);
  w.paragraph(headlineText(brief), { size: 10.5 });
  w.y += 2;
  headlineFigures(w, brief);
  scenarioSection(w, brief);

  w.heading('Confidence levels of total cost');
  w.table(percentileColumns('Cost'), percentileRows(brief.cost, money));
  if (brief.duration) {
    w.heading('Confidence levels of duration (working days)');
    w.table(
      percentileColumns('Duration'),
      percentileRows(brief.duration, (v) => formatDays(v)),
    );
  }
  targets(w, brief);

  if (brief.classCheck) classCheck(w, brief);
  finishSection(w, brief);
  scheduleHealthSection(w, brief);

  w.heading('Cost S-curve', 190);
  w.paragraph(
    `${brief.contingency.level === 'P50' ? '50' : brief.contingency.level.slice(1)} % of simulated outcomes cost at most ${money(brief.contingency.value)}.`,
    { size: 8, colour: C.soft },
  );
  w.room(175);
  const costMarkers: PdfMarker[] = [
    { label: 'Base', value: brief.cost.base, tone: 'base' },
    { label: brief.contingency.level, value: brief.contingency.value, tone: 'level' },
  ];
  if (brief.cost.target)
    costMarkers.push({ label: 'Target', value: brief.cost.target.value, tone: 'target' });
  drawSCurve(doc, brief.cost.curve, costMarkers, (v) => formatMoneyShort(v, currency), {
    x: w.left,
    y: w.y,
    width: w.width,
    height: 170,
  });
  w.y += 178;

  allocationSection(w, brief);
  driversSection(w, brief.drivers, 'Top drivers of cost (rank correlation, every kind of input)');
  if (brief.duration)
    driversSection(w, brief.finishDrivers, 'Top drivers of finish (rank correlation, every kind of input)');

  w.heading(
    `Top risk events by expected cost${brief.scenario.used === 'post' ? ', after the responses' : ''}`,
  );
  if (!brief.topRisks.length) w.paragraph('The run had no risk events.', { colour: C.soft });
  else
    w.table(
      [
        { label: 'Risk event', width: 4 },
        { label: 'Probability', width: 1.3, align: 'right' },
        { label: 'Mean impact', width: 1.8, align: 'right' },
        { label: 'Expected cost', width: 1.8, align: 'right' },
      ],
      brief.topRisks.map((r) => [
        `${r.id} ${r.name === r.id ? '' : r.name}`.trim(),
        probabilityText(r.probability),
        money(r.meanCost),
        money(r.expectedCost),
      ]),
    );

  w.heading('Assumptions');
  w.paragraph(brief.project.assumptions ?? 'None stated.', {
    colour: brief.project.assumptions ? C.ink : C.faint,
  });
  w.heading('Exclusions');
  w.paragraph(brief.project.exclusions ?? 'None stated.', {
    colour: brief.project.exclusions ? C.ink : C.faint,
  });

  w.heading('The run');
  const p80 = percentileOf(brief.cost, 'P80');
  w.table(
    [
      { label: 'Item', width: 1 },
      { label: 'Value', width: 3 },
    ],
    [
      ['Run by', brief.run.startedByName ?? 'a former member'],
      ['Started', brief.run.startedAt ? dateTimeText(brief.run.startedAt) : '—'],
      ['Finished', brief.run.finishedAt ? dateTimeText(brief.run.finishedAt) : '—'],
      [
        'Iterations',
        `${brief.run.iterations.toLocaleString('en-GB')} (${brief.run.sampling === 'lhs' ? 'Latin hypercube' : 'Monte Carlo'}, seed ${brief.run.seed})`,
      ],
      ['Input hash (SHA-256)', brief.run.inputHash],
      ['Cost P80', moneyWithInterval(p80.value, p80.ci95, currency)],
    ],
  );
  for (const warning of brief.engineWarnings) w.caution('Engine warning', warning);

  w.heading('Decision');
  if (brief.decision)
    w.paragraph(
      `${brief.decision.decision === 'approved' ? 'Approved as the baseline' : 'Returned'}${brief.decision.selfApproved ? ' (self-approved: the sponsor also started the run)' : ''} by ${brief.decision.sponsorName} on ${dateTimeText(brief.decision.decidedAt)} (${brief.decision.stage}, Class ${brief.decision.estimateClass}).${brief.decision.comment ? ` “${brief.decision.comment}”` : ''}`,
    );
  else w.paragraph('Awaiting a sponsor’s decision.', { colour: C.soft });

  w.caution('Read these figures with care', BRIEF_CAUTION);
  doc.end();
  return done;
}
