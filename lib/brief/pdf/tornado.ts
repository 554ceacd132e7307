// The tornado (rank correlation of each input with a total) drawn with pdfkit primitives.
import type PDFKit from 'pdfkit';
import { tornadoGeometry, type Box } from '../chart-geometry';
import type { DriverBrief } from '../build';
import { PDF_COLOURS as C } from './palette';
import { pdfText } from './text';
import { KIND_LABEL } from '../wording';

export function drawTornado(doc: PDFKit.PDFDocument, drivers: DriverBrief[], box: Box): void {
  const g = tornadoGeometry(
    drivers.map((d) => ({
      label: d.kind ? `${d.name} (${KIND_LABEL[d.kind].toLowerCase()})` : d.name,
      value: d.rankCorrelation,
    })),
    box,
    190,
  );
  doc.save();
  doc.font('Helvetica').fontSize(6.5);
  doc.lineWidth(0.5).strokeColor(C.rule);
  for (const t of g.ticks)
    doc
      .moveTo(t.at, g.plot.y)
      .lineTo(t.at, g.plot.y + g.plot.height)
      .stroke();
  doc.fillColor(C.faint);
  for (const t of g.ticks)
    doc.text(t.value.toFixed(2), t.at - 15, g.plot.y + g.plot.height + 4, {
      width: 30,
      align: 'center',
      lineBreak: false,
    });

  for (const bar of g.bars) {
    doc.rect(bar.x, bar.y, Math.max(0.5, bar.width), bar.height).fill(bar.value < 0 ? C.time : C.cost);
    doc.fontSize(7).fillColor(C.ink);
    doc.text(pdfText(bar.label), box.x, bar.y + bar.height / 2 - 3.5, {
      width: 184,
      align: 'right',
      lineBreak: false,
      ellipsis: true,
      height: 9,
    });
  }
  doc
    .lineWidth(0.75)
    .strokeColor(C.soft)
    .moveTo(g.zero, g.plot.y)
    .lineTo(g.zero, g.plot.y + g.plot.height)
    .stroke();
  doc.restore();
}
