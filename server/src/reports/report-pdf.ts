import { CAUTION_TEXT, CONTROL_LABELS, type Control, scaffoldStatusWords } from '@plummet/shared';
import PDFDocument from 'pdfkit';
import { byRisk, type ReportData } from './report-data.js';
import { reportFont } from './report-fonts.js';
import { dateTime, findingFacts } from './report-format.js';
import type { ReportPhoto } from './report-photos.js';
import { outcomeLines } from './report-outcome.js';
import { schedule7Fields } from './schedule7.js';

const MARGIN = 50;
/** The phone's signature pad draws in a 600 × 200 box (SignaturePad.tsx). */
const SIGNATURE_BOX = { width: 600, height: 200 };
const BAND_COLOURS: Record<string, string> = { High: '#8a1c1c', Medium: '#8a5a00', Low: '#2f5d3a' };

export function reportTitle(): string {
  // Plummet records the falling-object part of a scaffold inspection only.
  return 'Scaffold inspection report: falling objects';
}

/** The signed inspection report as a PDF (A4, Open Sans, numbered pages, caution on every page). */
export function renderReportPdf(data: ReportData, photos: Map<string, ReportPhoto>): Promise<Buffer> {
  const units = data.organisation.settings.defaultUnits;
  const tz = data.organisation.settings.timeZone;
  const doc = new PDFDocument({ size: 'A4', margin: MARGIN, bufferPages: true, info: { Title: reportTitle(), Author: data.organisation.name, Creator: 'Plummet' } });
  // Parsed fonts shared across reports (pdfkit takes a fontkit font; its types know only paths and buffers).
  for (const name of ['regular', 'semibold', 'bold'] as const) doc.registerFont(name, reportFont(name) as unknown as string);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const width = doc.page.width - 2 * MARGIN;
  /** A heading stays on the page of what follows it: `following` is the height, pt, that must fit below it. */
  const heading = (text: string, following = 80) => {
    if (doc.y + 40 + following > doc.page.height - MARGIN - 30) doc.addPage();
    doc.moveDown(0.6).font('bold').fontSize(13).fillColor('#111').text(text, MARGIN, doc.y, { width });
    doc.moveDown(0.3);
  };
  const field = (label: string, value: string) => {
    doc.font('semibold').fontSize(9).fillColor('#333').text(label, { width });
    doc.font('regular').fontSize(10).fillColor('#000').text(value || '–', { width });
    doc.moveDown(0.35);
  };

  doc.font('bold').fontSize(18).text(reportTitle(), { width });
  doc.font('regular').fontSize(10).fillColor('#333').text(`${data.organisation.name} · ${data.site.name} · scaffold ${data.scaffold.reference}`, { width });
  doc.text(`Scaffold tag status at the time of the report: ${scaffoldStatusWords(data.scaffold.status)}`, { width });
  doc.fillColor('#000');

  heading('Outcome');
  for (const [label, value] of outcomeLines(data.inspection)) field(label, value);

  heading('Report particulars (Work at Height Regulations 2005, reg. 12 and Schedule 7)');
  for (const [label, value] of schedule7Fields(data)) field(label, value);

  heading('Control checks');
  if (data.controlChecks.length === 0) doc.font('regular').fontSize(10).text('No control checks were recorded.', { width });
  for (const c of data.controlChecks) {
    const result = c.result === 'pass' ? 'in place' : c.result === 'fail' ? 'FAILED' : 'not applicable';
    doc.font('semibold').fontSize(10).text(`${CONTROL_LABELS[c.control as Control] ?? c.control}: `, { continued: true }).font('regular').text(`${result}${c.note ? ` – ${c.note}` : ''}`, { width });
  }

  const list = [...data.findings].sort(byRisk);
  const first = list[0];
  heading(`Findings, highest risk first (${list.length})`, first && photos.get(first.row.id) ? 125 : 70);
  if (list.length === 0) doc.font('regular').fontSize(10).text('No falling-object findings were recorded in this inspection.', { width });
  list.forEach((f, index) => {
    const photo = photos.get(f.row.id);
    const blockHeight = photo ? 125 : 70;
    if (doc.y + blockHeight > doc.page.height - MARGIN - 30) doc.addPage();
    const top = doc.y;
    const textWidth = photo ? width - 120 : width;
    doc.font('bold').fontSize(11).fillColor(BAND_COLOURS[f.row.riskBand] ?? '#000').text(`${index + 1}. ${f.row.riskBand} – ${f.row.itemName}`, MARGIN, top, { width: textWidth });
    doc.fillColor('#000');
    // Three lines of facts per finding (few text runs: a 500-finding report stays quick to lay out).
    const facts = findingFacts(f, units, tz).map(([label, value]) => `${label}: ${value}`);
    doc.font('regular').fontSize(9);
    for (const line of [facts[0], facts.slice(1, 5).join(' · '), facts.slice(5).join(' · ')]) doc.text(line, MARGIN, doc.y, { width: textWidth });
    if (f.row.notes) doc.font('regular').fontSize(9).text(`Note: ${f.row.notes}`, MARGIN, doc.y, { width: textWidth });
    if (photo) {
      try {
        doc.image(photo.jpeg, MARGIN + width - 110, top, { fit: [110, 110] });
      } catch {
        doc.font('regular').fontSize(8).text('(photo could not be read)', MARGIN + width - 110, top, { width: 110 });
      }
      doc.y = Math.max(doc.y, top + 115);
    }
    doc.x = MARGIN;
    doc.moveDown(0.6);
  });

  heading('Signature');
  field('Signed', data.inspection.signedAt ? dateTime(data.inspection.signedAt, tz) : 'not signed');
  if (data.inspection.signature) {
    if (doc.y + 80 > doc.page.height - MARGIN - 30) doc.addPage();
    const scale = 180 / SIGNATURE_BOX.width;
    const top = doc.y;
    doc.save().rect(MARGIN, top, 180, 60).lineWidth(0.5).stroke('#999');
    try {
      doc.translate(MARGIN, top).scale(scale).path(data.inspection.signature).lineWidth(2.5).stroke('#000');
    } catch {
      /* an unreadable path leaves the box empty rather than failing the report */
    }
    doc.restore();
    doc.y = top + 70;
  }

  const pages = doc.bufferedPageRange();
  for (let i = 0; i < pages.count; i++) {
    doc.switchToPage(pages.start + i);
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc.font('regular').fontSize(7).fillColor('#444');
    doc.text(CAUTION_TEXT, MARGIN, doc.page.height - 42, { width: width - 70, lineBreak: true });
    doc.text(`Page ${i + 1} of ${pages.count}`, MARGIN + width - 60, doc.page.height - 42, { width: 60, align: 'right' });
    doc.page.margins.bottom = bottom;
  }
  doc.end();
  return done;
}
