// The cost S-curve drawn with pdfkit's vector primitives from the brief's data.
import type PDFKit from 'pdfkit';
import { formatMoneyShort } from '@/lib/runs/format';
import { sCurveGeometry, type Box } from '../chart-geometry';
import type { BriefData } from '../build';
import { PDF_COLOURS as C } from './palette';
import { pdfText } from './text';

export function drawSCurve(doc: PDFKit.PDFDocument, brief: BriefData, box: Box): void {
  const currency = brief.project.currency;
  const markers = [
    { label: 'Base', value: brief.cost.base },
    { label: brief.contingency.level, value: brief.contingency.value },
  ];
  if (brief.cost.target) markers.push({ label: 'Target', value: brief.cost.target.value });
  const g = sCurveGeometry(brief.cost.curve, box, markers);
  const { plot } = g;

  doc.save();
  doc.lineWidth(0.5).strokeColor(C.rule);
  for (const t of g.yTicks)
    doc
      .moveTo(plot.x, t.at)
      .lineTo(plot.x + plot.width, t.at)
      .stroke();
  doc.fontSize(6.5).fillColor(C.faint).font('Helvetica');
  for (const t of g.yTicks)
    doc.text(`${Math.round(t.value * 100)} %`, plot.x - 30, t.at - 3, {
      width: 26,
      align: 'right',
      lineBreak: false,
    });
  for (const t of g.xTicks)
    doc.text(pdfText(formatMoneyShort(t.value, currency)), t.at - 30, plot.y + plot.height + 4, {
      width: 60,
      align: 'center',
      lineBreak: false,
    });

  doc.lineWidth(0.75).strokeColor(C.soft);
  doc
    .moveTo(plot.x, plot.y)
    .lineTo(plot.x, plot.y + plot.height)
    .lineTo(plot.x + plot.width, plot.y + plot.height)
    .stroke();

  for (const m of g.markers) {
    const colour = m.label === 'Base' ? C.faint : m.label === 'Target' ? C.caution : C.cost;
    doc.lineWidth(0.75).strokeColor(colour).dash(2, { space: 2 });
    doc
      .moveTo(m.at, plot.y)
      .lineTo(m.at, plot.y + plot.height)
      .stroke()
      .undash();
    doc
      .fontSize(6.5)
      .fillColor(colour)
      .text(m.label, m.at + 2, plot.y + 2, { lineBreak: false });
  }

  if (g.line.length) {
    doc.lineWidth(1.5).strokeColor(C.cost).lineJoin('round');
    doc.moveTo(g.line[0].x, g.line[0].y);
    for (const p of g.line.slice(1)) doc.lineTo(p.x, p.y);
    doc.stroke();
  }
  doc.restore();
}
