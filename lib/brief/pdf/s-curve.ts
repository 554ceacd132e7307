// An S-curve (cost or finish) drawn with pdfkit's vector primitives from the brief's data: the same
// geometry and the same smooth monotone curve as the page's SVG.
import type PDFKit from 'pdfkit';
import { monotoneCubic, sCurveGeometry, type Box } from '../chart-geometry';
import { PDF_COLOURS as C } from './palette';
import { pdfText } from './text';

export type PdfMarker = { label: string; value: number; tone: 'base' | 'level' | 'target' };

export function drawSCurve(
  doc: PDFKit.PDFDocument,
  curve: { x: number; y: number }[],
  markers: PdfMarker[],
  tickText: (v: number) => string,
  box: Box,
  colour: string = C.cost,
): void {
  const g = sCurveGeometry(curve, box, markers);
  const { plot } = g;
  const toneOf = new Map(markers.map((m) => [m.label, m.tone]));

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
  g.xTicks.forEach((t, i) => {
    // The last label ends at the axis's end, so a long one (a date) stays inside the margin.
    const last = i === g.xTicks.length - 1;
    doc.text(pdfText(tickText(t.value)), last ? t.at - 64 : t.at - 32, plot.y + plot.height + 4, {
      width: 64,
      align: last ? 'right' : 'center',
      lineBreak: false,
    });
  });

  doc.lineWidth(0.75).strokeColor(C.soft);
  doc
    .moveTo(plot.x, plot.y)
    .lineTo(plot.x, plot.y + plot.height)
    .lineTo(plot.x + plot.width, plot.y + plot.height)
    .stroke();

  for (const m of g.markers) {
    const tone = toneOf.get(m.label) ?? 'level';
    const c = tone === 'base' ? C.faint : tone === 'target' ? C.caution : C.cost;
    doc.lineWidth(0.75).strokeColor(c).dash(2, { space: 2 });
    doc
      .moveTo(m.at, plot.y)
      .lineTo(m.at, plot.y + plot.height)
      .stroke()
      .undash();
    doc
      .fontSize(6.5)
      .fillColor(c)
      .text(m.label, m.at + 2, plot.y + 2 + m.row * 8, { lineBreak: false });
  }

  const { start, segments } = monotoneCubic(g.line);
  if (start) {
    doc.lineWidth(1.5).strokeColor(colour).lineJoin('round');
    doc.moveTo(start.x, start.y);
    for (const s of segments) doc.bezierCurveTo(s.c1.x, s.c1.y, s.c2.x, s.c2.y, s.to.x, s.to.y);
    doc.stroke();
  }
  doc.restore();
}
