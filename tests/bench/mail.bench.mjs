// `npm run bench:mail`: renders the findings e-mail and the signed PDF for an inspection with 500
// findings and 50 photos and sends it to an SMTP fake; prints the time, the PDF's size and the
// ratio to rendering the same list as plain JSON in the same run. Goal: ≤ 3 s and ≤ 10 MB.
// The data is built in memory (no database or object store): this measures rendering and sending.
import { randomUUID } from 'node:crypto';
import { createRequire } from 'node:module';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const require = createRequire(resolve(ROOT, 'server/package.json'));
const sharp = require('sharp');
const nodemailer = require('nodemailer');
const { SMTPServer } = require('smtp-server');
const { DEFAULT_ORGANISATION_SETTINGS } = await import(resolve(ROOT, 'shared/dist/index.js'));
const { renderReportPdf } = await import(resolve(ROOT, 'server/dist/reports/report-pdf.js'));
const { renderReportMail } = await import(resolve(ROOT, 'server/dist/mail/report-mail.layout.js'));

const FINDINGS = 500;
const PHOTOS = 50;
const now = new Date();
const bands = [['High', 20, 5, 4], ['Medium', 8, 4, 2], ['Low', 3, 3, 1]];

async function thumbnail(i) {
  // A noisy 320 × 240 JPEG like a phone's thumbnail (noise does not compress: a fair worst case).
  const raw = Buffer.alloc(320 * 240 * 3);
  for (let p = 0; p < raw.length; p++) raw[p] = (p * 7919 + i * 104729) % 251;
  return sharp(raw, { raw: { width: 320, height: 240, channels: 3 } }).jpeg({ quality: 70 }).toBuffer();
}

const findings = Array.from({ length: FINDINGS }, (_, i) => {
  const [band, score, severity, likelihood] = bands[i % 3];
  return {
    row: {
      id: randomUUID(), itemName: `Item ${i + 1}: loose fitting`, elevation: ['North', 'East', 'South'][i % 3], lift: 1 + (i % 8), bay: 1 + (i % 12),
      heightM: 2 + (i % 8) * 2, riskBand: band, riskScore: score, severity, likelihood, state: 'open', dueAt: null,
      notes: i % 5 === 0 ? 'Left near the edge of the working platform beside the loading bay; '.repeat(3) : '',
      estimate: { impactEnergyJ: 40 + i },
    },
    assignee: null,
    photos: i < PHOTOS ? [{ id: randomUUID() }] : [],
  };
});
const data = {
  inspection: { id: randomUUID(), startedAt: now, finishedAt: now, signedAt: now, reportFor: 'Sample Client Ltd', location: 'North elevation', equipment: 'Independent scaffold', mattersGivingRisk: 'Many loose items', actionTaken: 'Zone closed', furtherAction: 'Clear all lifts', reporterName: 'A. Inspector', reporterPosition: 'Scaffold inspector', signature: 'M 20 150 C 80 20, 140 20, 200 120 L 560 90', inspectorId: randomUUID(), reason: 'scheduled', tagStatus: 'limited', restriction: 'Lift 3, bays 1–2: no materials stored', accessTagsChanged: true },
  scaffold: { reference: 'B-1', description: 'Benchmark scaffold', status: 'limited' },
  site: { id: randomUUID(), name: 'Benchmark site', address: '1 Sample Row', clientName: 'Sample Client Ltd', clientAddress: '2 Sample Row', clientContactEmail: null, reportRecipients: [] },
  organisation: { id: randomUUID(), name: 'Sample Org', settings: DEFAULT_ORGANISATION_SETTINGS },
  inspector: { id: randomUUID(), name: 'A. Inspector', email: 'inspector@example.test', position: 'Scaffold inspector' },
  controlChecks: [{ control: 'toe-boards', result: 'fail', note: 'Missing' }],
  findings,
};
const photos = new Map();
for (let i = 0; i < PHOTOS; i++) photos.set(findings[i].row.id, { id: findings[i].photos[0].id, findingId: findings[i].row.id, jpeg: await thumbnail(i) });

let received = 0;
const smtp = new SMTPServer({ authOptional: true, disabledCommands: ['STARTTLS'], logger: false, size: 100 * 1024 * 1024, onData(stream, _s, cb) { stream.on('data', (c) => (received += c.length)); stream.on('end', () => cb()); } });
const port = await new Promise((ok) => smtp.listen(0, '127.0.0.1', () => ok(smtp.server.address().port)));
const transport = nodemailer.createTransport({ host: '127.0.0.1', port, secure: false, ignoreTLS: true });

// Warm-up (fonts, JIT), then measured runs.
await renderReportPdf(data, photos);
const RUNS = 3;
let pdfMs = 0, mailMs = 0, pdfBytes = 0;
const t0 = performance.now();
for (let r = 0; r < RUNS; r++) {
  const a = performance.now();
  const pdf = await renderReportPdf(data, photos);
  const mail = renderReportMail(data, photos, 'http://127.0.0.1:3000/inspections/x');
  const b = performance.now();
  await transport.sendMail({ from: 'bench@plummet.test', to: 'manager@example.test', subject: mail.subject, text: mail.text, html: mail.html,
    attachments: [{ filename: 'report.pdf', content: pdf, contentType: 'application/pdf' }, ...mail.images.map((i) => ({ content: i.jpeg, cid: i.cid, contentType: 'image/jpeg' }))] });
  pdfMs += b - a;
  mailMs += performance.now() - b;
  pdfBytes = pdf.length;
}
const totalMs = (performance.now() - t0) / RUNS;
const j0 = performance.now();
const JSON_RUNS = 20;
let jsonBytes = 0;
for (let r = 0; r < JSON_RUNS; r++) jsonBytes = JSON.stringify(findings.map((f) => f.row)).length;
const jsonMs = (performance.now() - j0) / JSON_RUNS;

console.log(`mail benchmark: ${FINDINGS} findings, ${PHOTOS} photos, mean of ${RUNS} runs`);
console.log(`  render PDF + e-mail     ${(pdfMs / RUNS).toFixed(0)} ms`);
console.log(`  send to the SMTP fake   ${(mailMs / RUNS).toFixed(0)} ms (${(received / RUNS / 1024 / 1024).toFixed(2)} MB on the wire per message)`);
console.log(`  total                   ${totalMs.toFixed(0)} ms   (goal ≤ 3000 ms: ${totalMs <= 3000 ? 'met' : 'NOT met'})`);
console.log(`  PDF size                ${(pdfBytes / 1024 / 1024).toFixed(2)} MB   (goal ≤ 10 MB: ${pdfBytes <= 10 * 1024 * 1024 ? 'met' : 'NOT met'})`);
console.log(`  baseline: same list as plain JSON ${jsonMs.toFixed(2)} ms (${(jsonBytes / 1024).toFixed(0)} KiB); ratio ${(totalMs / jsonMs).toFixed(0)}×`);
transport.close();
await new Promise((r) => smtp.close(r));
